/**
 * Proposals as the API serves them: the partitions of propose.ts with bead names in the draft's
 * naming (B1, B2, … skipping names the draft already uses) and bead types from the library's
 * suggestion for each proposed bead (suggest.ts, through evaluateMapping with the draft's partition
 * basis). A bead that shares atoms with other proposed beads carries their `weights` (aligned with its
 * atoms), and the mapping evaluated for the suggestions holds those weights, so a bead's mass and
 * partition estimate count only its share of each atom. Scope 'unassigned' keeps every atom that
 * already has a bead out of the proposal.
 */
import type { BeadType, Mapping, Molecule, PartitionBasis, Resolution } from '../../src/shared/chem';
import { proposedAtoms, type Proposal, type ProposalScope } from '../../src/shared/proposals';
import { evaluateMapping } from './evaluate';
import { proposePartitions, type ProposedPartition } from './propose';

export interface ProposeMappingOptions {
  resolution: Resolution;
  scope: ProposalScope;
  draft: Mapping;
  library?: BeadType[];
}

export function proposeMapping(molecule: Molecule, o: ProposeMappingOptions): Proposal[] {
  const fixed = o.scope === 'unassigned' ? o.draft.beads.flatMap((b) => b.atoms.map((a) => a.index)) : [];
  const used = o.scope === 'unassigned' ? new Set(o.draft.beads.map((b) => b.name)) : new Set<string>();
  return proposePartitions(molecule, { resolution: o.resolution, fixed }).map((p) => servedProposal(molecule, p, used, o));
}

/** One partition as the API serves it: named after the draft's beads, typed, shared atoms' weights kept. */
export function servedProposal(molecule: Molecule, p: ProposedPartition, used: ReadonlySet<string>, o: Omit<ProposeMappingOptions, 'scope'>): Proposal {
  const names = freeNames(used, p.beads.length);
  const mapping = partitionMapping(p, names, o.draft.partitionBasis);
  const evaluation = evaluateMapping(molecule, mapping, { resolution: o.resolution, ...(o.library ? { library: o.library } : {}) });
  return {
    beads: p.beads.map((b, i) => ({ name: names[i], atoms: b.atoms, ...(b.weights ? { weights: b.weights } : {}), type: evaluation.beads[i].suggestedType, reason: b.reason })),
    cost: p.cost,
  };
}

/** The mapping evaluated for a partition's type suggestions: a shared atom counts by its weight. */
export function partitionMapping(p: ProposedPartition, names: readonly string[], partitionBasis?: PartitionBasis): Mapping {
  return {
    beads: p.beads.map((b, i) => ({ id: `proposal-${i}`, name: names[i], centre: 'mass', atoms: proposedAtoms(b) })),
    ...(partitionBasis ? { partitionBasis } : {}),
  };
}

/** The first `count` names B1, B2, … not in `used`. */
export function freeNames(used: ReadonlySet<string>, count: number): string[] {
  const out: string[] = [];
  for (let n = 1; out.length < count; n++) if (!used.has(`B${n}`)) out.push(`B${n}`);
  return out;
}
