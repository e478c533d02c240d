import { z } from 'zod';
import type { Mapping } from './chem';
import { resolution } from './mappings';

// Mapping proposals and transfers (docs/chemistry.md, "Mapping proposals"; docs/api.md).

export const PROPOSAL_SCOPES = ['all', 'unassigned'] as const;
export type ProposalScope = (typeof PROPOSAL_SCOPES)[number];

export const proposalBody = z.strictObject({
  scope: z.enum(PROPOSAL_SCOPES, "The scope is 'all' or 'unassigned'."),
  resolution: resolution.optional(),
});
export type ProposalBody = z.infer<typeof proposalBody>;

export interface ProposedBead {
  name: string;
  /** The molecule's atom indices (0-based, as in the draft). */
  atoms: number[];
  type: string | null;
  reason: string;
}

export interface Proposal {
  beads: ProposedBead[];
  cost: number;
}

export interface ProposalsResponse {
  proposals: Proposal[];
}

/** What became of the source mapping's beads in a transfer. */
export interface TransferReport {
  /** Source beads whose atoms all have a counterpart: carried over under the same name. */
  carried: { name: string; atoms: number[] }[];
  /** Source beads only partly matched: their matched atoms were proposed anew. */
  changed: { name: string; matched: number; total: number }[];
  /** Beads proposed for the atoms no carried bead holds. */
  added: { name: string; atoms: number[] }[];
  /** Atoms of the new molecule with a counterpart in the source molecule (maximum common substructure). */
  matchedAtoms: number;
}

export interface TransferResult {
  draft: Mapping;
  report: TransferReport;
}
