/**
 * The mean structure of one molecule over a trajectory: each frame's bead centres are moved to their
 * centroid and rotated onto a reference by the least-squares superposition of Horn (J. Opt. Soc. Am. A
 * 1987, 4, 629–642: the rotation is the unit quaternion that is the eigenvector of the largest
 * eigenvalue of a symmetric 4×4 matrix built from the correlation matrix), then averaged. Without the
 * superposition an average over a molecule that diffuses and tumbles would be meaningless. Two passes:
 * first onto frame 0, then onto the first pass's mean, so the result does not lean on one frame.
 * The frames must already be whole (analyse-frames.ts makes each copy whole before its centres).
 * An average of superposed frames is a little more compact than any frame where the molecule flexes
 * (fluctuations perpendicular to a bond shorten the mean bond); it is a starting structure, not a target.
 */

type Points = Float64Array; // n × 3

function centred(p: ArrayLike<number>, n: number): Points {
  const out = new Float64Array(3 * n);
  const c = [0, 0, 0];
  for (let i = 0; i < n; i++) for (let d = 0; d < 3; d++) c[d] += p[3 * i + d] / n;
  for (let i = 0; i < n; i++) for (let d = 0; d < 3; d++) out[3 * i + d] = p[3 * i + d] - c[d];
  return out;
}

/** Eigenvector of the largest eigenvalue of a symmetric 4×4 matrix (cyclic Jacobi rotations). */
function topEigenvector(m: number[][]): number[] {
  const a = m.map((r) => [...r]);
  const v: number[][] = [0, 1, 2, 3].map((i) => [0, 1, 2, 3].map((j) => (i === j ? 1 : 0)));
  for (let sweep = 0; sweep < 50; sweep++) {
    let off = 0;
    for (let p = 0; p < 4; p++) for (let q = p + 1; q < 4; q++) off += a[p][q] * a[p][q];
    if (off < 1e-22) break;
    for (let p = 0; p < 4; p++) {
      for (let q = p + 1; q < 4; q++) {
        if (Math.abs(a[p][q]) < 1e-300) continue;
        const theta = (a[q][q] - a[p][p]) / (2 * a[p][q]);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < 4; k++) {
          const akp = a[k][p];
          const akq = a[k][q];
          a[k][p] = c * akp - s * akq;
          a[k][q] = s * akp + c * akq;
        }
        for (let k = 0; k < 4; k++) {
          const apk = a[p][k];
          const aqk = a[q][k];
          a[p][k] = c * apk - s * aqk;
          a[q][k] = s * apk + c * aqk;
        }
        for (let k = 0; k < 4; k++) {
          const vkp = v[k][p];
          const vkq = v[k][q];
          v[k][p] = c * vkp - s * vkq;
          v[k][q] = s * vkp + c * vkq;
        }
      }
    }
  }
  let best = 0;
  for (let i = 1; i < 4; i++) if (a[i][i] > a[best][best]) best = i;
  return [0, 1, 2, 3].map((k) => v[k][best]);
}

/** `moving` (centred) rotated onto `target` (centred) in the least-squares sense. */
export function superpose(moving: Points, target: Points): Points {
  const n = moving.length / 3;
  const S = [0, 1, 2].map(() => [0, 0, 0]);
  for (let i = 0; i < n; i++) for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) S[r][c] += moving[3 * i + r] * target[3 * i + c];
  const [[xx, xy, xz], [yx, yy, yz], [zx, zy, zz]] = S;
  const N = [
    [xx + yy + zz, yz - zy, zx - xz, xy - yx],
    [yz - zy, xx - yy - zz, xy + yx, zx + xz],
    [zx - xz, xy + yx, -xx + yy - zz, yz + zy],
    [xy - yx, zx + xz, yz + zy, -xx - yy + zz],
  ];
  const [w, x, y, z] = topEigenvector(N);
  const R = [
    [w * w + x * x - y * y - z * z, 2 * (x * y - w * z), 2 * (x * z + w * y)],
    [2 * (x * y + w * z), w * w - x * x + y * y - z * z, 2 * (y * z - w * x)],
    [2 * (x * z - w * y), 2 * (y * z + w * x), w * w - x * x - y * y + z * z],
  ];
  const out = new Float64Array(moving.length);
  for (let i = 0; i < n; i++) for (let r = 0; r < 3; r++) out[3 * i + r] = R[r][0] * moving[3 * i] + R[r][1] * moving[3 * i + 1] + R[r][2] * moving[3 * i + 2];
  return out;
}

/** Mean of `frames` (each n × 3, same units in and out), superposed as the header says; centred on the origin. */
export function meanStructure(frames: readonly ArrayLike<number>[], n: number): Points {
  if (frames.length === 0) throw new Error('A mean structure needs at least one frame.');
  const all = frames.map((f) => centred(f, n));
  const pass = (target: Points) => {
    const sum = new Float64Array(3 * n);
    for (const f of all) {
      const fit = n > 1 ? superpose(f, target) : f;
      for (let k = 0; k < sum.length; k++) sum[k] += fit[k] / all.length;
    }
    return centred(sum, n);
  };
  return pass(pass(all[0]));
}
