/**
 * Refusals for a mapping that cannot be evaluated against its molecule (ChemError, 422): bead ids
 * duplicated, atom indices outside the molecule or not non-negative integers, weights not in (0, 1],
 * an atom listed twice in one bead, an unknown centre rule, a measured value outside the draft's limits
 * or without a source, an unknown partition basis. Softer problems (weights summing above or
 * below 1, unassigned atoms …) are checks, not refusals (checks.ts).
 */
import type { Mapping } from '../../src/shared/chem';
import { PARTITION_BASES, measuredProblem } from '../../src/shared/partition-input';
import { ChemError } from './errors';

const RULES = new Set(['mass', 'geometry', 'geometry-heavy']);

export function validateMapping(mapping: Mapping, atomCount: number): void {
  if (!mapping || !Array.isArray(mapping.beads)) {
    throw new ChemError('bad_mapping', 'The mapping must have a beads list.');
  }
  if (mapping.partitionBasis !== undefined && !PARTITION_BASES.includes(mapping.partitionBasis)) {
    throw new ChemError('bad_partition_basis', `The partition basis is fragment or atoms; got "${String(mapping.partitionBasis)}".`);
  }
  const ids = new Set<string>();
  mapping.beads.forEach((bead, b) => {
    if (ids.has(bead.id)) {
      throw new ChemError('duplicate_bead_id', `Two beads have the id "${bead.id}".`, { beadId: bead.id });
    }
    ids.add(bead.id);
    if (!RULES.has(bead.centre)) {
      throw new ChemError('bad_centre_rule', `Bead "${bead.id}" has centre "${String(bead.centre)}"; use mass, geometry or geometry-heavy.`, { beadId: bead.id });
    }
    if (bead.measured !== undefined) {
      const why = measuredProblem(bead.measured);
      if (why) throw new ChemError('bad_measured_value', `Bead "${bead.id}": ${why}`, { beadId: bead.id });
    }
    const seen = new Set<number>();
    bead.atoms.forEach(({ index, weight }, k) => {
      if (!Number.isInteger(index) || index < 0) {
        throw new ChemError('bad_atom_index', `Bead "${bead.id}" lists atom index ${index}; indices are whole numbers from 0.`, { beadId: bead.id, bead: b, entry: k, index });
      }
      if (index >= atomCount) {
        throw new ChemError('atom_index_out_of_range', `Bead "${bead.id}" lists atom ${index + 1} (index ${index}), but the molecule has atoms 1 to ${atomCount} (indices 0 to ${atomCount - 1}).`, { beadId: bead.id, index, atomCount });
      }
      if (typeof weight !== 'number' || !Number.isFinite(weight) || weight <= 0 || weight > 1) {
        throw new ChemError('bad_weight', `Bead "${bead.id}" gives atom ${index + 1} weight ${weight}; a weight must be above 0 and at most 1.`, { beadId: bead.id, index, weight });
      }
      if (seen.has(index)) {
        throw new ChemError('duplicate_atom_in_bead', `Bead "${bead.id}" lists atom ${index + 1} twice.`, { beadId: bead.id, index });
      }
      seen.add(index);
    });
  });
}
