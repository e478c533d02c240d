/**
 * Proposal ghosts: an automatic proposal shown over the drawing for everyone in the mapping until the
 * person who asked for it accepts or dismisses its beads (docs/collaboration.md, "Proposals").
 *
 * Where the ghosts live: in the proposer's awareness state (`proposal` beside `selection` and
 * `pointer`), not in the draft document. A proposal is one person's suggestion, not part of the
 * mapping: kept out of the draft it never reaches the stored update log, the versions or the server's
 * document checks, and it disappears with the proposer's session. Accepting writes ordinary beads into
 * the draft in one transaction with the editor's own origin, so it is one undo step for the person who
 * accepted. Remote states are untrusted input: read defensively, bad entries dropped.
 */
import type * as Y from 'yjs';
import { atomsOfBead, beadsOf, beadsOfAtom, createBead, deleteBead, nextBeadName, readBead } from '../../../shared/mapping-doc';
import { PROPOSAL_SCOPES, type Proposal, type ProposalScope } from '../../../shared/proposals';

export interface GhostBead {
  key: string;
  name: string;
  atoms: number[];
  type: string | null;
  reason: string;
}

export interface GhostProposal {
  scope: ProposalScope;
  beads: GhostBead[];
}

export interface PeerGhosts {
  clientId: number;
  isLocal: boolean;
  user: { name: string; colour: string };
  proposal: GhostProposal;
}

const MAX_GHOSTS = 5_000;

/** The best proposal as ghosts, each bead with a key of its own. */
export function ghostsFrom(proposal: Proposal, scope: ProposalScope): GhostProposal {
  return { scope, beads: proposal.beads.map((b, i) => ({ key: `g${i + 1}`, name: b.name, atoms: [...b.atoms], type: b.type, reason: b.reason })) };
}

export function readProposal(value: unknown, atomCount: number): GhostProposal | null {
  if (!value || typeof value !== 'object') return null;
  const v = value as { scope?: unknown; beads?: unknown };
  if (!PROPOSAL_SCOPES.includes(v.scope as ProposalScope) || !Array.isArray(v.beads)) return null;
  const beads: GhostBead[] = [];
  for (const raw of v.beads.slice(0, MAX_GHOSTS)) {
    if (!raw || typeof raw !== 'object') continue;
    const b = raw as Record<string, unknown>;
    const atoms = Array.isArray(b.atoms) ? b.atoms.filter((a): a is number => Number.isInteger(a) && a >= 0 && a < atomCount) : [];
    if (typeof b.key !== 'string' || typeof b.name !== 'string' || atoms.length === 0) continue;
    beads.push({ key: b.key.slice(0, 40), name: b.name.slice(0, 40), atoms, type: typeof b.type === 'string' ? b.type.slice(0, 40) : null, reason: typeof b.reason === 'string' ? b.reason.slice(0, 200) : '' });
  }
  return beads.length ? { scope: v.scope as ProposalScope, beads } : null;
}

/** Everyone's proposals now on show, the local person's first. */
export function readGhosts(states: ReadonlyMap<number, Record<string, unknown>>, localClientId: number, atomCount: number): PeerGhosts[] {
  const out: PeerGhosts[] = [];
  for (const [clientId, state] of states) {
    const proposal = readProposal(state.proposal, atomCount);
    const user = state.user as { name?: unknown; colour?: unknown } | undefined;
    if (!proposal || !user || typeof user.name !== 'string') continue;
    const colour = typeof user.colour === 'string' && /^#[0-9a-f]{6}$/i.test(user.colour) ? user.colour : '#555555';
    out.push({ clientId, isLocal: clientId === localClientId, user: { name: user.name.slice(0, 80), colour }, proposal });
  }
  return out.sort((a, b) => Number(b.isLocal) - Number(a.isLocal) || a.clientId - b.clientId);
}

/**
 * Writes ghost beads into the draft as one transaction: each becomes a bead (its name, or the next
 * free one when the draft uses that name meanwhile; its suggested type), its atoms leave whatever bead
 * held them, and beads left empty by that are deleted. Returns the new bead ids.
 */
export function acceptGhosts(doc: Y.Doc, ghosts: readonly GhostBead[], origin: unknown): string[] {
  const ids: string[] = [];
  doc.transact(() => {
    const touched = new Set(ghosts.flatMap((g) => g.atoms.flatMap((a) => beadsOfAtom(doc, a))));
    for (const g of ghosts) {
      const used = new Set<string>();
      beadsOf(doc).forEach((_m, id) => used.add(readBead(doc, id)?.name ?? ''));
      ids.push(createBead(doc, g.atoms, { name: used.has(g.name) ? nextBeadName(doc) : g.name, type: g.type }, origin));
    }
    for (const id of touched) if (atomsOfBead(doc, id).length === 0) deleteBead(doc, id, origin);
  }, origin);
  return ids;
}

/** The proposal without the given ghost beads (null when none is left). */
export function withoutGhosts(proposal: GhostProposal, keys: ReadonlySet<string>): GhostProposal | null {
  const beads = proposal.beads.filter((b) => !keys.has(b.key));
  return beads.length ? { ...proposal, beads } : null;
}
