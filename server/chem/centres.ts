/**
 * Bead centres from 3D coordinates (Å), listed in the atom-index contract's order (heavy atoms, then
 * each atom's hydrogens grouped by parent).
 *
 *   mass:            r = Σ_a w_a (m_a r_a + Σ_h m_h r_h) / Σ_a w_a (m_a + Σ_h m_h)
 *   geometry:        r = Σ_a w_a (r_a + Σ_h r_h) / Σ_a w_a (1 + n_h,a)
 *   geometry-heavy:  r = Σ_a w_a r_a / Σ_a w_a
 *
 * where a runs over the bead's atoms with weight w_a (shared atoms count with their weight) and h over
 * each atom's hydrogens. These are the textbook definitions of centre of mass and centroid.
 */
import type { CentreRule, MappingAtom, Vec3 } from '../../src/shared/chem';
import { ChemError } from './errors';
import type { Prepared } from './prepared';

export function checkCoordinates(p: Prepared, coordinates: number[][]): void {
  if (coordinates.length !== p.totalPoints) {
    throw new ChemError(
      'coordinates_mismatch',
      `The coordinates list has ${coordinates.length} points; this molecule needs ${p.totalPoints} (${p.n} heavy atoms and their hydrogens, in the model's order).`,
      { given: coordinates.length, expected: p.totalPoints },
    );
  }
  coordinates.forEach((c, i) => {
    if (c.length !== 3 || !c.every(Number.isFinite)) {
      throw new ChemError('bad_coordinates', `Coordinate ${i} is not three finite numbers.`, { index: i });
    }
  });
}

export function beadCentre(p: Prepared, xyz: number[][], atoms: MappingAtom[], rule: CentreRule): Vec3 | null {
  let sx = 0;
  let sy = 0;
  let sz = 0;
  let total = 0;
  const add = (point: number[], weight: number): void => {
    sx += weight * point[0];
    sy += weight * point[1];
    sz += weight * point[2];
    total += weight;
  };
  for (const { index, weight } of atoms) {
    add(xyz[index], rule === 'mass' ? weight * p.ownMass[index] : weight);
    if (rule === 'geometry-heavy') continue;
    const first = p.hStart[index];
    for (let k = 0; k < p.hCount[index]; k++) {
      add(xyz[first + k], rule === 'mass' ? weight * p.hMass[first - p.n + k] : weight);
    }
  }
  if (total === 0) return null;
  return [sx / total, sy / total, sz / total];
}
