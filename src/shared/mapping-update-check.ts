/**
 * Checks every struct an incoming Yjs update added to the document, while it is being applied (Yjs'
 * `beforeObserverCalls`, when overwritten content is still in the store), so the update is decoded
 * once. The checks of mapping-doc-check.ts look at what the update changed in the visible document;
 * an update also carries content that never becomes visible there: a value overwritten or deleted by
 * the same update. Structs whose dependencies the receiver lacks stay pending (the caller refuses
 * those), and structs the document already had are not integrated — and not passed on either, since
 * what is stored and relayed is the document's own encoding of what this update added. This bounds
 * all of it to what a draft can hold:
 *   - content is a Y.Map (a bead), a plain value, or a deleted range; no list, text, binary, embed,
 *     format or sub-document content;
 *   - a plain value is null, text of at most the longest bead field, a whole number 0–6 (the
 *     exclusion count), an atom entry (≤ 16 bead ids of ≤ BEAD_ID_MAX characters → finite numbers),
 *     a valid measured value, valid bonded-term params (of any kind; the key's kind is checked
 *     once the value lands) or a proposal entry (proposal-doc.ts: a ghost's optional weights are one
 *     per atom, each in (0, 1]; its atoms are bounded by the atom count once it lands);
 *   - a top-level name is "beads", "atoms", "settings", "bonded" or "proposal"; a key directly in
 *     "beads" is a bead id, in "atoms" an atom index below the atom count, in "settings" a setting, in
 *     "bonded" a term key, in "proposal" 'meta' or 'g:<key>'; a key in a nested map is a bead field;
 *     list positions (no key) are refused.
 * A struct whose parent comes from its left neighbour (an overwrite) carries no key: its value is
 * still bounded as above, and where it lands is checked once it is applied.
 */
import * as Y from 'yjs';
import { ATOMS, BEAD_ID_MAX, BEAD_KEYS, BEAD_NAME_MAX, BEAD_TYPE_MAX, BEADS, BONDED, SETTING_KEYS, SETTINGS, TERM_KEY_MAX, measuredProblem } from './mapping-doc';
import { TERM_KINDS, TERM_LIMITS, bondedParamsProblem, parseTermKey } from './bonded-terms';
import type { DocProblem } from './mapping-doc-check';
import { GHOST_PREFIX, PROPOSAL, ghostProblem, metaProblem, proposalEntryProblem } from './proposal-doc';

const TEXT_MAX = Math.max(BEAD_NAME_MAX, BEAD_TYPE_MAX);
const INDEX = /^(0|[1-9][0-9]{0,8})$/;
export const MAX_BEADS_PER_ATOM = 16;

const refuse = (code: DocProblem['code'], path: string, message: string): DocProblem => ({ code, path, message });

function plainValue(value: unknown): boolean {
  if (value === null) return true;
  if (typeof value === 'string') return value.length <= TEXT_MAX;
  if (typeof value === 'number') return Number.isInteger(value) && value >= TERM_LIMITS.exclusions.min && value <= TERM_LIMITS.exclusions.max;
  if (typeof value !== 'object' || Array.isArray(value) || value instanceof Uint8Array) return false;
  if (measuredProblem(value) === null) return true;
  if (TERM_KINDS.some((kind) => bondedParamsProblem(kind, value) === null)) return true;
  if (metaProblem(value) === null || ghostProblem(value) === null) return true;
  const entries = Object.entries(value);
  return entries.length <= MAX_BEADS_PER_ATOM && entries.every(([k, w]) => k.length > 0 && k.length <= BEAD_ID_MAX && typeof w === 'number' && Number.isFinite(w));
}

/** An atom key is a decimal atom index below the atom count (shared with mapping-doc-check.ts). */
export function atomKeyProblem(key: string, atomCount: number): DocProblem | null {
  const path = `${ATOMS}.${key.slice(0, 80)}`;
  if (!INDEX.test(key)) return refuse('wrong_type', path, `Atom keys are atom indices written as decimal numbers; "${key.slice(0, 80)}" is not.`);
  if (Number(key) >= atomCount) return refuse('atom_out_of_range', path, `Atom ${Number(key) + 1} (index ${key}) does not exist: the molecule has atoms 1 to ${atomCount}.`);
  return null;
}

function checkKey(item: Y.Item, atomCount: number): DocProblem | null {
  // Integrated, an item's parent is a type (a top-level one known by its name); decoded but not
  // integrated (pending), a top-level parent is its name, a nested one an ID, and null means
  // "positioned by its left neighbour".
  const raw = item.parent as unknown;
  if (raw === null) return null;
  const parent = typeof raw === 'string' ? raw : raw instanceof Y.AbstractType && raw._item === null ? Y.findRootTypeKey(raw) : null;
  const parentSub = item.parentSub;
  if (parent !== null && parent !== BEADS && parent !== ATOMS && parent !== SETTINGS && parent !== BONDED && parent !== PROPOSAL) {
    return refuse('unknown_key', parent.slice(0, 80), `The draft has only "${BEADS}", "${ATOMS}", "${SETTINGS}", "${BONDED}" and "${PROPOSAL}" at the top; "${parent.slice(0, 40)}" is not allowed.`);
  }
  const where = parent ?? 'beads.…';
  if (parentSub === null) return refuse('wrong_type', where, 'The draft holds no list content.');
  const key = parentSub.slice(0, 80);
  if (parent === BEADS) return parentSub.length <= BEAD_ID_MAX ? null : refuse('wrong_type', `${BEADS}.${key}…`, `A bead id has 1 to ${BEAD_ID_MAX} characters.`);
  if (parent === ATOMS) return atomKeyProblem(parentSub, atomCount);
  if (parent === BONDED) return parentSub.length <= TERM_KEY_MAX && parseTermKey(parentSub) ? null : refuse('unknown_key', `${BONDED}.${key}`, 'A bonded term key is "kind:id,id…" with the kind\'s number of bead ids.');
  if (parent === PROPOSAL) {
    const why = proposalEntryProblem(parentSub, undefined);
    return why ? refuse('unknown_key', `${PROPOSAL}.${key}`, why) : null;
  }
  if (parent === SETTINGS) {
    return (SETTING_KEYS as readonly string[]).includes(parentSub) ? null : refuse('unknown_key', `${SETTINGS}.${key}`, `The settings hold only ${SETTING_KEYS.join(', ')}; "${key}" is not allowed.`);
  }
  return (BEAD_KEYS as readonly string[]).includes(parentSub) ? null : refuse('unknown_key', `${where}.${key}`, `A bead has only ${BEAD_KEYS.join(', ')}; "${key}" is not allowed.`);
}

function checkContent(item: Y.Item): DocProblem | null {
  const path = item.parentSub ? `…${item.parentSub.slice(0, 80)}` : 'update';
  const content = item.content;
  if (content instanceof Y.ContentDeleted) return null;
  if (content instanceof Y.ContentType) return content.type instanceof Y.Map ? null : refuse('wrong_type', path, 'Only beads may hold nested maps; no lists or text.');
  if (content instanceof Y.ContentAny) {
    const bad = content.arr.find((v) => !plainValue(v));
    if (bad === undefined) return null;
    // A bead's measured value says what is wrong with it, as the visible-document check would.
    if (item.parentSub === 'measured' && typeof bad === 'object' && bad !== null) return refuse('wrong_type', path, measuredProblem(bad) ?? 'The measured value is not valid.');
    // So does a proposed bead (e.g. weights that are not one per atom in (0, 1]).
    if (item.parentSub?.startsWith(GHOST_PREFIX) && typeof bad === 'object' && bad !== null) return refuse('wrong_type', path, ghostProblem(bad) ?? 'The proposed bead is not valid.');
    return refuse('wrong_type', path, `A value is null, text of at most ${TEXT_MAX} characters, or an atom entry of at most ${MAX_BEADS_PER_ATOM} bead ids → weight.`);
  }
  return refuse('wrong_type', path, `The draft holds no ${content.constructor.name.replace(/^Content/, '').toLowerCase()} content.`);
}

/**
 * The first problem among the structs of an update as decoded, without applying it (for structs a
 * document left pending: they were never integrated, so never checked). Throws when `update` is not
 * a Yjs update.
 */
export function checkUpdateStructs(update: Uint8Array, atomCount: number, format: 'v1' | 'v2' = 'v1'): DocProblem | null {
  for (const struct of (format === 'v1' ? Y.decodeUpdate(update) : Y.decodeUpdateV2(update)).structs) {
    if (!(struct instanceof Y.Item)) continue; // GC and skip ranges carry nothing
    const problem = checkKey(struct, atomCount) ?? checkContent(struct);
    if (problem) return problem;
  }
  return null;
}

/**
 * The first problem among the structs `tr` integrated, or null. Call it from `beforeObserverCalls`:
 * after that, Yjs replaces deleted content, and overwritten values would go unseen.
 */
export function checkIntegratedStructs(tr: Y.Transaction, atomCount: number): DocProblem | null {
  for (const [client, after] of tr.afterState) {
    const before = tr.beforeState.get(client) ?? 0;
    if (after === before) continue;
    const structs = tr.doc.store.clients.get(client) ?? [];
    for (let i = Y.findIndexSS(structs, before); i < structs.length; i++) {
      const struct = structs[i];
      if (!(struct instanceof Y.Item)) continue; // GC carries nothing
      const problem = checkKey(struct, atomCount) ?? checkContent(struct);
      if (problem) return problem;
    }
  }
  return null;
}
