import type { BondedParams, TermKind } from '../../src/shared/bonded-terms';
import { junctionOf, junctionTerms, parseUnitRef, unitRef } from '../../src/shared/repeat-chain';
import { missingValues, termKey, topologyTermIds } from '../../src/shared/bonded-terms';
import type { Vec3 } from '../../src/shared/chem';
import { unprocessable } from '../http/errors';
import type { ExportSource } from './export-source';

// The CG model an engine export is written from, engine-neutral: molecule types (the molecule, and
// each free ion of a salt as its own type), their beads (type, mass, charge, position in nm) and the
// bonded terms of the version exported, in GROMACS units (bonded-terms.ts). Everything an engine
// cannot run without is checked here first, and an export that lacks any of it is refused with each
// problem named (422 model_incomplete): error-level checks of the evaluation, beads without a type,
// bonded terms without values, no exclusion count, no 3D coordinates. Nothing is filled in silently.

export interface CgBead {
  name: string;
  /** 1-based residue (repeat unit) number within the molecule type. */
  residue: number;
  type: string;
  mass: number;
  charge: number;
  /** Centre in nm. */
  xyz: Vec3;
}

export interface CgTerm {
  kind: TermKind;
  /** 0-based bead indices within the molecule type. */
  beads: number[];
  params: BondedParams;
}

export interface CgMoleculeType {
  /** The GROMACS moleculetype name (not limited to five characters: only .gro columns are). */
  name: string;
  /** Residue name in .itp and .gro (five columns in .gro): the mapping's residue name, else from the molecule's name. */
  residue: string;
  beads: CgBead[];
  terms: CgTerm[];
  /** Pairs excluded beyond nrexcl: every pair of a ring whose bonds are all constraints (a rigid ring). */
  exclusions: [number, number][];
  nrexcl: number;
}

export interface CgModel {
  types: CgMoleculeType[];
}

export interface Problem {
  check: string;
  message: string;
}

const NM_PER_ANGSTROM = 0.1;

/** Up to five characters of letters and digits: a residue name that fits the .gro columns. */
export const shortName = (name: string, fallback: string) => name.replace(/[^A-Za-z0-9]/g, '').slice(0, 5) || fallback;
/**
 * A GROMACS moleculetype name: one token (letters, digits, _ and -; other runs become _), up to 40
 * characters. GROMACS reads it as a whitespace-free string of any length; 40 keeps files readable.
 */
export const typeName = (name: string, fallback: string) => name.replace(/[^A-Za-z0-9_-]+/g, '_').replace(/^_+|_+$/g, '').slice(0, 40) || fallback;

/** Å: from the atom next to the first attachment point to the second attachment point. */
function chainShift(s: ExportSource): Vec3 {
  const [a1, a2] = s.model.attachmentPoints ?? [];
  const bond = s.model.bonds.find((b) => b.a === a1 || b.b === a1);
  const head = bond ? (bond.a === a1 ? bond.b : bond.a) : -1;
  const p = s.xyz?.[a2];
  const q = s.xyz?.[head];
  if (!p || !q) throw unprocessable('model_incomplete', 'The repeat unit has no 3D coordinates to lay a chain out from.', { problems: [{ check: 'no_3d_coordinates', message: 'No 3D coordinates.' }] });
  return [p[0] - q[0], p[1] - q[1], p[2] - q[2]];
}

/** `centres` (bead id → nm) replaces the 3D coordinates' bead centres, e.g. an analysis's mean structure. */
export function buildCgModel(s: ExportSource, units = 1, centres?: ReadonlyMap<string, Vec3>): CgModel {
  const problems: Problem[] = [];
  const junction = units > 1 ? junctionOf(s.model, s.draft.beads) : null;
  if (units > 1 && !junction) problems.push({ check: 'no_junction', message: 'The atoms next to the attachment points are not both in beads, so units cannot be joined.' });
  const junctionIds = junction && s.evaluation ? junctionTerms(s.evaluation.topology, s.draft.beads.map((b) => b.id), junction) : [];
  const evaluation = s.evaluation;
  if (!evaluation) throw unprocessable('model_incomplete', 'This state has no evaluation, so no masses, charges or topology to export.', { problems: [{ check: 'not_evaluated', message: 'No evaluation.' }] });
  for (const c of evaluation.checks) if (c.severity === 'error') problems.push({ check: c.code, message: c.message });
  const byId = new Map(evaluation.beads.map((b) => [b.id, b]));
  const stored = s.draft.bonded ?? {};
  const reported = new Set(problems.filter((p) => p.check === 'bonded_value_missing').map((p) => p.message));
  for (const { kind, ids } of [...topologyTermIds(evaluation.topology), ...junctionIds]) {
    const p = stored[termKey(kind, ids)];
    const missing = p ? missingValues({ kind, ...p }) : ['value', 'force constant'];
    const label = ids.map((ref) => { const { id, unit } = parseUnitRef(ref); return unitRef(byId.get(id)?.name ?? id, unit); }).join('–');
    const message = p ? `${kind} ${label}: no ${missing.join(', no ')}.` : `${kind} ${label}: not set.`;
    if (missing.length > 0 && !reported.has(message)) problems.push({ check: 'bonded_value_missing', message });
  }
  if (s.draft.exclusions === undefined && !problems.some((p) => p.check === 'exclusions_missing')) problems.push({ check: 'exclusions_missing', message: 'No exclusion count set.' });
  for (const b of s.draft.beads) {
    if (!b.type) problems.push({ check: 'bead_type_missing', message: `Bead ${b.name} has no bead type.` });
    if (centres) {
      if (!centres.has(b.id)) problems.push({ check: 'analysis_bead_missing', message: `Bead ${b.name} is not in the analysis's structure (the analysis applied a state of the mapping without it).` });
    } else if (!byId.get(b.id)?.centre) problems.push({ check: 'no_3d_coordinates', message: `Bead ${b.name} has no 3D centre (the molecule has no 3D coordinates yet).` });
  }
  if (problems.length > 0) {
    throw unprocessable('model_incomplete', `This state cannot be exported to an engine yet: ${problems.map((p) => p.message).join(' ')}`, { problems });
  }

  // A bead made only of a free ion's atom is a molecule type of its own.
  const ionAtoms = new Set((s.model.components ?? []).filter((c) => c.freeIon).flatMap((c) => c.atoms));
  const isIon = (id: string) => {
    const bead = s.draft.beads.find((b) => b.id === id)!;
    return bead.atoms.length > 0 && bead.atoms.every((a) => ionAtoms.has(a.index));
  };
  // Unit u of a chain is the unit moved by u × shift: the vector from the head atom to the second
  // attachment point, where the next unit's head atom sits (a straight chain; the run relaxes it).
  const shift = units > 1 ? chainShift(s) : [0, 0, 0];
  const cg = (id: string, u = 0): CgBead => {
    const e = byId.get(id)!;
    const bead = s.draft.beads.find((b) => b.id === id)!;
    const given = centres?.get(id);
    if (given) return { name: bead.name, residue: u + 1, type: bead.type!, mass: e.mass, charge: e.charge, xyz: [given[0], given[1], given[2]] };
    const [x, y, z] = e.centre!;
    return { name: bead.name, residue: u + 1, type: bead.type!, mass: e.mass, charge: e.charge, xyz: [(x + u * shift[0]) * NM_PER_ANGSTROM, (y + u * shift[1]) * NM_PER_ANGSTROM, (z + u * shift[2]) * NM_PER_ANGSTROM] };
  };
  const mainIds = s.draft.beads.map((b) => b.id).filter((id) => !isIon(id));
  const per = mainIds.length;
  const index = new Map(mainIds.map((id, i) => [id, i]));
  /** Index of a reference ("A", "A+") in unit u, or undefined past the chain's end. */
  const at = (ref: string, u: number) => {
    const { id, unit } = parseUnitRef(ref);
    const i = index.get(id);
    return i === undefined || u + unit >= units ? undefined : (u + unit) * per + i;
  };
  const terms: CgTerm[] = [];
  const add = (kind: TermKind, ids: string[], u: number, params: BondedParams) => {
    const beads = ids.map((r) => at(r, u));
    if (beads.every((b): b is number => b !== undefined) && !params.omit) terms.push({ kind, beads, params });
  };
  for (let u = 0; u < units; u++) {
    for (const { kind, ids } of topologyTermIds(evaluation.topology)) add(kind, ids, u, stored[termKey(kind, ids)]!);
    for (const [key, params] of Object.entries(stored)) if (key.startsWith('improper:')) add('improper', key.slice('improper:'.length).split(','), u, params);
    for (const { kind, ids } of junctionIds) add(kind, ids, u, stored[termKey(kind, ids)]!);
  }
  const constrained = new Set(terms.filter((t) => t.kind === 'bond' && t.params.constraint).map((t) => [...t.beads].sort((a, b) => a - b).join(',')));
  const exclusions: [number, number][] = [];
  for (const ring of evaluation.topology.rings.flatMap((ring) => Array.from({ length: units }, (_, u) => ring.map((id) => at(id, u))))) {
    const r = ring.filter((i): i is number => i !== undefined);
    if (r.length !== ring.length) continue;
    const rigid = r.every((a, i) => constrained.has([a, r[(i + 1) % r.length]].sort((x, y) => x - y).join(',')));
    if (!rigid) continue;
    for (let i = 0; i < r.length; i++) for (let j = i + 1; j < r.length; j++) exclusions.push([Math.min(r[i], r[j]), Math.max(r[i], r[j])]);
  }
  const types: CgMoleculeType[] = [];
  if (mainIds.length > 0) types.push({ name: typeName(s.moleculeName, 'MOL'), residue: s.draft.residue ?? shortName(s.moleculeName, 'MOL'), beads: Array.from({ length: units }, (_, u) => mainIds.map((id) => cg(id, u))).flat(), terms, exclusions, nrexcl: s.draft.exclusions! });
  for (const b of s.draft.beads.filter((x) => isIon(x.id))) types.push({ name: typeName(b.name, 'ION'), residue: shortName(b.name, 'ION'), beads: [cg(b.id)], terms: [], exclusions: [], nrexcl: 1 });
  // Molecule type names must differ.
  const seen = new Map<string, number>();
  for (const t of types) {
    const n = seen.get(t.name) ?? 0;
    seen.set(t.name, n + 1);
    if (n > 0) t.name = `${t.name}_${n + 1}`;
  }
  return { types };
}
