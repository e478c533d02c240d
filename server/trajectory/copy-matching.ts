/**
 * Finds which atom of a reference copy is which point of the molecule (graph isomorphism on elements
 * and bonds, hydrogens included). Heavy atoms are matched by backtracking in a breadth-first order of
 * the molecule with element and full degree (hydrogens counted) as the candidate filter; hydrogens
 * then follow their heavy atom, in any order (hydrogens on one atom are interchangeable). A copy
 * whose atoms come in the same order as an earlier copy is checked against that order first, which
 * makes the usual case (every copy written from one residue template) linear.
 */
import type { BondGraph } from './bond-perception';
import type { MoleculeGraph } from './molecule-graph';

export interface CopyMatch {
  ok: true;
  /** atoms[p] = reference atom (0-based, whole system) at molecule point p. */
  atoms: Int32Array;
}

export interface CopyMisfit {
  ok: false;
  /** The reference atom (0-based) where matching stopped fitting. */
  atom: number;
  reason: string;
}

const STEP_LIMIT = 2_000_000;

/** `atoms` are the reference atoms of one candidate copy (any order). */
export function matchCopy(mol: MoleculeGraph, elements: string[], graph: BondGraph, atoms: ArrayLike<number>, template?: Int32Array, templateBase?: number): CopyMatch | CopyMisfit {
  const size = atoms.length;
  if (size !== mol.total) {
    return { ok: false, atom: atoms[Math.min(size, mol.total) - 1] ?? 0, reason: `the copy has ${size} atoms; the molecule has ${mol.total}` };
  }
  const inCopy = new Map<number, number>();
  for (let i = 0; i < size; i++) inCopy.set(atoms[i], i);
  // Elements first: the first atom whose element is one too many names the misfit.
  const need = new Map<string, number>();
  for (const e of mol.elements) need.set(e, (need.get(e) ?? 0) + 1);
  const sorted = Array.from(atoms).sort((a, b) => a - b);
  for (const a of sorted) {
    const left = need.get(elements[a]) ?? 0;
    if (left === 0) return { ok: false, atom: a, reason: `the molecule has no further ${elements[a] || 'unknown'} atom` };
    need.set(elements[a], left - 1);
  }
  for (const a of sorted) {
    for (let k = graph.start[a]; k < graph.start[a + 1]; k++) {
      if (!inCopy.has(graph.adj[k])) return { ok: false, atom: a, reason: `it is bonded to atom ${graph.adj[k] + 1}, outside this copy` };
    }
  }
  if (template && templateBase !== undefined) {
    const shift = atoms[0] - templateBase;
    const moved = template.map((t) => t + shift);
    if (fits(mol, elements, graph, moved)) return { ok: true, atoms: moved };
  }
  return search(mol, elements, graph, sorted);
}

/** Whether `atoms` (molecule point → reference atom) is an isomorphism. */
export function fits(mol: MoleculeGraph, elements: string[], graph: BondGraph, atoms: Int32Array): boolean {
  for (let p = 0; p < mol.total; p++) {
    const a = atoms[p];
    if (a < 0 || a >= elements.length || elements[a] !== mol.elements[p]) return false;
    if (graph.start[a + 1] - graph.start[a] !== mol.start[p + 1] - mol.start[p]) return false;
    for (let k = mol.start[p]; k < mol.start[p + 1]; k++) {
      const b = atoms[mol.adj[k]];
      let found = false;
      for (let j = graph.start[a]; j < graph.start[a + 1]; j++) if (graph.adj[j] === b) found = true;
      if (!found) return false;
    }
  }
  return true;
}

function degree(g: { start: Int32Array }, i: number): number {
  return g.start[i + 1] - g.start[i];
}

function search(mol: MoleculeGraph, elements: string[], graph: BondGraph, sorted: number[]): CopyMatch | CopyMisfit {
  // Heavy points in breadth-first order, each (after a root) reached from an earlier one.
  const heavy: number[] = [];
  const via: number[] = [];
  const seen = new Uint8Array(mol.total);
  for (let root = 0; root < mol.total; root++) {
    if (seen[root] || mol.parent[root] !== root) continue;
    seen[root] = 1;
    heavy.push(root);
    via.push(-1);
    for (let q = heavy.length - 1; q < heavy.length; q++) {
      const u = heavy[q];
      for (let k = mol.start[u]; k < mol.start[u + 1]; k++) {
        const v = mol.adj[k];
        if (seen[v] || mol.parent[v] !== v) continue;
        seen[v] = 1;
        heavy.push(v);
        via.push(u);
      }
    }
  }
  const hCountMol = (p: number): number => {
    let h = 0;
    for (let k = mol.start[p]; k < mol.start[p + 1]; k++) if (mol.parent[mol.adj[k]] === p && mol.adj[k] !== p) h++;
    return h;
  };
  const isRefH = (a: number): boolean => elements[a] === 'H' && degree(graph, a) === 1;
  const hCountRef = (a: number): number => {
    let h = 0;
    for (let k = graph.start[a]; k < graph.start[a + 1]; k++) if (isRefH(graph.adj[k])) h++;
    return h;
  };
  const molH = heavy.map(hCountMol);
  const image = new Int32Array(mol.total).fill(-1);
  const used = new Set<number>();
  const heavyRef = sorted.filter((a) => !isRefH(a));
  let best = 0;
  let bestPlaced: number[] = [];
  let steps = 0;
  const candidates = (depth: number): number[] => {
    const p = heavy[depth];
    const from = via[depth];
    const pool = from < 0 ? heavyRef : Array.from(graph.adj.subarray(graph.start[image[from]], graph.start[image[from] + 1]));
    return pool.filter((a) => !used.has(a) && elements[a] === mol.elements[p] && degree(graph, a) === degree(mol, p) && hCountRef(a) === molH[depth]);
  };
  const consistent = (p: number, a: number): boolean => {
    for (let k = mol.start[p]; k < mol.start[p + 1]; k++) {
      const q = mol.adj[k];
      if (mol.parent[q] !== q || image[q] < 0) continue;
      let found = false;
      for (let j = graph.start[a]; j < graph.start[a + 1]; j++) if (graph.adj[j] === image[q]) found = true;
      if (!found) return false;
    }
    return true;
  };
  const step = (depth: number): boolean => {
    if (depth > best) {
      best = depth;
      bestPlaced = heavy.slice(0, depth).map((p) => image[p]);
    }
    if (depth === heavy.length) return true;
    if (++steps > STEP_LIMIT) return false;
    const p = heavy[depth];
    for (const a of candidates(depth)) {
      if (!consistent(p, a)) continue;
      image[p] = a;
      used.add(a);
      if (step(depth + 1)) return true;
      used.delete(a);
      image[p] = -1;
    }
    return false;
  };
  if (!step(0)) {
    // The first atom (in file order) that the deepest attempt could not place.
    const placed = new Set(bestPlaced);
    const misfit = heavyRef.find((a) => !placed.has(a)) ?? sorted[0];
    return { ok: false, atom: misfit, reason: steps > STEP_LIMIT ? 'the search for its atom order took too long' : 'its bonds do not match the molecule' };
  }
  // Hydrogens follow their heavy atom.
  for (const p of heavy) {
    const a = image[p];
    const hs: number[] = [];
    for (let k = graph.start[a]; k < graph.start[a + 1]; k++) if (isRefH(graph.adj[k])) hs.push(graph.adj[k]);
    let i = 0;
    for (let k = mol.start[p]; k < mol.start[p + 1]; k++) {
      const q = mol.adj[k];
      if (mol.parent[q] === p && q !== p) image[q] = hs[i++];
    }
  }
  return { ok: true, atoms: image };
}
