/**
 * Periodic boxes and the minimum image. A box is GROMACS's three box vectors in the lower-triangular
 * form (a along x; b in the xy plane; c anywhere with c_z > 0), in Å, as nine numbers
 * [ax, ay, az, bx, by, bz, cx, cy, cz]. The minimum image is found the way GROMACS's simple search
 * does it for a reduced triclinic box: shift by c, then b, then a (exact for rectangular boxes and
 * for triclinic boxes reduced as GROMACS keeps them).
 */
export type Box = Float64Array | number[];

export function isUsableBox(box: Box | null | undefined): box is Box {
  return !!box && box.length === 9 && box[0] > 0 && box[4] > 0 && box[8] > 0;
}

/** Replaces d (a difference vector, Å) by its minimum image; out may be d itself. */
export function minimumImage(box: Box, d: Float64Array): void {
  let s = Math.round(d[2] / box[8]);
  if (s !== 0) {
    d[0] -= s * box[6];
    d[1] -= s * box[7];
    d[2] -= s * box[8];
  }
  s = Math.round(d[1] / box[4]);
  if (s !== 0) {
    d[0] -= s * box[3];
    d[1] -= s * box[4];
  }
  s = Math.round(d[0] / box[0]);
  if (s !== 0) d[0] -= s * box[0];
}
