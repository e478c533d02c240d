/**
 * 2D layout clean-up: removes atoms drawn on top of each other (openchemlib's coordinate inventor
 * can fold a long chain with many side rings back onto itself, e.g. a polystyrene 18-mer).
 *
 * A clash is two atoms closer than CLASH × the median bond length. Each clash is repaired by moving
 * a whole branch rigidly: for a chain bond on the path between the two atoms (a bond in no ring,
 * a "bridge"), the smaller side is reflected across the bond's line — a mirror image of a branch
 * keeps every bond length and angle — or, failing that, turned about the bond's atom by a few
 * angles. A move is kept only when it lowers the crowding penalty, Σ (CLEAR − d)² over atom pairs
 * closer than CLEAR × the median bond length, between the moved branch and the rest. The bridges are
 * found with Tarjan's bridge-finding depth-first search (R. E. Tarjan, Inf. Process. Lett. 2 (1974) 160).
 * Pure: positions in, positions out.
 */

import { PointGrid, type XY } from './layout-grid';

export type { XY };

export const CLASH = 0.55;
const CLEAR = 0.8;
const MAX_ROUNDS = 60;
const MAX_BONDS_TRIED = 12;
const TURNS = [Math.PI / 6, -Math.PI / 6, Math.PI / 3, -Math.PI / 3, Math.PI / 2, -Math.PI / 2, (2 * Math.PI) / 3, (-2 * Math.PI) / 3];

export function medianBondLength(points: readonly XY[], bonds: readonly { a: number; b: number }[]): number {
  const lens = bonds.map((b) => Math.hypot(points[b.a].x - points[b.b].x, points[b.a].y - points[b.b].y)).sort((p, q) => p - q);
  return lens.length ? lens[Math.floor(lens.length / 2)] : 1;
}

/** Pairs of atoms closer than `factor` × the median bond length (grid of one bond length). */
export function closePairs(points: readonly XY[], bonds: readonly { a: number; b: number }[], factor: number): [number, number][] {
  const grid = new PointGrid(Math.max(factor * medianBondLength(points, bonds), 1e-6));
  const out: [number, number][] = [];
  const found: number[] = [];
  points.forEach((p, i) => {
    found.length = 0;
    for (const j of grid.near(p, found)) out.push([j, i]);
    grid.add(p, i);
  });
  return out;
}

function adjacency(n: number, bonds: readonly { a: number; b: number }[]): number[][] {
  const adj: number[][] = Array.from({ length: n }, () => []);
  for (const b of bonds) {
    adj[b.a].push(b.b);
    adj[b.b].push(b.a);
  }
  return adj;
}

/** Bonds in no ring, as "a,b" keys with a < b (iterative Tarjan). */
function bridges(adj: number[][]): Set<string> {
  const n = adj.length;
  const disc = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const out = new Set<string>();
  let time = 0;
  for (let root = 0; root < n; root++) {
    if (disc[root] !== -1) continue;
    const stack: [number, number, number][] = [[root, -1, 0]];
    disc[root] = low[root] = time++;
    while (stack.length) {
      const top = stack[stack.length - 1];
      const [u, parent, k] = top;
      if (k < adj[u].length) {
        top[2]++;
        const v = adj[u][k];
        if (v === parent) continue;
        if (disc[v] === -1) {
          disc[v] = low[v] = time++;
          stack.push([v, u, 0]);
        } else low[u] = Math.min(low[u], disc[v]);
      } else {
        stack.pop();
        if (parent >= 0) {
          low[parent] = Math.min(low[parent], low[u]);
          if (low[u] > disc[parent]) out.add(parent < u ? `${parent},${u}` : `${u},${parent}`);
        }
      }
    }
  }
  return out;
}

function path(adj: number[][], from: number, to: number): number[] | null {
  const prev = new Int32Array(adj.length).fill(-2);
  prev[from] = -1;
  const queue = [from];
  for (let q = 0; q < queue.length; q++) {
    const u = queue[q];
    if (u === to) break;
    for (const v of adj[u]) {
      if (prev[v] === -2) {
        prev[v] = u;
        queue.push(v);
      }
    }
  }
  if (prev[to] === -2) return null;
  const out = [to];
  for (let w = prev[to]; w !== -1; w = prev[w]) out.push(w);
  return out.reverse();
}

/** Atoms reached from `start` without crossing the bond start–`not`. */
function side(adj: number[][], start: number, not: number): number[] {
  const seen = new Uint8Array(adj.length);
  seen[start] = 1;
  seen[not] = 1;
  const out = [start];
  for (let q = 0; q < out.length; q++) {
    for (const v of adj[out[q]]) {
      if (!seen[v]) {
        seen[v] = 1;
        out.push(v);
      }
    }
  }
  return out;
}

export function cleanLayout(input: readonly XY[], bonds: readonly { a: number; b: number }[]): XY[] {
  const points = input.map((p) => ({ ...p }));
  const n = points.length;
  if (n < 4) return points;
  const adj = adjacency(n, bonds);
  const chainBonds = bridges(adj);
  const L = medianBondLength(points, bonds);
  const clear = CLEAR * L;
  const inSide = new Uint8Array(n);

  /** The atoms not being moved, in a grid, to measure a move's crowding against. */
  const others = (): PointGrid => {
    const grid = new PointGrid(clear);
    for (let i = 0; i < n; i++) if (!inSide[i]) grid.add(points[i], i);
    return grid;
  };

  for (let round = 0; round < MAX_ROUNDS; round++) {
    const clashes = closePairs(points, bonds, CLASH);
    if (!clashes.length) break;
    let improved = false;
    for (const [i, j] of clashes) {
      const route = path(adj, i, j);
      if (!route) continue;
      let best: { moved: number[]; to: XY[]; gain: number } | null = null;
      // Chain bonds on the path, nearest the two clashing atoms first; a branch turned near the
      // clash is the usual cure, and a long polymer's far bonds would only cost time.
      const steps = route.slice(1).map((v, k) => [route[k], v, Math.min(k, route.length - 2 - k)] as const).filter(([u, v]) => chainBonds.has(u < v ? `${u},${v}` : `${v},${u}`));
      for (const [u, v] of steps.sort((p, q) => p[2] - q[2]).slice(0, MAX_BONDS_TRIED)) {
        const sv = side(adj, v, u);
        const su = side(adj, u, v);
        const [moved, pivot, other] = sv.length <= su.length ? [sv, u, v] : [su, v, u];
        moved.forEach((a) => (inSide[a] = 1));
        const rest = others();
        const before = rest.crowding(moved.map((a) => points[a]));
        const candidates: XY[][] = [reflect(moved, points, points[pivot], points[other])];
        for (const t of TURNS) candidates.push(turn(moved, points, points[pivot], t));
        for (const to of candidates) {
          const after = rest.crowding(to);
          if (after < before - 1e-9 && (!best || before - after > best.gain)) best = { moved, to, gain: before - after };
        }
        moved.forEach((a) => (inSide[a] = 0));
      }
      if (best) {
        best.moved.forEach((a, k) => (points[a] = best!.to[k]));
        improved = true;
        break; // positions changed: find the clashes afresh
      }
    }
    if (!improved) break;
  }
  return points;
}

function reflect(atoms: number[], points: XY[], p: XY, q: XY): XY[] {
  const dx = q.x - p.x;
  const dy = q.y - p.y;
  const len2 = dx * dx + dy * dy || 1;
  return atoms.map((a) => {
    const { x, y } = points[a];
    const t = ((x - p.x) * dx + (y - p.y) * dy) / len2;
    const fx = p.x + t * dx;
    const fy = p.y + t * dy;
    return { x: 2 * fx - x, y: 2 * fy - y };
  });
}

function turn(atoms: number[], points: XY[], c: XY, angle: number): XY[] {
  const [cos, sin] = [Math.cos(angle), Math.sin(angle)];
  return atoms.map((a) => {
    const dx = points[a].x - c.x;
    const dy = points[a].y - c.y;
    return { x: c.x + dx * cos - dy * sin, y: c.y + dx * sin + dy * cos };
  });
}
