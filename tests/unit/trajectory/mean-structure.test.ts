import { describe, expect, it } from 'vitest';
import { meanStructure, superpose } from '../../../server/trajectory/mean-structure';

// The superposition and mean structure (Horn 1987) against hand-made cases: a structure rotated by a
// known rotation comes back exactly; copies tumbling and drifting with noise average to the original
// shape (its pairwise distances), which a plain average of the frames does not.

const shape = [0, 0, 0, 1.5, 0, 0, 2.2, 1.1, 0, 2.9, 1.4, 0.9, 4.1, 1.2, 1.3];
const n = shape.length / 3;

function rotation(axis: number[], angle: number): number[][] {
  const [x, y, z] = axis.map((v) => v / Math.hypot(...axis));
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  // Rodrigues' rotation formula.
  return [
    [c + x * x * (1 - c), x * y * (1 - c) - z * s, x * z * (1 - c) + y * s],
    [y * x * (1 - c) + z * s, c + y * y * (1 - c), y * z * (1 - c) - x * s],
    [z * x * (1 - c) - y * s, z * y * (1 - c) + x * s, c + z * z * (1 - c)],
  ];
}
const apply = (R: number[][], p: ArrayLike<number>, shift = [0, 0, 0]) => Float64Array.from({ length: p.length }, (_, k) => {
  const i = Math.floor(k / 3);
  const r = k % 3;
  return R[r][0] * p[3 * i] + R[r][1] * p[3 * i + 1] + R[r][2] * p[3 * i + 2] + shift[r];
});
const centred = (p: ArrayLike<number>) => {
  const c = [0, 1, 2].map((d) => Array.from({ length: n }, (_, i) => p[3 * i + d]).reduce((a, b) => a + b, 0) / n);
  return Float64Array.from({ length: p.length }, (_, k) => p[k] - c[k % 3]);
};
const distances = (p: ArrayLike<number>) => {
  const out: number[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) out.push(Math.hypot(p[3 * i] - p[3 * j], p[3 * i + 1] - p[3 * j + 1], p[3 * i + 2] - p[3 * j + 2]));
  return out;
};
function rng(seed: number) {
  let s = seed;
  return () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
}

describe('mean structure', () => {
  it('undoes a known rotation exactly', () => {
    const target = centred(shape);
    const moved = apply(rotation([1, 2, -0.5], 2.1), target);
    const back = superpose(moved, target);
    back.forEach((v, k) => expect(v).toBeCloseTo(target[k], 9));
  });

  it('averages tumbling, drifting, noisy copies to the original shape; a plain average does not', () => {
    const r = rng(7);
    const gauss = () => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
    const frames = Array.from({ length: 400 }, () => {
      const f = apply(rotation([r() - 0.5, r() - 0.5, r() - 0.5], r() * Math.PI), shape, [r() * 30, r() * 30, r() * 30]);
      return f.map((v) => v + 0.05 * gauss());
    });
    const mean = meanStructure(frames, n);
    const want = distances(shape);
    distances(mean).forEach((d, i) => expect(Math.abs(d - want[i])).toBeLessThan(0.01));
    const plain = centred(Float64Array.from({ length: shape.length }, (_, k) => frames.reduce((s, f) => s + f[k], 0) / frames.length));
    expect(Math.max(...distances(plain).map((d, i) => Math.abs(d - want[i])))).toBeGreaterThan(0.5);
  });
});
