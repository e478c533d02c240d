import type { Molecule } from './chem';

/**
 * The free ions of a molecule: atoms that carry a charge and are bonded to nothing (Na+, Cl-, Ca2+,
 * and NH4+, whose hydrogens belong to its one atom). Shared by the editor's command that gives each
 * its own bead; the chemistry core lists the same parts as `components` with `freeIon: true`.
 */
export function freeIonAtoms(molecule: Pick<Molecule, 'atoms' | 'bonds'>): number[] {
  const bonded = new Uint8Array(molecule.atoms.length);
  for (const b of molecule.bonds) bonded[b.a] = bonded[b.b] = 1;
  return molecule.atoms.filter((a, i) => a.charge !== 0 && !a.attachment && !bonded[i]).map((a) => a.index);
}
