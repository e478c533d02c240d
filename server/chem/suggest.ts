/**
 * Bead type suggestion from a bead type library.
 *
 * Among the library types of the bead's size class and (rounded) charge, the first whose
 * [deltaGMin, deltaGMax] range holds the bead's ΔG_OW; if none holds it, the one whose range is nearest
 * (distance from ΔG to the range's closer end). No type of that size class and charge: no suggestion.
 */
import type { BeadType, SizeClass } from '../../src/shared/chem';

export interface Suggestion {
  name: string;
  fits: boolean;
}

export function suggestType(library: readonly BeadType[], sizeClass: SizeClass | null, charge: number, deltaG: number): Suggestion | null {
  if (sizeClass === null || !Number.isFinite(deltaG)) return null;
  const q = Math.round(charge);
  let best: BeadType | null = null;
  let bestDistance = Infinity;
  for (const t of library) {
    if (t.sizeClass !== sizeClass || t.charge !== q) continue;
    const distance = deltaG < t.deltaGMin ? t.deltaGMin - deltaG : deltaG > t.deltaGMax ? deltaG - t.deltaGMax : 0;
    if (distance === 0) return { name: t.name, fits: true };
    if (distance < bestDistance) [best, bestDistance] = [t, distance];
  }
  return best ? { name: best.name, fits: false } : null;
}
