/**
 * Free ions: atoms bonded to nothing that carry a charge (Na+, Cl-, Ca2+, and NH4+ or H3O+, whose
 * hydrogens belong to the one atom). Such a counter-ion is a bead of its own in a CG model: there is
 * nothing to merge it with, so it gets no bead-size finding (docs/chemistry.md, "Components").
 */
import type { Molecule } from '../../src/shared/chem';
import type { Prepared } from './prepared';

export function isFreeIon(molecule: Molecule, p: Prepared, atom: number): boolean {
  const a = molecule.atoms[atom];
  return a.charge !== 0 && !a.attachment && p.adjStart[atom + 1] === p.adjStart[atom];
}
