/**
 * The open proposal of a mapping, kept in the live draft's document beside the beads, so it is shown
 * as ghosts to everyone in the mapping, survives a reload (the proposer's included) and can be
 * accepted or dismissed by anyone who may edit the draft (docs/collaboration.md, "Proposals").
 *
 * Shape: `doc.getMap('proposal')`, optional, holding
 *   'meta'     → plain object { id, scope, by: { id, name, colour } }: which proposal is open, for what
 *                scope and by whom;
 *   'g:<key>'  → plain object { p, name, atoms, type, reason }: one proposed bead of the proposal `p`;
 *                a bead that shares atoms with other proposed beads (a symmetric cut, e.g. adamantane) also holds
 *                `weights`, aligned with `atoms`, each in (0, 1] (six keys then; absent: every weight 1).
 * Every value is one plain object, replaced or deleted whole. A new proposal replaces the old one in one
 * transaction (every key deleted, a new meta id); a ghost whose `p` is not the open id (an old one an
 * undo brought back) is not shown. Accepting writes ordinary beads and deletes the accepted ghosts in
 * one transaction (one undo step for the person who accepted; undo brings the ghosts back); dismissing
 * deletes ghosts. An accepted atom of weight 1 leaves every other bead; an accepted share w < 1 joins
 * the shares below 1 the atom already has in other beads while they and w sum to at most 1 (so two
 * ghosts sharing an atom, accepted in either order or together, give it { first: 0.5, second: 0.5 }),
 * and otherwise replaces them (an atom wholly in a hand-made bead leaves that bead). When every ghost is decided, nothing is on show; the small meta entry stays, so that
 * an undo of an earlier accept (which brings back only its own ghosts) still shows them as the open
 * proposal's. A new proposal or "nothing to propose" clears the map.
 *
 * The proposal is not part of the mapping: `docToMapping` never reads it, so versions, their SHA-256,
 * exports and the checks ignore it. The server checks its shape like the rest of the draft
 * (mapping-doc-check.ts); a viewer's socket is read-only, so students see ghosts but cannot decide them.
 */
import * as Y from 'yjs';
import { atomsOf, atomsOfBead, beadsOf, beadsOfAtom, BEAD_NAME_MAX, BEAD_TYPE_MAX, createBead, deleteBead, nextBeadName, readBead, shareAtom, type AtomEntry } from './mapping-doc';
import { PROPOSAL_SCOPES, type Proposal, type ProposalScope } from './proposals';

export const PROPOSAL = 'proposal';
export const PROPOSAL_META = 'meta';
export const GHOST_PREFIX = 'g:';
export const GHOST_KEY_MAX = 40;
export const GHOST_REASON_MAX = 200;
export const GHOST_ATOMS_MAX = 256;
export const PROPOSER_NAME_MAX = 80;
/** Ghost beads of one proposal at most (a proposal for 1,000 heavy atoms at 2:1 has about 500). */
export const GHOSTS_MAX = 5_000;

export interface ProposalMeta {
  id: string;
  scope: ProposalScope;
  by: { id: number; name: string; colour: string };
}

export interface GhostEntry {
  p: string;
  name: string;
  atoms: number[];
  /** Present only when the bead shares atoms: each atom's weight in it, aligned with `atoms`. */
  weights?: number[];
  type: string | null;
  reason: string;
}

export interface GhostBead extends Omit<GhostEntry, 'p'> {
  key: string;
}

export interface OpenProposal {
  meta: ProposalMeta;
  beads: GhostBead[];
}

export const proposalOf = (doc: Y.Doc) => doc.getMap<unknown>(PROPOSAL);

const isPlain = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v) && !(v instanceof Uint8Array) && !(v instanceof Y.AbstractType);
const text = (v: unknown, min: number, max: number) => typeof v === 'string' && v.length >= min && v.length <= max;

/** What is wrong with a meta value, or null. */
export function metaProblem(v: unknown): string | null {
  if (!isPlain(v)) return 'The proposal meta is a plain object { id, scope, by }.';
  const by = v.by as Record<string, unknown> | undefined;
  if (!text(v.id, 1, GHOST_KEY_MAX)) return `A proposal id has 1 to ${GHOST_KEY_MAX} characters.`;
  if (!PROPOSAL_SCOPES.includes(v.scope as ProposalScope)) return "A proposal's scope is 'all' or 'unassigned'.";
  if (!isPlain(by) || !Number.isInteger(by.id) || !text(by.name, 1, PROPOSER_NAME_MAX) || typeof by.colour !== 'string' || !/^#[0-9a-f]{6}$/i.test(by.colour)) {
    return 'The proposer is { id, name, colour }.';
  }
  return Object.keys(v).length === 3 && Object.keys(by).length === 3 ? null : 'The proposal meta holds only id, scope and by { id, name, colour }.';
}

const GHOST_KEYS = ['p', 'name', 'atoms', 'weights', 'type', 'reason'];

/** What is wrong with a ghost bead value, or null (`atomCount` bounds its atoms when known). */
export function ghostProblem(v: unknown, atomCount = Infinity): string | null {
  if (!isPlain(v)) return 'A proposed bead is a plain object { p, name, atoms, type, reason } (with weights when it shares atoms).';
  const keys = Object.keys(v);
  if (keys.length !== ('weights' in v ? 6 : 5) || !keys.every((k) => GHOST_KEYS.includes(k))) return 'A proposed bead holds only p, name, atoms, type and reason, and weights when it shares atoms.';
  if (!text(v.p, 1, GHOST_KEY_MAX)) return `A proposal id has 1 to ${GHOST_KEY_MAX} characters.`;
  if (!text(v.name, 1, BEAD_NAME_MAX)) return `A proposed bead's name has 1 to ${BEAD_NAME_MAX} characters.`;
  if (v.type !== null && !text(v.type, 0, BEAD_TYPE_MAX)) return `A proposed bead's type is null or text of at most ${BEAD_TYPE_MAX} characters.`;
  if (!text(v.reason, 0, GHOST_REASON_MAX)) return `A proposed bead's reason has at most ${GHOST_REASON_MAX} characters.`;
  const atoms = v.atoms;
  if (!Array.isArray(atoms) || atoms.length === 0 || atoms.length > GHOST_ATOMS_MAX) return `A proposed bead has 1 to ${GHOST_ATOMS_MAX} atoms.`;
  if (!atoms.every((a) => Number.isInteger(a) && a >= 0 && a < atomCount)) return 'A proposed bead lists atom indices of this molecule.';
  if (!('weights' in v)) return null;
  const weights = v.weights;
  if (!Array.isArray(weights) || weights.length !== atoms.length) return "A proposed bead's weights are a list as long as its atoms (one weight per atom).";
  if (!weights.every((w) => typeof w === 'number' && Number.isFinite(w) && w > 0 && w <= 1)) return "A proposed bead's weights are numbers greater than 0 and at most 1.";
  return null;
}

/** What is wrong with one entry of the proposal map (value undefined: deleted), or null. */
export function proposalEntryProblem(key: string, value: unknown, atomCount = Infinity): string | null {
  const ghostKey = key.startsWith(GHOST_PREFIX) ? key.slice(GHOST_PREFIX.length) : null;
  if (key !== PROPOSAL_META && (ghostKey === null || ghostKey.length === 0 || ghostKey.length > GHOST_KEY_MAX)) {
    return `The proposal holds "${PROPOSAL_META}" and "${GHOST_PREFIX}<key>" entries only.`;
  }
  if (value === undefined) return null;
  return key === PROPOSAL_META ? metaProblem(value) : ghostProblem(value, atomCount);
}

/** The open proposal, or null; entries of another proposal id and malformed ones are skipped. */
export function readOpenProposal(doc: Y.Doc, atomCount: number): OpenProposal | null {
  if (!doc.share.has(PROPOSAL)) return null;
  const map = proposalOf(doc);
  const meta = map.get(PROPOSAL_META);
  if (metaProblem(meta) !== null) return null;
  const { id } = meta as ProposalMeta;
  const beads: GhostBead[] = [];
  for (const [key, value] of map.entries()) {
    if (!key.startsWith(GHOST_PREFIX) || ghostProblem(value, atomCount) !== null) continue;
    const g = value as GhostEntry;
    if (g.p === id) beads.push({ key: key.slice(GHOST_PREFIX.length), name: g.name, atoms: g.atoms, ...(g.weights ? { weights: g.weights } : {}), type: g.type, reason: g.reason });
  }
  // Map order differs between peers; the proposal's own order (g1, g2 …) is the one people read.
  beads.sort((a, b) => a.key.localeCompare(b.key, 'en', { numeric: true }));
  return beads.length ? { meta: meta as ProposalMeta, beads } : null;
}

/** Puts a proposal on show for everyone, replacing any open one (one transaction). */
export function openProposal(doc: Y.Doc, proposal: Proposal, scope: ProposalScope, by: ProposalMeta['by'], origin?: unknown): string {
  const id = `${by.id}-${doc.clientID.toString(36)}-${Date.now().toString(36)}`.slice(0, GHOST_KEY_MAX);
  doc.transact(() => {
    const map = proposalOf(doc);
    for (const key of [...map.keys()]) map.delete(key);
    map.set(PROPOSAL_META, { id, scope, by: { id: by.id, name: by.name.slice(0, PROPOSER_NAME_MAX), colour: by.colour } } satisfies ProposalMeta);
    proposal.beads.slice(0, GHOSTS_MAX).forEach((b, i) => {
      const weights = b.weights?.slice(0, GHOST_ATOMS_MAX);
      const entry: GhostEntry = {
        p: id,
        name: b.name.slice(0, BEAD_NAME_MAX),
        atoms: b.atoms.slice(0, GHOST_ATOMS_MAX),
        ...(weights ? { weights } : {}),
        type: b.type ? b.type.slice(0, BEAD_TYPE_MAX) : null,
        reason: b.reason.slice(0, GHOST_REASON_MAX),
      };
      map.set(`${GHOST_PREFIX}g${i + 1}`, entry);
    });
  }, origin);
  return id;
}

/** Removes the decided ghosts (the meta entry stays; see the top of this file). */
function dropGhosts(doc: Y.Doc, keys: readonly string[]): void {
  const map = proposalOf(doc);
  for (const key of keys) map.delete(`${GHOST_PREFIX}${key}`);
}

/** Dismisses ghost beads (anyone who may edit; one transaction). */
export function dismissGhosts(doc: Y.Doc, keys: readonly string[], origin?: unknown): void {
  doc.transact(() => dropGhosts(doc, keys), origin);
}

/** Closes the open proposal altogether. */
export function closeProposal(doc: Y.Doc, origin?: unknown): void {
  doc.transact(() => {
    const map = proposalOf(doc);
    for (const key of [...map.keys()]) map.delete(key);
  }, origin);
}

/**
 * Writes ghost beads into the draft and takes them off the proposal, as one transaction: each becomes
 * a bead (its name, or the next free one when the draft uses that name meanwhile; its suggested type).
 * An atom of weight 1 leaves whatever bead held it; an atom the ghost shares (weight w < 1) keeps its
 * shares below 1 in other beads as long as they and w sum to at most 1, and leaves those beads
 * otherwise (see the top of this file). Beads left empty by that are deleted. Returns the new bead ids.
 */
export function acceptGhosts(doc: Y.Doc, ghosts: readonly GhostBead[], origin?: unknown): string[] {
  const ids: string[] = [];
  doc.transact(() => {
    const touched = new Set(ghosts.flatMap((g) => g.atoms.flatMap((a) => beadsOfAtom(doc, a))));
    for (const g of ghosts) {
      const used = new Set<string>();
      beadsOf(doc).forEach((_m, id) => used.add(readBead(doc, id)?.name ?? ''));
      const shared = g.atoms.flatMap((a, k) => (g.weights && g.weights[k] < 1 ? [{ atom: a, weight: g.weights[k] }] : []));
      const whole = g.atoms.filter((_a, k) => !(g.weights && g.weights[k] < 1));
      const id = createBead(doc, whole, { name: used.has(g.name) ? nextBeadName(doc) : g.name, type: g.type }, origin);
      for (const { atom, weight } of shared) shareAtom(doc, atom, withShare(doc, atom, id, weight), origin);
      ids.push(id);
    }
    for (const id of touched) if (atomsOfBead(doc, id).length === 0) deleteBead(doc, id, origin);
    dropGhosts(doc, ghosts.map((g) => g.key));
  }, origin);
  return ids;
}

/** The atom's entry once bead `id` takes the share `weight` < 1 of it (the rule at the top of this file). */
function withShare(doc: Y.Doc, atom: number, id: string, weight: number): AtomEntry {
  const kept: AtomEntry = {};
  let sum = weight;
  for (const [other, w] of Object.entries(atomsOf(doc).get(String(atom)) ?? {})) {
    if (other === id || w >= 1 || !beadsOf(doc).has(other)) continue;
    kept[other] = w;
    sum += w;
  }
  return sum <= 1 + 1e-9 ? { ...kept, [id]: weight } : { [id]: weight };
}
