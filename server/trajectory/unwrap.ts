/**
 * Making a copy whole across periodic boundaries: walk the molecule's spanning forest
 * (molecule-graph.ts spanningOrder) and put each atom at the minimum image of its bond partner's
 * position. Bonds are much shorter than half a box edge, so the walk never picks a wrong image.
 *
 * This runs for every atom of every copy in every frame, so it allocates nothing and inlines the
 * minimum image (box.ts minimumImage: shift by c, then b, then a, each by round(d / edge) edges; a
 * rectangular box only skips the terms that are zero). The division is a multiplication by the
 * edge's inverse, which can differ from it in the last bit only, and so changes the shift only for a
 * bond of exactly half an edge (none: bonds are far shorter).
 */
import { type Box, isUsableBox } from './box';

/**
 * x, y, z: the whole system's coordinates (Å) as columns; atoms[base + p]: the reference atom at
 * molecule point p of this copy. Writes the copy's points, whole, in molecule order into out
 * (3 × points, interleaved).
 */
export function wholeCopy(x: ArrayLike<number>, y: ArrayLike<number>, z: ArrayLike<number>, atoms: Int32Array, base: number, order: Int32Array, via: Int32Array, box: Box | null, out: Float64Array): void {
  const periodic = isUsableBox(box);
  const ax = periodic ? box[0] : 0, by = periodic ? box[4] : 0, cz = periodic ? box[8] : 0;
  const bx = periodic ? box[3] : 0, cx = periodic ? box[6] : 0, cy = periodic ? box[7] : 0;
  const triclinic = bx !== 0 || cx !== 0 || cy !== 0;
  const iax = 1 / ax, iby = 1 / by, icz = 1 / cz;
  for (let k = 0; k < order.length; k++) {
    const p = order[k];
    const a = atoms[base + p];
    const from = via[p];
    if (from < 0 || !periodic) {
      out[3 * p] = x[a];
      out[3 * p + 1] = y[a];
      out[3 * p + 2] = z[a];
      continue;
    }
    const b = atoms[base + from];
    let dx = x[a] - x[b];
    let dy = y[a] - y[b];
    let dz = z[a] - z[b];
    // Most bonds cross no face: Math.round is skipped while the shift is 0 (t in [−0.5, 0.5)).
    let t = dz * icz;
    if (t >= 0.5 || t < -0.5) {
      const s = Math.round(t);
      if (triclinic) {
        dx -= s * cx;
        dy -= s * cy;
      }
      dz -= s * cz;
    }
    t = dy * iby;
    if (t >= 0.5 || t < -0.5) {
      const s = Math.round(t);
      if (triclinic) dx -= s * bx;
      dy -= s * by;
    }
    t = dx * iax;
    if (t >= 0.5 || t < -0.5) dx -= Math.round(t) * ax;
    out[3 * p] = out[3 * from] + dx;
    out[3 * p + 1] = out[3 * from + 1] + dy;
    out[3 * p + 2] = out[3 * from + 2] + dz;
  }
}
