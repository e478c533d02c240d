import type { Bond } from '../chem';

/**
 * Small rings of the molecule graph, for drawing: the smallest cycle through each bond (up to
 * `maxSize` atoms), deduplicated. That is enough to put a circle in each aromatic ring and a
 * double bond's second line on the ring's inner side; it is not a full SSSR.
 */
export function smallRings(atomCount: number, bonds: readonly Bond[], keep: (b: Bond) => boolean = () => true, maxSize = 8): number[][] {
  const adjacency: number[][] = Array.from({ length: atomCount }, () => []);
  const used = bonds.filter(keep);
  for (const b of used) {
    adjacency[b.a].push(b.b);
    adjacency[b.b].push(b.a);
  }
  const rings = new Map<string, number[]>();
  for (const b of used) {
    const ring = shortestPathAvoiding(adjacency, b.a, b.b, maxSize);
    if (!ring) continue;
    const key = [...ring].sort((x, y) => x - y).join(',');
    if (!rings.has(key)) rings.set(key, ring);
  }
  return [...rings.values()];
}

/** Breadth-first path from `from` to `to` not using the edge between them; null if longer than max. */
function shortestPathAvoiding(adjacency: number[][], from: number, to: number, max: number): number[] | null {
  const parent = new Map<number, number>([[from, -1]]);
  let frontier = [from];
  for (let depth = 1; depth < max && frontier.length; depth++) {
    const next: number[] = [];
    for (const u of frontier) {
      for (const v of adjacency[u]) {
        if (u === from && v === to) continue;
        if (parent.has(v)) continue;
        parent.set(v, u);
        if (v === to) {
          const path = [to];
          for (let w = u; w !== -1; w = parent.get(w)!) path.push(w);
          return path;
        }
        next.push(v);
      }
    }
    frontier = next;
  }
  return null;
}
