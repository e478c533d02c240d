/**
 * The live mapping draft as a Yjs document — the contract between the editor and the collab server.
 *
 * Shape (nothing else may exist at the top level; the server refuses updates that add anything):
 *
 *   doc.getMap('beads')    bead id → Y.Map { name: string, type: string | null, centre: CentreRule,
 *                          measured?: { kind: 'logP' | 'deltaG', value: number, source: string } | null }
 *   doc.getMap('atoms')    atom index as a decimal string ("0", "17") → plain object { [beadId]: weight }
 *   doc.getMap('settings') optional; { partitionBasis?: 'fragment' | 'atoms', exclusions?: 0…6,
 *                          residue?: 1–3 letters or digits (upper case; the exports' residue name) }
 *   doc.getMap('bonded')   optional; term key ("angle:b1,b2,b3") → plain object BondedParams
 *                          (src/shared/bonded-terms.ts: function, value, k, multiplicity, constraint, omit)
 *   doc.getMap('proposal') optional; the open automatic proposal shown as ghosts, not mapping data
 *                          (src/shared/proposal-doc.ts; docToMapping never reads it)
 *
 * `measured` is a modeller's measured or literature partition value for the bead with its source; it
 * wins over both estimates in suggestions and exports (limits: MEASURED_LIMITS, a source of 1 to
 * MEASURED_SOURCE_MAX characters). It is one plain object, always replaced whole, so a value and its
 * source never come from two different people. `partitionBasis` picks which estimate suggestions use
 * for beads without a measured value (absent means 'fragment').
 *
 * Why this shape:
 * - An atom's membership is ONE map entry whose value is a plain object, always replaced whole (never
 *   patched). Two people assigning the same atom at once therefore write the same key, and Yjs' map
 *   conflict rule (the write of the higher client id wins, identically on every peer) leaves the atom
 *   in exactly one bead everywhere. An atom sits in two beads only when someone shares it on purpose
 *   (`shareAtom`), i.e. writes one object naming both beads.
 * - Bead properties are a nested Y.Map so a rename and a type change by two people both survive.
 * - Atom indices are the chemistry core's heavy-atom indices (see src/shared/chem.ts); hydrogens follow
 *   their heavy atom and never appear here.
 * - Deleting a bead also removes it from every atom entry. An atom entry may still name a bead that a
 *   concurrent edit deleted; such dangling names are ignored by `docToMapping` and cleaned up by the
 *   next edit of that atom.
 *
 * Weights lie in (0, 1]; 1 means "wholly in this bead". Sums other than 1 are allowed in the document
 * (someone is mid-edit) and reported by the chemistry core's checks, not refused.
 *
 * A bonded term is one plain object replaced whole, like an atom entry: a value and its force constant
 * never come from two different people. Its key names bead ids, so a rename keeps it; a term whose beads
 * no longer form it stays stored (unlisted) and comes back when they do.
 *
 * Every helper below runs in one `doc.transact` so an edit is one undo step and one network update.
 * Pass an `origin` (e.g. the editor's UndoManager tracked origin) when you need one.
 */
import * as Y from 'yjs';
import type { CentreRule, Mapping, MappingBead, MeasuredPartition, PartitionBasis } from './chem';
import { MEASURED_LIMITS, MEASURED_SOURCE_MAX, PARTITION_BASES, measuredProblem } from './partition-input';
import { TERM_LIMITS, type BondedParams } from './bonded-terms';

export const BEADS = 'beads';
export const ATOMS = 'atoms';
export const SETTINGS = 'settings';
export const BONDED = 'bonded';
/** A term key names a kind and up to four bead ids. */
export const TERM_KEY_MAX = 12 + 4 * 65;
export const BEAD_KEYS = ['name', 'type', 'centre', 'measured'] as const;
export const SETTING_KEYS = ['partitionBasis', 'exclusions', 'residue'] as const;
/** A residue name every export can write as it is: the PDB's resName has three columns (18–20). */
export const RESIDUE_NAME = /^[A-Z0-9]{1,3}$/;
export { MEASURED_LIMITS, MEASURED_SOURCE_MAX, PARTITION_BASES, measuredProblem };
export const CENTRE_RULES: readonly CentreRule[] = ['mass', 'geometry', 'geometry-heavy'];
export const BEAD_NAME_MAX = 40;
export const BEAD_TYPE_MAX = 40;
export const BEAD_ID_MAX = 64;

export type AtomEntry = Record<string, number>;
export interface BeadProps {
  name: string;
  type: string | null;
  centre: CentreRule;
  measured?: MeasuredPartition | null;
}

export const beadsOf = (doc: Y.Doc) => doc.getMap<Y.Map<unknown>>(BEADS);
export const atomsOf = (doc: Y.Doc) => doc.getMap<AtomEntry>(ATOMS);
export const settingsOf = (doc: Y.Doc) => doc.getMap<unknown>(SETTINGS);
export const bondedOf = (doc: Y.Doc) => doc.getMap<BondedParams>(BONDED);

/** The exclusion count as the draft holds it (undefined when never set). */
export function readExclusions(doc: Y.Doc): number | undefined {
  if (!doc.share.has(SETTINGS)) return undefined;
  const v = settingsOf(doc).get('exclusions');
  return typeof v === 'number' && Number.isInteger(v) && v >= TERM_LIMITS.exclusions.min && v <= TERM_LIMITS.exclusions.max ? v : undefined;
}

/** The molecule's residue name as the draft holds it (undefined when never set). */
export function readResidue(doc: Y.Doc): string | undefined {
  if (!doc.share.has(SETTINGS)) return undefined;
  const v = settingsOf(doc).get('residue');
  return typeof v === 'string' && RESIDUE_NAME.test(v) ? v : undefined;
}

/** Sets (or with null clears) the residue name, as one transaction. */
export function setResidue(doc: Y.Doc, residue: string | null, origin?: unknown): void {
  doc.transact(() => {
    if (residue === null) settingsOf(doc).delete('residue');
    else settingsOf(doc).set('residue', residue);
  }, origin);
}

/** The stored bonded terms by key (empty when none). */
export function readBonded(doc: Y.Doc): Record<string, BondedParams> {
  const out: Record<string, BondedParams> = {};
  if (doc.share.has(BONDED)) bondedOf(doc).forEach((p, key) => void (out[key] = { ...p }));
  return out;
}

/**
 * Sets bonded terms (key → params; null deletes the entry) and, when given, the exclusion count
 * (null clears it), as one transaction. Callers check the params first (bondedParamsProblem).
 */
export function setBonded(doc: Y.Doc, terms: Readonly<Record<string, BondedParams | null>>, exclusions?: number | null, origin?: unknown): void {
  doc.transact(() => {
    for (const [key, p] of Object.entries(terms)) {
      if (p === null) bondedOf(doc).delete(key);
      else bondedOf(doc).set(key, { ...p });
    }
    if (exclusions === null) settingsOf(doc).delete('exclusions');
    else if (exclusions !== undefined) settingsOf(doc).set('exclusions', exclusions);
  }, origin);
}

/** The mapping's partition basis as the draft holds it (undefined when never set). */
export function readPartitionBasis(doc: Y.Doc): PartitionBasis | undefined {
  if (!doc.share.has(SETTINGS)) return undefined;
  const v = settingsOf(doc).get('partitionBasis');
  return PARTITION_BASES.includes(v as PartitionBasis) ? (v as PartitionBasis) : undefined;
}

/** A fresh bead id: short, random, unlikely to collide between peers. */
export function newBeadId(): string {
  const bytes = new Uint8Array(8);
  globalThis.crypto.getRandomValues(bytes);
  return `b${Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('')}`;
}

export function readBead(doc: Y.Doc, id: string): BeadProps | null {
  const m = beadsOf(doc).get(id);
  if (!(m instanceof Y.Map)) return null;
  const measured = m.get('measured');
  return {
    name: String(m.get('name') ?? ''),
    type: (m.get('type') as string | null | undefined) ?? null,
    centre: (m.get('centre') as CentreRule) ?? 'mass',
    measured: measured && measuredProblem(measured) === null ? (measured as MeasuredPartition) : null,
  };
}

/** The draft in the chemistry core's input form. Beads ordered by their lowest atom, then id. */
export function docToMapping(doc: Y.Doc): Mapping {
  const byId = new Map<string, MappingBead>();
  beadsOf(doc).forEach((m, id) => {
    const p = readBead(doc, id);
    if (!p || !(m instanceof Y.Map)) return;
    byId.set(id, { id, name: p.name, ...(p.type ? { type: p.type } : {}), centre: p.centre, atoms: [], ...(p.measured ? { measured: { ...p.measured } } : {}) });
  });
  atomsOf(doc).forEach((entry, key) => {
    for (const [beadId, weight] of Object.entries(entry ?? {})) byId.get(beadId)?.atoms.push({ index: Number(key), weight });
  });
  const beads = [...byId.values()];
  for (const b of beads) b.atoms.sort((x, y) => x.index - y.index);
  const first = (b: MappingBead) => b.atoms[0]?.index ?? Number.MAX_SAFE_INTEGER;
  beads.sort((a, b) => first(a) - first(b) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const partitionBasis = readPartitionBasis(doc);
  const bonded = readBonded(doc);
  const exclusions = readExclusions(doc);
  const residue = readResidue(doc);
  return {
    beads,
    ...(partitionBasis ? { partitionBasis } : {}),
    ...(Object.keys(bonded).length > 0 ? { bonded } : {}),
    ...(exclusions !== undefined ? { exclusions } : {}),
    ...(residue !== undefined ? { residue } : {}),
  };
}

/** Writes a whole mapping into an empty (or to-be-replaced) draft, e.g. to seed or copy a mapping. */
export function mappingToDoc(doc: Y.Doc, mapping: Mapping, origin?: unknown): void {
  doc.transact(() => {
    beadsOf(doc).clear();
    atomsOf(doc).clear();
    if (mapping.partitionBasis) settingsOf(doc).set('partitionBasis', mapping.partitionBasis);
    else if (doc.share.has(SETTINGS)) settingsOf(doc).delete('partitionBasis');
    if (mapping.exclusions !== undefined) settingsOf(doc).set('exclusions', mapping.exclusions);
    else if (doc.share.has(SETTINGS)) settingsOf(doc).delete('exclusions');
    if (mapping.residue !== undefined) settingsOf(doc).set('residue', mapping.residue);
    else if (doc.share.has(SETTINGS)) settingsOf(doc).delete('residue');
    if (doc.share.has(BONDED) || mapping.bonded) {
      bondedOf(doc).clear();
      for (const [key, p] of Object.entries(mapping.bonded ?? {})) bondedOf(doc).set(key, { ...p });
    }
    const atoms = new Map<number, AtomEntry>();
    for (const b of mapping.beads) {
      putBead(doc, b.id, { name: b.name, type: b.type ?? null, centre: b.centre, measured: b.measured ?? null });
      for (const a of b.atoms) atoms.set(a.index, { ...atoms.get(a.index), [b.id]: a.weight });
    }
    for (const [index, entry] of atoms) atomsOf(doc).set(String(index), entry);
  }, origin);
}

function putBead(doc: Y.Doc, id: string, p: BeadProps): void {
  const m = new Y.Map<unknown>();
  m.set('name', p.name);
  m.set('type', p.type);
  m.set('centre', p.centre);
  if (p.measured) m.set('measured', { ...p.measured });
  beadsOf(doc).set(id, m);
}

/** Atom → bead ids that currently hold it (only beads that exist). */
export function beadsOfAtom(doc: Y.Doc, index: number): string[] {
  const entry = atomsOf(doc).get(String(index)) ?? {};
  return Object.keys(entry).filter((id) => beadsOf(doc).has(id));
}

export function atomsOfBead(doc: Y.Doc, beadId: string): number[] {
  const out: number[] = [];
  atomsOf(doc).forEach((entry, key) => {
    if (entry && beadId in entry) out.push(Number(key));
  });
  return out.sort((a, b) => a - b);
}

/** A bead name not yet used: B1, B2, … */
export function nextBeadName(doc: Y.Doc): string {
  const used = new Set<string>();
  beadsOf(doc).forEach((_m, id) => used.add(readBead(doc, id)?.name ?? ''));
  let n = 1;
  while (used.has(`B${n}`)) n++;
  return `B${n}`;
}

export interface CreateBeadOptions {
  id?: string;
  name?: string;
  type?: string | null;
  centre?: CentreRule;
}

/** Makes a bead of the given atoms; each atom leaves whatever bead held it. Returns the new id. */
export function createBead(doc: Y.Doc, atoms: number[], opts: CreateBeadOptions = {}, origin?: unknown): string {
  const id = opts.id ?? newBeadId();
  doc.transact(() => {
    putBead(doc, id, { name: opts.name ?? nextBeadName(doc), type: opts.type ?? null, centre: opts.centre ?? 'mass' });
    for (const a of atoms) atomsOf(doc).set(String(a), { [id]: 1 });
  }, origin);
  return id;
}

/** Moves atoms wholly into an existing bead (they leave their previous beads). */
export function assignAtoms(doc: Y.Doc, beadId: string, atoms: number[], origin?: unknown): void {
  if (!beadsOf(doc).has(beadId)) throw new Error(`No bead ${beadId}.`);
  doc.transact(() => {
    for (const a of atoms) atomsOf(doc).set(String(a), { [beadId]: 1 });
  }, origin);
}

/** Takes atoms out of one bead (or out of every bead when `beadId` is omitted). */
export function removeAtoms(doc: Y.Doc, atoms: number[], beadId?: string, origin?: unknown): void {
  doc.transact(() => {
    for (const a of atoms) {
      const key = String(a);
      const entry = atomsOf(doc).get(key);
      if (!entry) continue;
      const rest = beadId === undefined ? {} : withoutKey(entry, beadId);
      if (Object.keys(rest).length === 0) atomsOf(doc).delete(key);
      else atomsOf(doc).set(key, rest);
    }
  }, origin);
}

/**
 * Shares one atom between beads with the given weights, e.g. { b1: 0.5, b2: 0.5 }. The whole entry is
 * replaced, so the atom leaves any bead not named.
 */
export function shareAtom(doc: Y.Doc, atom: number, weights: AtomEntry, origin?: unknown): void {
  for (const [id, w] of Object.entries(weights)) {
    if (!beadsOf(doc).has(id)) throw new Error(`No bead ${id}.`);
    if (!(w > 0 && w <= 1)) throw new Error(`A weight lies in (0, 1]; got ${w}.`);
  }
  doc.transact(() => atomsOf(doc).set(String(atom), { ...weights }), origin);
}

/** Merges `others` into `into`: their atoms join it (weights added, capped at 1), they are deleted. */
export function mergeBeads(doc: Y.Doc, into: string, others: string[], origin?: unknown): void {
  const gone = new Set(others.filter((id) => id !== into));
  doc.transact(() => {
    atomsOf(doc).forEach((entry, key) => {
      if (!entry || !Object.keys(entry).some((id) => gone.has(id))) return;
      const next: AtomEntry = {};
      for (const [id, w] of Object.entries(entry)) {
        const target = gone.has(id) ? into : id;
        next[target] = Math.min(1, (next[target] ?? 0) + w);
      }
      atomsOf(doc).set(key, next);
    });
    for (const id of gone) beadsOf(doc).delete(id);
  }, origin);
}

/** Splits the given atoms out of a bead into a new bead (same type and centre rule). Returns its id. */
export function splitBead(doc: Y.Doc, beadId: string, atoms: number[], opts: CreateBeadOptions = {}, origin?: unknown): string {
  const from = readBead(doc, beadId);
  if (!from) throw new Error(`No bead ${beadId}.`);
  const id = opts.id ?? newBeadId();
  doc.transact(() => {
    putBead(doc, id, { name: opts.name ?? nextBeadName(doc), type: opts.type ?? from.type, centre: opts.centre ?? from.centre });
    for (const a of atoms) {
      const entry = atomsOf(doc).get(String(a));
      if (!entry || !(beadId in entry)) continue;
      const next = withoutKey(entry, beadId);
      next[id] = entry[beadId];
      atomsOf(doc).set(String(a), next);
    }
  }, origin);
  return id;
}

export function renameBead(doc: Y.Doc, beadId: string, name: string, origin?: unknown): void {
  setProp(doc, beadId, 'name', name, origin);
}

export function setType(doc: Y.Doc, beadId: string, type: string | null, origin?: unknown): void {
  setProp(doc, beadId, 'type', type, origin);
}

export function setCentre(doc: Y.Doc, beadId: string, centre: CentreRule, origin?: unknown): void {
  setProp(doc, beadId, 'centre', centre, origin);
}

/** Sets (or with null clears) a bead's measured or literature partition value; refuses one outside the limits. */
export function setMeasured(doc: Y.Doc, beadId: string, measured: MeasuredPartition | null, origin?: unknown): void {
  if (measured !== null) {
    const problem = measuredProblem(measured);
    if (problem) throw new Error(problem);
  }
  setProp(doc, beadId, 'measured', measured === null ? null : { kind: measured.kind, value: measured.value, source: measured.source.trim() }, origin);
}

/** Chooses the estimate that type suggestions use for beads without a measured value. */
export function setPartitionBasis(doc: Y.Doc, basis: PartitionBasis, origin?: unknown): void {
  if (!PARTITION_BASES.includes(basis)) throw new Error(`The partition basis is ${PARTITION_BASES.join(' or ')}.`);
  doc.transact(() => settingsOf(doc).set('partitionBasis', basis), origin);
}

/** Deletes a bead and takes it out of every atom entry. */
export function deleteBead(doc: Y.Doc, beadId: string, origin?: unknown): void {
  doc.transact(() => {
    atomsOf(doc).forEach((entry, key) => {
      if (!entry || !(beadId in entry)) return;
      const rest = withoutKey(entry, beadId);
      if (Object.keys(rest).length === 0) atomsOf(doc).delete(key);
      else atomsOf(doc).set(key, rest);
    });
    beadsOf(doc).delete(beadId);
  }, origin);
}

function setProp(doc: Y.Doc, beadId: string, key: (typeof BEAD_KEYS)[number], value: unknown, origin?: unknown): void {
  const m = beadsOf(doc).get(beadId);
  if (!(m instanceof Y.Map)) throw new Error(`No bead ${beadId}.`);
  doc.transact(() => m.set(key, value), origin);
}

function withoutKey(entry: AtomEntry, key: string): AtomEntry {
  const rest = { ...entry };
  delete rest[key];
  return rest;
}
