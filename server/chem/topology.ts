/**
 * Coarse-grained topology from a mapping.
 *
 * Two beads are bonded when an atomistic bond joins an atom of one to an atom of the other, or when
 * they share an atom. Angles are all bead triples i–j–k with i–j and j–k bonded (i ≠ k); proper
 * dihedrals all quadruples i–j–k–l along bonded pairs with i, j, k, l distinct. Rings: for each bond
 * that closes a cycle in a breadth-first spanning forest, the shortest cycle through that bond (a
 * cycle basis of smallest rings, the usual candidates for constraints). All linear in bonds except the
 * rings, which cost one breadth-first search per ring.
 */
import type { Topology } from '../../src/shared/chem';
import type { Prepared } from './prepared';

/** beadsOf[a] = indices of the beads that hold atom a. */
export function beadGraph(p: Prepared, beadsOf: number[][], beadCount: number): Set<number>[] {
  const neighbours = Array.from({ length: beadCount }, () => new Set<number>());
  const link = (x: number, y: number): void => {
    if (x === y) return;
    neighbours[x].add(y);
    neighbours[y].add(x);
  };
  for (let a = 0; a < p.n; a++) {
    const here = beadsOf[a];
    for (let i = 0; i < here.length; i++) for (let j = i + 1; j < here.length; j++) link(here[i], here[j]);
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
      const b = p.adj[k];
      if (b < a) continue;
      for (const x of here) for (const y of beadsOf[b]) link(x, y);
    }
  }
  return neighbours;
}

export function topologyOf(neighbours: Set<number>[], ids: string[]): Topology {
  const sorted = neighbours.map((s) => [...s].sort((x, y) => x - y));
  const bonds: [string, string][] = [];
  const angles: [string, string, string][] = [];
  const dihedrals: [string, string, string, string][] = [];
  sorted.forEach((nb, j) => {
    for (const k of nb) if (j < k) bonds.push([ids[j], ids[k]]);
    for (let x = 0; x < nb.length; x++) for (let y = x + 1; y < nb.length; y++) angles.push([ids[nb[x]], ids[j], ids[nb[y]]]);
  });
  sorted.forEach((nj, j) => {
    for (const k of nj) {
      if (k < j) continue;
      for (const i of nj) {
        if (i === k) continue;
        for (const l of sorted[k]) if (l !== j && l !== i) dihedrals.push([ids[i], ids[j], ids[k], ids[l]]);
      }
    }
  });
  return { bonds, angles, dihedrals, rings: ringsOf(sorted).map((r) => r.map((b) => ids[b])) };
}

function ringsOf(adj: number[][]): number[][] {
  const n = adj.length;
  const seen = new Int8Array(n);
  const parent = new Int32Array(n).fill(-1);
  const closing: [number, number][] = [];
  for (let s = 0; s < n; s++) {
    if (seen[s]) continue;
    seen[s] = 1;
    const queue = [s];
    for (let q = 0; q < queue.length; q++) {
      const u = queue[q];
      for (const v of adj[u]) {
        if (!seen[v]) {
          seen[v] = 1;
          parent[v] = u;
          queue.push(v);
        } else if (v !== parent[u] && u < v && parent[v] !== u) closing.push([u, v]);
      }
    }
  }
  const rings: number[][] = [];
  const keys = new Set<string>();
  for (const [u, v] of closing) {
    const path = shortestPathAvoiding(adj, u, v);
    if (!path) continue;
    const key = [...path].sort((x, y) => x - y).join(',');
    if (keys.has(key)) continue;
    keys.add(key);
    rings.push(path);
  }
  return rings;
}

/** Shortest path u → v not using the edge u–v itself. */
function shortestPathAvoiding(adj: number[][], u: number, v: number): number[] | null {
  const prev = new Map<number, number>([[u, -1]]);
  const queue = [u];
  for (let q = 0; q < queue.length; q++) {
    const x = queue[q];
    for (const y of adj[x]) {
      if ((x === u && y === v) || prev.has(y)) continue;
      prev.set(y, x);
      if (y === v) {
        const path = [v];
        for (let c = x; c !== -1; c = prev.get(c)!) path.push(c);
        return path.reverse();
      }
      queue.push(y);
    }
  }
  return null;
}
