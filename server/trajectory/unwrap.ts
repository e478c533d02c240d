/**
 * Making a copy whole across periodic boundaries: walk the molecule's spanning forest
 * (molecule-graph.ts spanningOrder) and put each atom at the minimum image of its bond partner's
 * position. Bonds are much shorter than half a box edge, so the walk never picks a wrong image.
 */
import { type Box, isUsableBox, minimumImage } from './box';

/**
 * frame: interleaved Å of the whole system; atoms[p]: the reference atom at molecule point p.
 * Writes the copy's points, whole, in molecule order into out (3 × points).
 */
export function wholeCopy(frame: Float32Array | Float64Array, atoms: Int32Array, order: Int32Array, via: Int32Array, box: Box | null, out: Float64Array): void {
  const d = new Float64Array(3);
  const periodic = isUsableBox(box);
  for (let k = 0; k < order.length; k++) {
    const p = order[k];
    const a = 3 * atoms[p];
    const from = via[p];
    if (from < 0 || !periodic) {
      out[3 * p] = frame[a];
      out[3 * p + 1] = frame[a + 1];
      out[3 * p + 2] = frame[a + 2];
      continue;
    }
    const b = 3 * atoms[from];
    d[0] = frame[a] - frame[b];
    d[1] = frame[a + 1] - frame[b + 1];
    d[2] = frame[a + 2] - frame[b + 2];
    minimumImage(box, d);
    out[3 * p] = out[3 * from] + d[0];
    out[3 * p + 1] = out[3 * from + 1] + d[1];
    out[3 * p + 2] = out[3 * from + 2] + d[2];
  }
}
