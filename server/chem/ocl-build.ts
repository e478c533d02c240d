/**
 * Canonical model → a fresh openchemlib molecule with the same atom order (for 2D layout and 3D
 * conformers). With `withHydrogens`, each heavy atom's hydrogens are appended as explicit atoms in the
 * contract's order (grouped by parent, unlabelled first).
 */
import { Molecule } from 'openchemlib';
import type { Atom, Bond } from '../../src/shared/chem';
import { atomicNumber } from './elements';
import type { OclMolecule } from './parse';
import { cleanLayout } from './layout-cleanup';


function bondType(order: number): number {
  if (order === 0) return Molecule.cBondTypeMetalLigand;
  if (order === 2) return Molecule.cBondTypeDouble;
  if (order === 3) return Molecule.cBondTypeTriple;
  return Molecule.cBondTypeSingle;
}

export function toOcl(model: { atoms: Atom[]; bonds: Bond[] }, withHydrogens: boolean): OclMolecule {
  const { atoms, bonds } = model;
  let h = 0;
  if (withHydrogens) for (const a of atoms) h += a.hydrogens;
  const mol = new Molecule(atoms.length + h, bonds.length + h);
  for (const a of atoms) {
    const i = mol.addAtom(atomicNumber(a.element));
    if (a.charge !== 0) mol.setAtomCharge(i, a.charge);
    if (a.isotope !== null) mol.setAtomMass(i, a.isotope);
    if (a.radical > 0) mol.setAtomRadical(i, a.radical === 1 ? Molecule.cAtomRadicalStateD : Molecule.cAtomRadicalStateT);
  }
  for (const b of bonds) {
    const k = mol.addBond(b.a, b.b);
    mol.setBondType(k, bondType(b.order));
  }
  if (withHydrogens) {
    atoms.forEach((a, parent) => {
      const labels = [...Array<number>(a.hydrogens - a.hydrogenIsotopes.length).fill(0), ...a.hydrogenIsotopes];
      for (const iso of labels) {
        const hi = mol.addAtom(1);
        if (iso) mol.setAtomMass(hi, iso);
        mol.setBondType(mol.addBond(parent, hi), Molecule.cBondTypeSingle);
      }
    });
  }
  mol.ensureHelperArrays(Molecule.cHelperRings);
  return mol;
}

/**
 * 2D drawing coordinates (y up) for the model's heavy atoms: openchemlib's coordinate inventor, then
 * a clean-up that moves branches apart where it drew atoms on top of each other (layout-cleanup.ts).
 */
export function layout2d(model: { atoms: Atom[]; bonds: Bond[] }): { x: number; y: number }[] {
  const mol = toOcl(model, false);
  mol.inventCoordinates();
  const raw = model.atoms.map((_, i) => ({ x: mol.getAtomX(i), y: -mol.getAtomY(i) }));
  return cleanLayout(raw, model.bonds).map((p) => ({ x: Math.round(p.x * 1e4) / 1e4, y: Math.round(p.y * 1e4) / 1e4 }));
}
