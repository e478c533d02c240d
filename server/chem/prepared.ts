/**
 * Per-molecule data that every evaluation needs, computed once (O(atoms + bonds)) and cached by
 * molecule object: unit masses, hydrogen masses, where each atom's hydrogens sit in a coordinate list,
 * and the bond graph as adjacency arrays.
 */
import { isHeavyAtom, type Molecule } from '../../src/shared/chem';
import { atomMass } from './atomic-weights';
import { hydrogenMasses } from './masses';

export interface Prepared {
  n: number;
  unitMass: Float64Array;
  ownMass: Float64Array;
  /** Hydrogen masses of atom a: hMass[hStart[a] - n … hStart[a] - n + hCount[a]). */
  hMass: Float64Array;
  hStart: Int32Array;
  hCount: Int32Array;
  totalPoints: number;
  heavy: Uint8Array;
  /** Neighbours of a: adj[adjStart[a] … adjStart[a + 1]). */
  adjStart: Int32Array;
  adj: Int32Array;
  /** Bond order of each adjacency entry. */
  adjOrder: Int8Array;
}

const cache = new WeakMap<Molecule, Prepared>();

export function prepare(molecule: Molecule): Prepared {
  const hit = cache.get(molecule);
  if (hit) return hit;
  const { atoms, bonds } = molecule;
  const n = atoms.length;
  const unitMass = new Float64Array(n);
  const ownMass = new Float64Array(n);
  const hStart = new Int32Array(n);
  const hCount = new Int32Array(n);
  const heavy = new Uint8Array(n);
  const hm: number[] = [];
  let next = n;
  atoms.forEach((a, i) => {
    ownMass[i] = atomMass(a.element, a.isotope);
    let m = ownMass[i];
    hStart[i] = next;
    hCount[i] = a.hydrogens;
    for (const h of hydrogenMasses(a)) {
      hm.push(h);
      m += h;
    }
    next += a.hydrogens;
    unitMass[i] = m;
    heavy[i] = isHeavyAtom(a) ? 1 : 0;
  });
  const degree = new Int32Array(n + 1);
  for (const b of bonds) {
    degree[b.a + 1]++;
    degree[b.b + 1]++;
  }
  for (let i = 0; i < n; i++) degree[i + 1] += degree[i];
  const adjStart = degree.slice();
  const fill = degree.slice(0, n);
  const adj = new Int32Array(2 * bonds.length);
  const adjOrder = new Int8Array(2 * bonds.length);
  for (const b of bonds) {
    adjOrder[fill[b.a]] = b.order;
    adj[fill[b.a]++] = b.b;
    adjOrder[fill[b.b]] = b.order;
    adj[fill[b.b]++] = b.a;
  }
  const prepared = { n, unitMass, ownMass, hMass: Float64Array.from(hm), hStart, hCount, totalPoints: next, heavy, adjStart, adj, adjOrder };
  cache.set(molecule, prepared);
  return prepared;
}
