/**
 * Proposal ghosts as the editor shows them: the mapping's open proposal (kept in the draft document,
 * src/shared/proposal-doc.ts) with who proposed it and whether that is the person at this screen.
 * One proposal is open per mapping at a time; anyone who may edit the draft accepts or dismisses its
 * beads (docs/collaboration.md, "Proposals"). A ghost may share atoms with other ghosts (a symmetric
 * ring system), so an atom can lie in two ghosts' outlines; nothing here maps an atom to one ghost.
 */
import type * as Y from 'yjs';
import { readOpenProposal, type GhostBead } from '../../../shared/proposal-doc';
import type { ProposalScope } from '../../../shared/proposals';

export type { GhostBead };

export interface GhostProposal {
  scope: ProposalScope;
  beads: GhostBead[];
}

export interface PeerGhosts {
  /** The open proposal's id (a new Propose replaces it). */
  id: string;
  /** Proposed by the person signed in here (from any of their tabs, before or after a reload). */
  isLocal: boolean;
  user: { id: number; name: string; colour: string };
  proposal: GhostProposal;
}

/** The open proposal of the draft as ghosts (none, or one), for the person with `userId`. */
export function readGhosts(doc: Y.Doc, userId: number | null, atomCount: number): PeerGhosts[] {
  const open = readOpenProposal(doc, atomCount);
  if (!open) return [];
  const { meta } = open;
  return [{ id: meta.id, isLocal: meta.by.id === userId, user: meta.by, proposal: { scope: meta.scope, beads: open.beads } }];
}

/** How many of a ghost's atoms it shares (weight below 1) and its size counted by weight. */
export function ghostShares(b: Pick<GhostBead, 'atoms' | 'weights'>): { shared: number; weighted: number } {
  const weights = b.weights ?? [];
  return { shared: weights.filter((w) => w < 1).length, weighted: b.atoms.reduce((s, _a, k) => s + (weights[k] ?? 1), 0) };
}
