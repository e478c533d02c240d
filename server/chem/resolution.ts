/**
 * Bead size classes and resolution limits.
 *
 * Common practice, no source: a regular bead stands for about four heavy atoms, a small bead for three,
 * a tiny bead for two. A mapping's resolution (4:1, 3:1, 2:1) sets the heavy-atom count a bead should
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
  if (heavyAtoms >= 3.5) return 'regular';
  if (heavyAtoms >= 2.5) return 'small';
  return 'tiny';
}
