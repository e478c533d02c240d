/**
 * Symmetry classes of a molecule's atoms for the mapping proposal (propose.ts).
 *
 * Method: colour refinement (the Weisfeiler–Lehman / Morgan idea). Every atom starts with an invariant
 * (element, isotope, charge, hydrogens, aromaticity, radical, attachment point, degree); each round an
 * atom's colour becomes its old colour plus the sorted list of (neighbour colour, bond kind), until the
 * number of colours stops growing. Bonds count as aromatic or by order, so the two Kekulé forms of a
 * ring give the same classes. Colours are numbered by sorting their descriptions, never by atom index,
 * so the same molecule entered with another atom order gets the same class for the same atom.
 * Atoms of one automorphism orbit always share a class; in rare highly regular graphs refinement may
 * also join atoms that are not equivalent (then the proposal treats them as equivalent: harmless).
 */
import type { Molecule } from '../../src/shared/chem';
import type { Prepared } from './prepared';

export function symmetryClasses(molecule: Molecule, p: Prepared): Int32Array {
  const n = p.n;
  const bondKind = new Map<number, string>();
  for (const b of molecule.bonds) bondKind.set(b.a * n + b.b, b.aromatic ? 'a' : String(b.order));
  const kind = (a: number, b: number): string => bondKind.get(Math.min(a, b) * n + Math.max(a, b)) ?? '1';
  const initial = molecule.atoms.map((a, i) =>
    [a.element, a.isotope ?? 0, a.charge, a.hydrogens, a.aromatic ? 1 : 0, a.radical, a.attachment ? 1 : 0, p.adjStart[i + 1] - p.adjStart[i]].join(','),
  );
  let classes = number(initial);
  let count = distinct(classes);
  // Neighbour lists with bond kinds, once.
  const around: { b: number; k: string }[][] = [];
  for (let a = 0; a < n; a++) {
    const list: { b: number; k: string }[] = [];
    for (let j = p.adjStart[a]; j < p.adjStart[a + 1]; j++) list.push({ b: p.adj[j], k: kind(a, p.adj[j]) });
    around.push(list);
  }
  for (let round = 0; round < n; round++) {
    const described = around.map((list, a) => `${classes[a]}|${list.map(({ b, k }) => `${classes[b]}${k}`).sort().join(' ')}`);
    const next = number(described);
    const nextCount = distinct(next);
    classes = next;
    if (nextCount === count) break;
    count = nextCount;
  }
  return classes;
}

/** Numbers strings by their sorted order (equal strings, equal numbers). */
function number(described: string[]): Int32Array {
  const sorted = [...new Set(described)].sort();
  const id = new Map(sorted.map((s, i) => [s, i]));
  return Int32Array.from(described, (s) => id.get(s)!);
}

function distinct(classes: Int32Array): number {
  return new Set(classes).size;
}
