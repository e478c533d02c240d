/**
 * Masses from our CIAAW 2021 table (atomic-weights.ts).
 *
 * An atom's unit mass is its own mass plus its hydrogens' (labelled hydrogens at their isotope mass).
 * Molecular weight = Σ unit masses. Bead mass = Σ weight × unit mass over the bead's atoms.
 */
import type { Atom } from '../../src/shared/chem';
import { atomMass } from './atomic-weights';

export function hydrogenMasses(atom: Atom): number[] {
  const plain = atom.hydrogens - atom.hydrogenIsotopes.length;
  const out: number[] = [];
  for (let i = 0; i < plain; i++) out.push(atomMass('H', null));
  for (const iso of atom.hydrogenIsotopes) out.push(atomMass('H', iso));
  return out;
}

export function unitMass(atom: Atom): number {
  let m = atomMass(atom.element, atom.isotope);
  for (const h of hydrogenMasses(atom)) m += h;
  return m;
}

export function molecularWeight(atoms: Atom[]): number {
  let sum = 0;
  for (const a of atoms) sum += unitMass(a);
  return sum;
}
