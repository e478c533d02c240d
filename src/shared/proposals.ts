import { z } from 'zod';
import type { Mapping, MappingAtom } from './chem';
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
  /**
   * Each atom's share in this bead, aligned with `atoms` (each in (0, 1]); present only when the bead
   * shares atoms with other proposed beads (some weight below 1), absent means every weight is 1. Over
   * a whole proposal an atom's weights sum to 1.
   */
  weights?: number[];
  type: string | null;
  reason: string;
}

/** A proposed bead's atoms as the mapping holds them: weight 1 unless the bead shares the atom. */
export function proposedAtoms(b: { atoms: readonly number[]; weights?: readonly number[] }): MappingAtom[] {
  return b.atoms.map((index, k) => ({ index, weight: b.weights?.[k] ?? 1 }));
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
  /** The mapping and state carried over (added by the server; version null = its draft). */
  source?: TransferSource;
}

export interface TransferSource {
  mappingId: number;
  mappingName: string;
  moleculeName: string;
  version: number | null;
  /** True when that version was the source's locked production version. */
  production: boolean;
}

const names = (list: { name: string }[]) => (list.length ? list.map((b) => b.name).join(', ') : 'none');

/**
 * The transfer report in a few lines of text: kept in the new mapping's description so the group can
 * still read where the mapping came from after the report on screen is dismissed.
 */
export function transferSummary(r: TransferReport, atomCount: number, max = 1000): string {
  const s = r.source;
  const from = s ? `Transferred from “${s.mappingName}” of ${s.moleculeName} (${s.version === null ? 'draft' : `version ${s.version}${s.production ? ', production' : ''}`})` : 'Transferred from a related mapping';
  const text = [
    `${from}: ${r.matchedAtoms} of ${atomCount} heavy atoms matched by common substructure.`,
    `Carried over: ${names(r.carried)}.`,
    `Changed (only partly matched, proposed anew): ${r.changed.length ? r.changed.map((c) => `${c.name} (${c.matched} of ${c.total} atoms)`).join(', ') : 'none'}.`,
    `Newly proposed: ${names(r.added)}.`,
  ].join('\n');
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

export interface TransferResult {
  draft: Mapping;
  report: TransferReport;
}
