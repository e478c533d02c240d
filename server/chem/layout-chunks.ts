/**
 * Cutting a large molecule into pieces for 2D layout. openchemlib's coordinate inventor grows about
 * with the square of the atom count (≈ 1 s at 1,000 and 5–15 s at 2,000 heavy atoms on one core) and
 * folds long chains with side rings onto themselves (a 1,926-atom polystyrene in one piece had 440
 * pairs of atoms closer than half a bond), so a molecule above LARGE_MOLECULE heavy atoms is laid
 * out piece by piece: pieces of at most PIECE_ATOMS are grown breadth-first over whole ring systems
 * and chain atoms (a ring is never cut), each cut at chain bonds (bonds in no ring).
 * layout-pieces.ts lays out each piece with a stub atom at each cut bond and joins the pieces rigidly
 * at those bonds; layout-cleanup.ts then separates whatever the joined pieces overlap.
 */

/** The polystyrene 18-mer (150 atoms) still comes out clean from one piece. */
export const LARGE_MOLECULE = 200;
/**
 * Piece sizes tried in turn until the joined drawing has no clash: 60 heavy atoms is small enough
 * that the inventor draws a polystyrene piece without crowding its rings; a polymer with long plain
 * chains between side groups joins with fewer clashes from pieces of 150.
 */
export const PIECE_ATOMS = [60, 150];

/** Piece number of every atom; pieces are connected and numbered in breadth-first order from piece 0. */
export function chunkAtoms(n: number, bonds: readonly { a: number; b: number }[], ringBond: (a: number, b: number) => boolean, limit = PIECE_ATOMS[0]): number[] {
  const adj: number[][] = Array.from({ length: n }, () => []);
  for (const b of bonds) {
    adj[b.a].push(b.b);
    adj[b.b].push(b.a);
  }
  // Blocks: atoms joined by ring bonds (a ring system), or a single chain atom.
  const block = new Int32Array(n).fill(-1);
  const members: number[][] = [];
  for (let s = 0; s < n; s++) {
    if (block[s] !== -1) continue;
    const id = members.length;
    const list = [s];
    block[s] = id;
    for (let q = 0; q < list.length; q++) {
      for (const v of list[q] === undefined ? [] : adj[list[q]]) {
        if (block[v] === -1 && ringBond(list[q], v)) {
          block[v] = id;
          list.push(v);
        }
      }
    }
    members.push(list);
  }
  const chunk = new Int32Array(n).fill(-1);
  let next = 0;
  for (let s = 0; s < n; s++) {
    if (chunk[s] !== -1) continue;
    // A new piece from a seed block; the blocks it could not take become seeds of their own pieces later.
    const seeds = [block[s]];
    while (seeds.length) {
      const seed = seeds.shift()!;
      if (chunk[members[seed][0]] !== -1) continue;
      const id = next++;
      let size = 0;
      const queue = [seed];
      for (let q = 0; q < queue.length; q++) {
        const bl = queue[q];
        if (chunk[members[bl][0]] !== -1) continue;
        if (size > 0 && size + members[bl].length > limit) {
          seeds.push(bl);
          continue;
        }
        for (const a of members[bl]) chunk[a] = id;
        size += members[bl].length;
        for (const a of members[bl]) for (const v of adj[a]) if (chunk[v] === -1) queue.push(block[v]);
      }
    }
  }
  return Array.from(chunk);
}
