/**
 * Bead type suggestion from a bead type library.
 *
 * The bead's charge is rounded half away from zero (−0.5 → −1, +0.5 → +1, so a shared O⁻ and a shared
 * N⁺ behave as mirror images). Among the library types of the bead's size class (heavy atoms per bead)
 * and that charge:
 *  - an ionic bead (net charge not zero) gets the first such type: its type comes from charge and
 *    size, never from a partition value, which does not apply to an ion;
 *  - any other bead gets the first type whose [deltaGMin, deltaGMax] range holds its ΔG_OW; if none
 *    holds it, the one whose range is nearest (distance from ΔG to the range's closer end).
 * No type of that size class and charge, or a neutral bead without a ΔG: no suggestion.
 */
import type { BeadType, SizeClass } from '../../src/shared/chem';

export interface Suggestion {
  name: string;
  fits: boolean;
}

/** Rounds half away from zero (Math.round(−0.5) is −0, Math.round(0.5) is 1: not symmetric). */
export function roundCharge(charge: number): number {
  const r = Math.sign(charge) * Math.round(Math.abs(charge));
  return r === 0 ? 0 : r;
}

export function suggestType(library: readonly BeadType[], sizeClass: SizeClass | null, charge: number, ionic: boolean, deltaG: number | null): Suggestion | null {
  if (sizeClass === null) return null;
  const q = roundCharge(charge);
  const candidates = library.filter((t) => t.heavyAtomsPerBead === sizeClass && t.charge === q);
  if (ionic) return q !== 0 && candidates.length ? { name: candidates[0].name, fits: true } : null;
  if (deltaG === null || !Number.isFinite(deltaG)) return null;
  let best: BeadType | null = null;
  let bestDistance = Infinity;
  for (const t of candidates) {
    const distance = deltaG < t.deltaGMin ? t.deltaGMin - deltaG : deltaG > t.deltaGMax ? deltaG - t.deltaGMax : 0;
    if (distance === 0) return { name: t.name, fits: true };
    if (distance < bestDistance) [best, bestDistance] = [t, distance];
  }
  return best ? { name: best.name, fits: false } : null;
}
