/**
 * Checks that a mapping draft (see mapping-doc.ts) has exactly the documented shape.
 *
 * The collab server applies each incoming update to a shadow copy with `applyChecked`, which looks only
 * at what the update touched (Yjs reports the changed keys of every type in the transaction), so
 * checking costs the size of the edit, not of the document. `checkDoc` walks everything (tests, loads).
 * Before that, `applyChecked` refuses an update larger than the caller's limit; while applying, it
 * bounds every struct the update added, visible or not (mapping-update-check.ts); after it, an update
 * that left structs or deletions pending (their dependencies never arrived) is refused: the checks
 * would not have seen them. `applyCheckedUpdate` also gives the document's own encoding of what the
 * update added (Yjs' 'update' event): that, not the bytes received, is what the server stores and
 * relays, so nothing unchecked (a struct the document already had, sent again with other content)
 * travels on.
 *
 * Refused: anything at the top level but `beads`, `atoms`, `settings`, `bonded` and `proposal`; list content anywhere; a bead
 * that is not a Y.Map of `name` (1–40 characters), `type` (string ≤ 40 or null), `centre` (a centre
 * rule) and optionally `measured` (null or a measured value within MEASURED_LIMITS with a source of
 * 1–300 characters); an atom key that is not a decimal index below the molecule's atom count; an atom
 * value that is not a non-empty plain object of bead id → weight in (0, 1]; a setting other than
 * `partitionBasis` ('fragment' or 'atoms') and `exclusions` (a whole number 0–6); a bonded entry whose
 * key is not a term key or whose value is not valid params for its kind (bonded-terms.ts); a proposal
 * entry that is not the open proposal's meta or a proposed bead of this molecule's atoms, or more than
 * GHOSTS_MAX of them (proposal-doc.ts).
 */
import * as Y from 'yjs';
import { ATOMS, BEAD_ID_MAX, BEAD_KEYS, BEAD_NAME_MAX, BEAD_TYPE_MAX, BEADS, BONDED, CENTRE_RULES, PARTITION_BASES, RESIDUE_NAME, SETTING_KEYS, SETTINGS, TERM_KEY_MAX, atomsOf, beadsOf, bondedOf, measuredProblem, settingsOf } from './mapping-doc';
import { TERM_LIMITS, bondedParamsProblem, parseTermKey } from './bonded-terms';
import { GHOSTS_MAX, PROPOSAL, proposalEntryProblem, proposalOf } from './proposal-doc';
import { MAX_BEADS_PER_ATOM, atomKeyProblem, checkIntegratedStructs, checkUpdateStructs } from './mapping-update-check';

export type DocProblemCode = 'unknown_key' | 'wrong_type' | 'atom_out_of_range' | 'weight_out_of_range' | 'too_large' | 'missing_dependencies';

export interface DocProblem {
  code: DocProblemCode;
  message: string;
  /** Where in the document, e.g. "atoms.17" or "beads.b12ab.name". */
  path: string;
}

const problem = (code: DocProblemCode, path: string, message: string): DocProblem => ({ code, path, message });

export function checkBead(id: string, value: unknown): DocProblem | null {
  const path = `beads.${id}`;
  if (value === undefined) return null; // deleted
  if (id.length === 0 || id.length > BEAD_ID_MAX) return problem('wrong_type', path, `A bead id has 1 to ${BEAD_ID_MAX} characters.`);
  if (!(value instanceof Y.Map)) return problem('wrong_type', path, 'A bead must be a Y.Map.');
  if ((value as unknown as { _start: unknown })._start !== null) return problem('wrong_type', path, 'A bead holds no list content.');
  for (const key of value.keys()) {
    if (!(BEAD_KEYS as readonly string[]).includes(key)) return problem('unknown_key', `${path}.${key}`, `A bead has only ${BEAD_KEYS.join(', ')}; "${key}" is not allowed.`);
  }
  const name = value.get('name');
  if (typeof name !== 'string' || name.trim().length === 0 || name.length > BEAD_NAME_MAX) {
    return problem('wrong_type', `${path}.name`, `A bead name is text of 1 to ${BEAD_NAME_MAX} characters.`);
  }
  const type = value.get('type');
  if (type !== null && (typeof type !== 'string' || type.length > BEAD_TYPE_MAX)) {
    return problem('wrong_type', `${path}.type`, `A bead type is null or text of at most ${BEAD_TYPE_MAX} characters.`);
  }
  const centre = value.get('centre');
  if (!CENTRE_RULES.includes(centre as never)) return problem('wrong_type', `${path}.centre`, `The centre rule is one of ${CENTRE_RULES.join(', ')}.`);
  const measured = value.get('measured');
  if (measured !== undefined && measured !== null) {
    if (measured instanceof Y.AbstractType || measured instanceof Uint8Array) return problem('wrong_type', `${path}.measured`, 'A measured value is a plain object { kind, value, source }.');
    const why = measuredProblem(measured);
    if (why) return problem('wrong_type', `${path}.measured`, why);
  }
  return null;
}

export function checkSetting(key: string, value: unknown): DocProblem | null {
  const path = `${SETTINGS}.${key}`;
  if (!(SETTING_KEYS as readonly string[]).includes(key)) return problem('unknown_key', path, `The settings hold only ${SETTING_KEYS.join(', ')}; "${key}" is not allowed.`);
  if (value === undefined) return null; // deleted
  if (key === 'residue') return typeof value === 'string' && RESIDUE_NAME.test(value) ? null : problem('wrong_type', path, 'The residue name is 1 to 3 upper-case letters or digits.');
  if (key === 'exclusions') {
    const { min, max } = TERM_LIMITS.exclusions;
    return typeof value === 'number' && Number.isInteger(value) && value >= min && value <= max ? null : problem('wrong_type', path, `The exclusion count is a whole number from ${min} to ${max}.`);
  }
  if (!PARTITION_BASES.includes(value as never)) return problem('wrong_type', path, `The partition basis is ${PARTITION_BASES.join(' or ')}.`);
  return null;
}

export function checkBonded(key: string, value: unknown): DocProblem | null {
  const path = `${BONDED}.${key.slice(0, 80)}`;
  const parsed = key.length <= TERM_KEY_MAX ? parseTermKey(key) : null;
  if (!parsed || parsed.ids.some((id) => id.length > BEAD_ID_MAX)) return problem('unknown_key', path, 'A bonded term key is "kind:id,id…" with the kind\'s number of bead ids.');
  if (value === undefined) return null; // deleted
  if (value instanceof Y.AbstractType || value instanceof Uint8Array) return problem('wrong_type', path, 'A bonded term is a plain object.');
  const why = bondedParamsProblem(parsed.kind, value);
  return why ? problem('wrong_type', path, why) : null;
}

export function checkAtom(key: string, value: unknown, atomCount: number): DocProblem | null {
  const path = `atoms.${key}`;
  const keyProblem = atomKeyProblem(key, atomCount);
  if (keyProblem) return keyProblem;
  if (value === undefined) return null; // deleted
  if (typeof value !== 'object' || value === null || Array.isArray(value) || value instanceof Uint8Array || value instanceof Y.AbstractType) {
    return problem('wrong_type', path, 'An atom entry is a plain object of bead id → weight.');
  }
  const entries = Object.entries(value);
  if (entries.length === 0) return problem('wrong_type', path, 'An atom entry names at least one bead; delete the entry to unassign the atom.');
  if (entries.length > MAX_BEADS_PER_ATOM) return problem('wrong_type', path, `An atom is shared by at most ${MAX_BEADS_PER_ATOM} beads.`);
  for (const [beadId, weight] of entries) {
    if (beadId.length === 0 || beadId.length > BEAD_ID_MAX) return problem('wrong_type', `${path}.${beadId}`, `A bead id has 1 to ${BEAD_ID_MAX} characters.`);
    if (typeof weight !== 'number' || !Number.isFinite(weight)) return problem('wrong_type', `${path}.${beadId}`, 'A weight is a number.');
    if (!(weight > 0 && weight <= 1)) return problem('weight_out_of_range', `${path}.${beadId}`, `A weight lies in (0, 1]; got ${weight}.`);
  }
  return null;
}

export function checkProposalEntry(key: string, value: unknown, atomCount: number, size: number): DocProblem | null {
  const path = `${PROPOSAL}.${key.slice(0, 80)}`;
  if (size > GHOSTS_MAX + 1) return problem('too_large', PROPOSAL, `A proposal has at most ${GHOSTS_MAX} beads.`);
  const why = proposalEntryProblem(key, value, atomCount);
  if (!why) return null;
  return problem(value === undefined || why.startsWith('The proposal holds') ? 'unknown_key' : why.includes('atom indices') ? 'atom_out_of_range' : 'wrong_type', path, why);
}

function checkTopLevel(doc: Y.Doc): DocProblem | null {
  for (const [name, type] of doc.share) {
    if (name !== BEADS && name !== ATOMS && name !== SETTINGS && name !== BONDED && name !== PROPOSAL) {
      return problem('unknown_key', name, `The draft has only "${BEADS}", "${ATOMS}", "${SETTINGS}", "${BONDED}" and "${PROPOSAL}" at the top; "${name}" is not allowed.`);
    }
    if ((type as unknown as { _start: unknown })._start !== null) return problem('wrong_type', name, `"${name}" is a map, not a list.`);
  }
  return null;
}

/** Walks the whole document. */
export function checkDoc(doc: Y.Doc, atomCount: number): DocProblem | null {
  const top = checkTopLevel(doc);
  if (top) return top;
  for (const [id, value] of beadsOf(doc).entries()) {
    const p = checkBead(id, value);
    if (p) return p;
  }
  for (const [key, value] of atomsOf(doc).entries()) {
    const p = checkAtom(key, value, atomCount);
    if (p) return p;
  }
  if (doc.share.has(SETTINGS)) {
    for (const [key, value] of settingsOf(doc).entries()) {
      const p = checkSetting(key, value);
      if (p) return p;
    }
  }
  if (doc.share.has(BONDED)) {
    for (const [key, value] of bondedOf(doc).entries()) {
      const p = checkBonded(key, value);
      if (p) return p;
    }
  }
  if (doc.share.has(PROPOSAL)) {
    const map = proposalOf(doc);
    for (const [key, value] of map.entries()) {
      const p = checkProposalEntry(key, value, atomCount, map.size);
      if (p) return p;
    }
  }
  return null;
}

export interface ApplyOptions {
  origin?: unknown;
  /** Refuse updates larger than this many bytes. */
  maxBytes?: number;
}

/** Whether the document holds structs or deletions whose dependencies it never received. */
export const hasPending = (doc: Y.Doc): boolean => doc.store.pendingStructs !== null || doc.store.pendingDs !== null;

/**
 * Applies `update` to `doc` and checks it and what it changed. On a problem, `doc` may already hold
 * the bad update: the caller must throw this copy away and rebuild it from the accepted state.
 * Throws when `update` is not a Yjs update.
 */
export function applyChecked(doc: Y.Doc, update: Uint8Array, atomCount: number, options: ApplyOptions = {}): DocProblem | null {
  return applyCheckedUpdate(doc, update, atomCount, options).problem;
}

/**
 * As `applyChecked`; when accepted, also what the update added to `doc`, encoded by `doc` (null when
 * it added nothing: everything in it was known already).
 */
export function applyCheckedUpdate(doc: Y.Doc, update: Uint8Array, atomCount: number, { origin, maxBytes }: ApplyOptions = {}): { problem: DocProblem | null; added: Uint8Array | null } {
  const refused = (p: DocProblem) => ({ problem: p, added: null });
  if (maxBytes !== undefined && update.length > maxBytes) return refused(problem('too_large', 'update', `An update has at most ${maxBytes} bytes; this one has ${update.length}.`));
  // Typed access first: a top-level type that an update created is generic until getMap() converts
  // it, and the transaction would then name the generic one.
  const beads = beadsOf(doc) as Y.Map<unknown>;
  const atoms = atomsOf(doc) as Y.Map<unknown>;
  const settings = settingsOf(doc);
  const bonded = bondedOf(doc) as Y.Map<unknown>;
  const proposal = proposalOf(doc);
  const transactions: Y.Transaction[] = [];
  let structural: DocProblem | null = null;
  const added: Uint8Array[] = [];
  const inspect = (tr: Y.Transaction) => {
    transactions.push(tr);
    structural ??= checkIntegratedStructs(tr, atomCount);
  };
  const keep = (u: Uint8Array) => void added.push(u);
  doc.on('beforeObserverCalls', inspect);
  doc.on('update', keep);
  try {
    Y.applyUpdate(doc, update, origin);
  } finally {
    doc.off('beforeObserverCalls', inspect);
    doc.off('update', keep);
  }
  if (structural) return refused(structural);
  if (hasPending(doc)) {
    // Refused either way; the pending structs' own problem, if any, says more (the cold path only;
    // Yjs keeps pending structs in its v2 encoding).
    const pending = doc.store.pendingStructs ? checkUpdateStructs(doc.store.pendingStructs.update, atomCount, 'v2') : null;
    return refused(pending ?? problem('missing_dependencies', 'update', 'The update depends on changes the server never received; reload the draft.'));
  }
  const top = checkTopLevel(doc);
  if (top) return refused(top);
  for (const tr of transactions) {
    for (const [changed, keys] of tr.changed) {
      const type = changed as unknown as Y.AbstractType<unknown>;
      if (keys.has(null)) return refused(problem('wrong_type', pathOf(type), 'The draft holds no list content.'));
      for (const key of keys as Set<string>) {
        const p =
          type === (beads as unknown) ? checkBead(key, beads.get(key))
          : type === (atoms as unknown) ? checkAtom(key, atoms.get(key), atomCount)
          : type === (settings as unknown) ? checkSetting(key, settings.get(key))
          : type === (bonded as unknown) ? checkBonded(key, bonded.get(key))
          : type === (proposal as unknown) ? checkProposalEntry(key, proposal.get(key), atomCount, proposal.size)
          : nestedBead(type, beads);
        if (p) return refused(p);
      }
    }
  }
  return { problem: null, added: added.length === 0 ? null : added.length === 1 ? added[0] : Y.mergeUpdates(added) };
}

function nestedBead(type: Y.AbstractType<unknown>, beads: Y.Map<unknown>): DocProblem | null {
  const item = type._item;
  if (item && item.parent === beads && typeof item.parentSub === 'string') return checkBead(item.parentSub, beads.get(item.parentSub));
  return problem('wrong_type', pathOf(type), 'Only beads may hold nested maps.');
}

function pathOf(type: Y.AbstractType<unknown>): string {
  const sub = type._item?.parentSub;
  return sub ? `…${sub}` : 'document';
}
