/**
 * Charged groups: the atoms that a CG model should keep in one bead because they carry one net charge.
 *
 * Rule (ours, documented in docs/chemistry.md): start from every atom with a formal charge; add the
 * central atom a charged terminal atom hangs on (the C of a carboxylate, the S of a sulfonate, the P of
 * a phosphate) and that centre's other terminal O/S/N atoms (the resonance partners). Groups that
 * touch merge. A group whose formal charges sum to zero (a nitro group, an N-oxide) is not charged.
 */
import type { Molecule } from '../../src/shared/chem';
import type { Prepared } from './prepared';

const cache = new WeakMap<Molecule, number[][]>();

export function chargedGroups(molecule: Molecule, p: Prepared): number[][] {
  const hit = cache.get(molecule);
  if (hit) return hit;
  const { atoms } = molecule;
  const parent = Array.from({ length: p.n }, (_, i) => i);
  const inGroup = new Uint8Array(p.n);
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]];
    return i;
  };
  const join = (a: number, b: number): void => {
    inGroup[a] = inGroup[b] = 1;
    parent[find(a)] = find(b);
  };
  const degree = (a: number): number => p.adjStart[a + 1] - p.adjStart[a];
  const terminalHetero = (a: number): boolean => degree(a) === 1 && ['O', 'S', 'N'].includes(atoms[a].element);
  for (let a = 0; a < p.n; a++) {
    if (atoms[a].charge === 0) continue;
    inGroup[a] = 1;
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
      const b = p.adj[k];
      if (atoms[b].charge !== 0) join(a, b);
      if (!terminalHetero(a)) continue;
      join(a, b);
      for (let m = p.adjStart[b]; m < p.adjStart[b + 1]; m++) if (terminalHetero(p.adj[m])) join(b, p.adj[m]);
    }
  }
  const groups = new Map<number, number[]>();
  for (let a = 0; a < p.n; a++) {
    if (!inGroup[a]) continue;
    const r = find(a);
    groups.set(r, [...(groups.get(r) ?? []), a]);
  }
  const charged = [...groups.values()].filter((g) => g.reduce((q, a) => q + atoms[a].charge, 0) !== 0);
  cache.set(molecule, charged);
  return charged;
}
