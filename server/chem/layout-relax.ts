/**
 * Last step of the 2D layout: pushes apart atoms that are still drawn too close after the rigid
 * clean-up (layout-cleanup.ts), e.g. two side rings of a long polymer folded onto each other.
 *
 * Position-based relaxation (constraint projection, as in M. Müller et al., "Position based
 * dynamics", J. Vis. Commun. Image R. 18 (2007) 109): each round moves the two atoms of every
 * violated constraint halfway towards satisfying it. Constraints: every bond keeps its length and
 * every pair of atoms two bonds apart keeps its distance (so bond angles and ring shapes hold), both
 * as the input drew them; two atoms further apart in the graph stay at least CLEAR × the median bond
 * length apart. Where nothing is too close nothing is violated, so nothing moves: only the crowded
 * places are redrawn, bending their angles a little. Pure and deterministic.
 */
import { PointGrid, type XY } from './layout-grid';

const CLEAR = 0.75;
const ROUNDS = 200;
/** Relaxation stops once no pair is closer than this (the drawing rule is 0.5). */
const DONE = 0.6;

export function relaxLayout(input: readonly XY[], bonds: readonly { a: number; b: number }[], median: number): XY[] {
  const points = input.map((p) => ({ ...p }));
  const n = points.length;
  const adj: number[][] = Array.from({ length: n }, () => []);
  for (const b of bonds) {
    adj[b.a].push(b.b);
    adj[b.b].push(b.a);
  }
  // Kept distances: bonds (1–2) and pairs sharing a neighbour (1–3), as drawn on input.
  const keep: [number, number, number][] = [];
  const near = new Set<number>();
  const pairKey = (a: number, b: number) => Math.min(a, b) * n + Math.max(a, b);
  const dist = (a: number, b: number) => Math.hypot(points[a].x - points[b].x, points[a].y - points[b].y);
  const keepPair = (a: number, b: number) => {
    if (near.has(pairKey(a, b))) return;
    near.add(pairKey(a, b));
    keep.push([a, b, dist(a, b)]);
  };
  for (const b of bonds) keepPair(b.a, b.b);
  for (let c = 0; c < n; c++) for (let i = 0; i < adj[c].length; i++) for (let j = i + 1; j < adj[c].length; j++) keepPair(adj[c][i], adj[c][j]);
  const clear = CLEAR * median;
  for (let round = 0; round < ROUNDS; round++) {
    const grid = new PointGrid(clear);
    points.forEach((p, i) => grid.add(p, i));
    let closest = Infinity;
    const found: number[] = [];
    for (let i = 0; i < n; i++) {
      found.length = 0;
      for (const j of grid.near(points[i], found)) {
        if (j <= i || near.has(pairKey(i, j))) continue;
        closest = Math.min(closest, dist(i, j));
        push(points[i], points[j], clear, i, j);
      }
    }
    if (closest >= DONE * median) break;
    for (const [a, b, d] of keep) push(points[a], points[b], d, a, b, true);
  }
  return points;
}

/** Moves p and q halfway each towards distance d (only apart, unless `exact`). */
function push(p: XY, q: XY, d: number, i: number, j: number, exact = false): void {
  let dx = q.x - p.x;
  let dy = q.y - p.y;
  let len = Math.hypot(dx, dy);
  if (len < 1e-9) {
    // Two atoms on the same spot: part them along a direction fixed by their numbers (deterministic).
    const angle = ((i * 7919 + j * 104_729) % 360) * (Math.PI / 180);
    [dx, dy, len] = [Math.cos(angle), Math.sin(angle), 1];
    if (!exact) {
      p.x -= (dx * d) / 2;
      p.y -= (dy * d) / 2;
      q.x += (dx * d) / 2;
      q.y += (dy * d) / 2;
      return;
    }
  }
  if (!exact && len >= d) return;
  const shift = (len - d) / len / 2;
  p.x += dx * shift;
  p.y += dy * shift;
  q.x -= dx * shift;
  q.y -= dy * shift;
}
