/**
 * Bead size classes and resolution limits.
 *
 * Common practice, no source: a bead stands for two to four heavy atoms; its size class is named by
 * that number (4, 3 or 2 heavy atoms per bead), from the weighted count rounded at the halves. A mapping's resolution (4:1, 3:1, 2:1) sets the heavy-atom count a bead should
 * have; beads more than one atom above it are flagged as too large, and beads below the smallest class
 * the resolution allows as too small. Shared atoms count with their weight.
 */
import type { Resolution, SizeClass } from '../../src/shared/chem';

export const RESOLUTION_LIMITS: Record<Resolution, { target: number; min: number; max: number }> = {
  '4:1': { target: 4, min: 2, max: 5 },
  '3:1': { target: 3, min: 2, max: 4 },
  '2:1': { target: 2, min: 1, max: 3 },
};

export function sizeClassOf(heavyAtoms: number): SizeClass | null {
  if (heavyAtoms <= 0) return null;
  if (heavyAtoms >= 3.5) return 4;
  if (heavyAtoms >= 2.5) return 3;
  return 2;
}
