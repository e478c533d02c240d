/**
 * Bond length, bond angle and dihedral from points in an interleaved array. The dihedral follows the
 * IUPAC convention (IUPAC Gold Book, "torsion angle"): 0° for cis, ±180° for trans, positive
 * clockwise looking from the second point to the third; the same as GROMACS's.
 */
type Arr = Float32Array | Float64Array;

export function distance(c: Arr, i: number, j: number): number {
  const dx = c[3 * j] - c[3 * i];
  const dy = c[3 * j + 1] - c[3 * i + 1];
  const dz = c[3 * j + 2] - c[3 * i + 2];
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}

/** Degrees, 0–180. */
export function angle(c: Arr, i: number, j: number, k: number): number {
  const ax = c[3 * i] - c[3 * j], ay = c[3 * i + 1] - c[3 * j + 1], az = c[3 * i + 2] - c[3 * j + 2];
  const bx = c[3 * k] - c[3 * j], by = c[3 * k + 1] - c[3 * j + 1], bz = c[3 * k + 2] - c[3 * j + 2];
  const cx = ay * bz - az * by, cy = az * bx - ax * bz, cz = ax * by - ay * bx;
  return (Math.atan2(Math.sqrt(cx * cx + cy * cy + cz * cz), ax * bx + ay * by + az * bz) * 180) / Math.PI;
}

/** Degrees, −180–180. */
export function dihedral(c: Arr, i: number, j: number, k: number, l: number): number {
  const b1x = c[3 * j] - c[3 * i], b1y = c[3 * j + 1] - c[3 * i + 1], b1z = c[3 * j + 2] - c[3 * i + 2];
  const b2x = c[3 * k] - c[3 * j], b2y = c[3 * k + 1] - c[3 * j + 1], b2z = c[3 * k + 2] - c[3 * j + 2];
  const b3x = c[3 * l] - c[3 * k], b3y = c[3 * l + 1] - c[3 * k + 1], b3z = c[3 * l + 2] - c[3 * k + 2];
  const n1x = b1y * b2z - b1z * b2y, n1y = b1z * b2x - b1x * b2z, n1z = b1x * b2y - b1y * b2x;
  const n2x = b2y * b3z - b2z * b3y, n2y = b2z * b3x - b2x * b3z, n2z = b2x * b3y - b2y * b3x;
  const b2 = Math.sqrt(b2x * b2x + b2y * b2y + b2z * b2z);
  const mx = n1y * n2z - n1z * n2y, my = n1z * n2x - n1x * n2z, mz = n1x * n2y - n1y * n2x;
  const x = n1x * n2x + n1y * n2y + n1z * n2z;
  const y = (mx * b2x + my * b2y + mz * b2z) / (b2 || 1);
  return (Math.atan2(y, x) * 180) / Math.PI;
}
