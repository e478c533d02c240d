import type { Atom, Bond, Molecule } from '../chem';
import type { MoleculeSketch } from '../molecules';

/** A list's compact sketch back as the atoms and bonds the renderer draws from. */
export function sketchToMolecule(sketch: MoleculeSketch): Pick<Molecule, 'atoms' | 'bonds'> {
  const atoms = sketch.atoms.map(([element, x, y, charge, hydrogens, isotope, attachment], index): Atom => ({
    index,
    element,
    isotope: isotope ? isotope : null,
    charge: charge ?? 0,
    aromatic: false,
    hydrogens: hydrogens ?? 0,
    hydrogenIsotopes: [],
    radical: 0,
    x,
    y,
    ...(attachment === 1 ? { attachment: true as const } : {}),
  }));
  const bonds = sketch.bonds.map(([a, b, order, aromatic]): Bond => ({ a, b, order, aromatic: aromatic === 1 }));
  return { atoms, bonds };
}
