/**
 * Bonds of a reference system from one frame: covalent radii (covalent-radii.ts) with the minimum
 * image when a box is known, found with a cell list so the cost is linear in atoms. CONECT records,
 * when the file has them, are added as bonds as they are.
 */
import { type Box, isUsableBox, minimumImage } from './box';
import { bondRadius, BOND_TOLERANCE, MIN_BOND } from './covalent-radii';

export interface BondGraph {
  /** Neighbours of atom i: adj[start[i] … start[i + 1]). */
  start: Int32Array;
  adj: Int32Array;
}

/** xyz: interleaved coordinates (Å) of every atom; `subset` limits the search to these atoms. */
export function perceiveBonds(elements: string[], xyz: Float32Array | Float64Array, box: Box | null, extra: [number, number][] = [], subset?: Int32Array): BondGraph {
  const n = elements.length;
  const atoms = subset ?? Int32Array.from({ length: n }, (_, i) => i);
  const radius = new Float64Array(n).fill(-1);
  let rMax = 0;
  for (const i of atoms) {
    const r = bondRadius(elements[i]);
    if (r !== null) {
      radius[i] = r;
      rMax = Math.max(rMax, r);
    }
  }
  const cutoff = 2 * rMax + BOND_TOLERANCE;
  const pairs: number[] = [];
  for (const [a, b] of extra) if (a !== b && a >= 0 && b >= 0 && a < n && b < n) pairs.push(a, b);
  if (atoms.length > 0 && rMax > 0) {
    // Cell list over the atoms' bounding box (or the periodic box), cells at least one cut-off wide.
    let lo = [Infinity, Infinity, Infinity];
    let hi = [-Infinity, -Infinity, -Infinity];
    for (const i of atoms) for (let k = 0; k < 3; k++) {
      lo[k] = Math.min(lo[k], xyz[3 * i + k]);
      hi[k] = Math.max(hi[k], xyz[3 * i + k]);
    }
    const periodic = isUsableBox(box) && box[1] === 0 && box[2] === 0 && box[3] === 0 && box[5] === 0 && box[6] === 0 && box[7] === 0;
    if (periodic) {
      lo = [Math.min(lo[0], 0), Math.min(lo[1], 0), Math.min(lo[2], 0)];
      hi = [Math.max(hi[0], box[0]), Math.max(hi[1], box[4]), Math.max(hi[2], box[8])];
    }
    const dims = [0, 1, 2].map((k) => Math.max(1, Math.min(200, Math.floor((hi[k] - lo[k]) / cutoff))));
    const cellOf = (i: number): number => {
      let c = 0;
      for (let k = 0; k < 3; k++) {
        let q = Math.floor(((xyz[3 * i + k] - lo[k]) / (hi[k] - lo[k] || 1)) * dims[k]);
        q = Math.max(0, Math.min(dims[k] - 1, q));
        c = c * dims[k] + q;
      }
      return c;
    };
    const cells = new Map<number, number[]>();
    for (const i of atoms) {
      if (radius[i] < 0) continue;
      const c = cellOf(i);
      const list = cells.get(c);
      if (list) list.push(i);
      else cells.set(c, [i]);
    }
    const d = new Float64Array(3);
    const usable = isUsableBox(box);
    const seen = new Set<number>();
    for (const [c, list] of cells) {
      const cz = c % dims[2];
      const cy = Math.floor(c / dims[2]) % dims[1];
      const cx = Math.floor(c / (dims[1] * dims[2]));
      seen.clear();
      for (let dx = -1; dx <= 1; dx++) for (let dy = -1; dy <= 1; dy++) for (let dz = -1; dz <= 1; dz++) {
        let x = cx + dx;
        let y = cy + dy;
        let z = cz + dz;
        if (periodic) {
          x = (x + dims[0]) % dims[0];
          y = (y + dims[1]) % dims[1];
          z = (z + dims[2]) % dims[2];
        } else if (x < 0 || y < 0 || z < 0 || x >= dims[0] || y >= dims[1] || z >= dims[2]) continue;
        const other = (x * dims[1] + y) * dims[2] + z;
        if (other < c || seen.has(other)) continue;
        seen.add(other);
        const list2 = cells.get(other);
        if (!list2) continue;
        for (const i of list) for (const j of list2) {
          if (other === c && j <= i) continue;
          d[0] = xyz[3 * j] - xyz[3 * i];
          d[1] = xyz[3 * j + 1] - xyz[3 * i + 1];
          d[2] = xyz[3 * j + 2] - xyz[3 * i + 2];
          if (usable) minimumImage(box, d);
          const r2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
          const lim = radius[i] + radius[j] + BOND_TOLERANCE;
          if (r2 < lim * lim && r2 > MIN_BOND * MIN_BOND) pairs.push(i, j);
        }
      }
    }
  }
  return graphOf(n, pairs);
}

/** A bond graph from a flat list of pairs (duplicates dropped). */
export function graphOf(n: number, pairs: number[]): BondGraph {
  const keys = new Set<number>();
  const kept: number[] = [];
  for (let k = 0; k < pairs.length; k += 2) {
    const a = Math.min(pairs[k], pairs[k + 1]);
    const b = Math.max(pairs[k], pairs[k + 1]);
    const key = a * n + b;
    if (keys.has(key)) continue;
    keys.add(key);
    kept.push(a, b);
  }
  const start = new Int32Array(n + 1);
  for (const a of kept) start[a + 1]++;
  for (let i = 0; i < n; i++) start[i + 1] += start[i];
  const fill = start.slice(0, n);
  const adj = new Int32Array(kept.length);
  for (let k = 0; k < kept.length; k += 2) {
    adj[fill[kept[k]]++] = kept[k + 1];
    adj[fill[kept[k + 1]]++] = kept[k];
  }
  return { start, adj };
}
