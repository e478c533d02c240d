/**
 * Each bead's centre as fixed weights over the molecule's points, so a frame costs one weighted sum
 * per bead. The weights are exactly those of the chemistry core's beadCentre (server/chem/centres.ts):
 * mass: w_a·m_a for an atom and w_a·m_h for each of its hydrogens; geometry: w_a for the atom and
 * each hydrogen; geometry-heavy: w_a for the atom only; the centre is the weighted mean.
 * tests/unit/trajectory/bead-weights.test.ts checks the two agree.
 */
import type { Mapping } from '../../src/shared/chem';
import type { Prepared } from '../chem/prepared';

export interface BeadWeights {
  /** Per bead: the points and their normalised weights (sum 1). */
  points: Int32Array[];
  weights: Float64Array[];
}

export function beadWeights(p: Prepared, mapping: Mapping): BeadWeights {
  const points: Int32Array[] = [];
  const weights: Float64Array[] = [];
  for (const bead of mapping.beads) {
    const ps: number[] = [];
    const ws: number[] = [];
    for (const { index, weight } of bead.atoms) {
      ps.push(index);
      ws.push(bead.centre === 'mass' ? weight * p.ownMass[index] : weight);
      if (bead.centre === 'geometry-heavy') continue;
      const first = p.hStart[index];
      for (let k = 0; k < p.hCount[index]; k++) {
        ps.push(first + k);
        ws.push(bead.centre === 'mass' ? weight * p.hMass[first - p.n + k] : weight);
      }
    }
    const total = ws.reduce((s, w) => s + w, 0);
    points.push(Int32Array.from(ps));
    weights.push(Float64Array.from(ws.map((w) => (total > 0 ? w / total : 0))));
  }
  return { points, weights };
}

/** Bead centres of one whole copy (xyz in molecule point order) into out at offset (3 per bead). */
export function centresOf(bw: BeadWeights, xyz: Float64Array, out: Float32Array | Float64Array, offset: number): void {
  for (let b = 0; b < bw.points.length; b++) {
    const ps = bw.points[b];
    const ws = bw.weights[b];
    let x = 0;
    let y = 0;
    let z = 0;
    for (let k = 0; k < ps.length; k++) {
      const i = 3 * ps[k];
      x += ws[k] * xyz[i];
      y += ws[k] * xyz[i + 1];
      z += ws[k] * xyz[i + 2];
    }
    out[offset + 3 * b] = x;
    out[offset + 3 * b + 1] = y;
    out[offset + 3 * b + 2] = z;
  }
}
