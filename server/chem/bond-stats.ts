/**
 * Bond-length statistics of a conformer against typical values, to judge its geometry.
 *
 * Typical lengths (common practice, no source): C–C single bond between two sp3 carbons 1.53 Å,
 * aromatic C–C 1.39 Å, C–H 1.09 Å. Only bonds of these three kinds are counted; the result is the RMS
 * deviation over them and per kind. Coordinates are in the atom-index contract's order (heavy atoms,
 * then each heavy atom's hydrogens).
 */
import type { Molecule } from '../../src/shared/chem';

export const TYPICAL_BOND_LENGTHS = { 'C-C': 1.53, 'C:C': 1.39, 'C-H': 1.09 } as const;
export type BondKind = keyof typeof TYPICAL_BOND_LENGTHS;

export interface BondStats {
  rms: number;
  count: number;
  byKind: Record<BondKind, { rms: number; mean: number; count: number }>;
}

export function bondLengthStats(molecule: Pick<Molecule, 'atoms' | 'bonds'>, xyz: number[][]): BondStats {
  const { atoms, bonds } = molecule;
  const multiple = new Uint8Array(atoms.length);
  for (const b of bonds) {
    if (b.order !== 1 || b.aromatic) multiple[b.a] = multiple[b.b] = 1;
  }
  const sp3Carbon = (i: number) => atoms[i].element === 'C' && !atoms[i].aromatic && !multiple[i];
  const samples: Record<BondKind, number[]> = { 'C-C': [], 'C:C': [], 'C-H': [] };
  const dist = (p: number[], q: number[]) => Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2]);
  for (const b of bonds) {
    if (atoms[b.a].element !== 'C' || atoms[b.b].element !== 'C') continue;
    if (b.aromatic) samples['C:C'].push(dist(xyz[b.a], xyz[b.b]));
    else if (b.order === 1 && sp3Carbon(b.a) && sp3Carbon(b.b)) samples['C-C'].push(dist(xyz[b.a], xyz[b.b]));
  }
  let h = atoms.length;
  atoms.forEach((a, i) => {
    for (let k = 0; k < a.hydrogens; k++, h++) if (a.element === 'C') samples['C-H'].push(dist(xyz[i], xyz[h]));
  });
  let sum = 0;
  let count = 0;
  const byKind = {} as BondStats['byKind'];
  for (const kind of Object.keys(samples) as BondKind[]) {
    const d = samples[kind];
    const sq = d.reduce((s, x) => s + (x - TYPICAL_BOND_LENGTHS[kind]) ** 2, 0);
    byKind[kind] = { rms: d.length ? Math.sqrt(sq / d.length) : 0, mean: d.length ? d.reduce((s, x) => s + x, 0) / d.length : 0, count: d.length };
    sum += sq;
    count += d.length;
  }
  return { rms: count ? Math.sqrt(sum / count) : 0, count, byKind };
}
