/**
 * The molecule as every atom of an all-atom reference sees it: the atom-index contract's points
 * (heavy atoms in index order, then each atom's hydrogens grouped by parent; docs/chemistry.md) with
 * their elements and bonds, hydrogens included.
 */
import type { Molecule } from '../../src/shared/chem';
import { graphOf } from './bond-perception';

export interface MoleculeGraph {
  /** Heavy (model) atoms; points n … total-1 are the folded hydrogens. */
  n: number;
  total: number;
  elements: string[];
  /** Neighbours of point i: adj[start[i] … start[i + 1]). */
  start: Int32Array;
  adj: Int32Array;
  /** Parent (model atom) of each point; a model atom is its own parent. */
  parent: Int32Array;
  hydrogens: number;
}

export function moleculeGraph(m: Pick<Molecule, 'atoms' | 'bonds'>): MoleculeGraph {
  const n = m.atoms.length;
  const elements = m.atoms.map((a) => a.element);
  const parent: number[] = m.atoms.map((_, i) => i);
  const pairs: number[] = [];
  for (const b of m.bonds) pairs.push(b.a, b.b);
  m.atoms.forEach((a, i) => {
    for (let k = 0; k < a.hydrogens; k++) {
      pairs.push(i, elements.length);
      parent.push(i);
      elements.push('H');
    }
  });
  const total = elements.length;
  const { start, adj } = graphOf(total, pairs);
  return { n, total, elements, start, adj, parent: Int32Array.from(parent), hydrogens: elements.filter((e) => e === 'H').length };
}

/** Element counts, e.g. { C: 12, H: 25, O: 4, S: 1 }. */
export function composition(elements: Iterable<string>): Map<string, number> {
  const out = new Map<string, number>();
  for (const e of elements) out.set(e, (out.get(e) ?? 0) + 1);
  return out;
}

/**
 * A breadth-first spanning forest of the molecule: `order` lists points so each one's `via` (the
 * point it is reached from, -1 for a root) comes before it. Making a copy whole walks this order.
 */
export function spanningOrder(g: MoleculeGraph): { order: Int32Array; via: Int32Array } {
  const via = new Int32Array(g.total).fill(-2);
  const order: number[] = [];
  for (let root = 0; root < g.total; root++) {
    if (via[root] !== -2) continue;
    via[root] = -1;
    order.push(root);
    for (let q = order.length - 1; q < order.length; q++) {
      const u = order[q];
      for (let k = g.start[u]; k < g.start[u + 1]; k++) {
        const v = g.adj[k];
        if (via[v] !== -2) continue;
        via[v] = u;
        order.push(v);
      }
    }
  }
  return { order: Int32Array.from(order), via };
}
