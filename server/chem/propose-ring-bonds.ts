/**
 * Which bonds lie in a ring, and which of those in a small ring (at most 8 atoms), for the mapping
 * proposal. A bond is in a ring exactly when it is not a bridge of the bond graph (Tarjan's
 * bridge-finding by depth-first low-links, iterative so long chains do not exhaust the stack). A ring
 * bond is in a small ring when its ends are joined by another path of at most 7 ring bonds
 * (breadth-first, bounded). Atoms only in larger rings (crown ethers, macrocycles) are mapped like
 * chain atoms of a ring: in pieces up to the resolution's target size instead of 2–3 atoms.
 */
import type { Prepared } from './prepared';

export const SMALL_RING = 8;

export interface RingBonds {
  /** Per adjacency entry (p.adj index): the bond lies in a ring. */
  inRing: Uint8Array;
  /** Per atom: it lies in some ring. */
  ringAtom: Uint8Array;
  /** Per atom: it lies in a ring of at most SMALL_RING atoms. */
  smallRingAtom: Uint8Array;
}

export function ringBonds(p: Prepared): RingBonds {
  const n = p.n;
  const order = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const inRing = new Uint8Array(p.adj.length).fill(1);
  let counter = 0;
  for (let root = 0; root < n; root++) {
    if (order[root] >= 0) continue;
    // Stack of [atom, adjacency entry used to enter it, next adjacency position].
    const stack: [number, number, number][] = [[root, -1, p.adjStart[root]]];
    order[root] = low[root] = counter++;
    while (stack.length) {
      const top = stack[stack.length - 1];
      const [a, via] = top;
      if (top[2] < p.adjStart[a + 1]) {
        const k = top[2]++;
        const b = p.adj[k];
        if (via >= 0 && k === reverse(p, via)) continue;
        if (order[b] < 0) {
          order[b] = low[b] = counter++;
          stack.push([b, k, p.adjStart[b]]);
        } else low[a] = Math.min(low[a], order[b]);
      } else {
        stack.pop();
        if (via >= 0) {
          const parent = stack[stack.length - 1][0];
          low[parent] = Math.min(low[parent], low[a]);
          if (low[a] > order[parent]) {
            inRing[via] = 0;
            inRing[reverse(p, via)] = 0;
          }
        }
      }
    }
  }
  const ringAtom = new Uint8Array(n);
  for (let a = 0; a < n; a++) for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) if (inRing[k]) ringAtom[a] = 1;
  const smallRingAtom = new Uint8Array(n);
  for (let a = 0; a < n; a++) {
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1] && !smallRingAtom[a]; k++) {
      if (inRing[k] && shortestDetour(p, inRing, a, p.adj[k]) <= SMALL_RING - 1) smallRingAtom[a] = 1;
    }
  }
  return { inRing, ringAtom, smallRingAtom };
}

/** The adjacency entry of b → a for the entry k of a → b. */
function reverse(p: Prepared, k: number): number {
  const b = p.adj[k];
  let a = 0;
  // k lies in a's block; find a by binary search over adjStart.
  let lo = 0;
  let hi = p.n - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (p.adjStart[mid] <= k && k < p.adjStart[mid + 1]) {
      a = mid;
      break;
    }
    if (p.adjStart[mid] > k) hi = mid - 1;
    else lo = mid + 1;
  }
  for (let j = p.adjStart[b]; j < p.adjStart[b + 1]; j++) if (p.adj[j] === a) return j;
  return -1;
}

/** Ring bonds on the shortest path from a to b that does not use the bond a–b itself (capped). */
function shortestDetour(p: Prepared, inRing: Uint8Array, a: number, b: number): number {
  const dist = new Map<number, number>([[a, 0]]);
  let frontier = [a];
  for (let d = 1; d <= SMALL_RING - 1 && frontier.length; d++) {
    const next: number[] = [];
    for (const x of frontier) {
      for (let k = p.adjStart[x]; k < p.adjStart[x + 1]; k++) {
        if (!inRing[k]) continue;
        const y = p.adj[k];
        if (x === a && y === b) continue;
        if (y === b) return d;
        if (!dist.has(y)) {
          dist.set(y, d);
          next.push(y);
        }
      }
    }
    frontier = next;
  }
  return Infinity;
}
