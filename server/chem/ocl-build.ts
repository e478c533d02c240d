/**
 * Canonical model → a fresh openchemlib molecule with the same atom order (for 2D layout and 3D
 * conformers). With `withHydrogens`, each heavy atom's hydrogens are appended as explicit atoms in the
 * contract's order (grouped by parent, unlabelled first).
 */
import { Molecule } from 'openchemlib';
import type { Atom, Bond } from '../../src/shared/chem';
import { atomicNumber } from './elements';
import type { OclMolecule } from './parse';
import { CLASH, cleanLayout, closePairs, medianBondLength } from './layout-cleanup';
import { relaxLayout } from './layout-relax';
import { LARGE_MOLECULE, PIECE_ATOMS } from './layout-chunks';
import { piecewiseLayout } from './layout-pieces';

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
 * Above LARGE_MOLECULE heavy atoms the inventor (which grows about with the square of the atom count
 * and folds long chains onto themselves) lays out pieces (layout-chunks.ts), joined rigidly at chain
 * bonds (layout-pieces.ts); the piece size whose joined drawing has the fewest clashes is kept.
 */
export function layout2d(model: { atoms: Atom[]; bonds: Bond[] }): { x: number; y: number }[] {
  const raw = model.atoms.length > LARGE_MOLECULE ? inPieces(model) : invented(toOcl(model, false), model.atoms.length);
  let points = cleanLayout(raw, model.bonds);
  // What the rigid moves could not part is pushed apart, bending angles a little (layout-relax.ts).
  if (closePairs(points, model.bonds, CLASH).length) points = relaxLayout(points, model.bonds, medianBondLength(points, model.bonds));
  return points.map((p) => ({ x: Math.round(p.x * 1e4) / 1e4, y: Math.round(p.y * 1e4) / 1e4 }));
}

function inPieces(model: { atoms: Atom[]; bonds: Bond[] }): { x: number; y: number }[] {
  const ring = ringBonds(model);
  let best: { points: { x: number; y: number }[]; clashes: number } | null = null;
  for (const size of PIECE_ATOMS) {
    const points = piecewiseLayout(model, ring, size, (piece) => invented(toOcl(piece, false), piece.atoms.length));
    const clashes = closePairs(points, model.bonds, CLASH).length;
    if (!best || clashes < best.clashes) best = { points, clashes };
    if (clashes === 0) break;
  }
  return best!.points;
}

function ringBonds(model: { atoms: Atom[]; bonds: Bond[] }): (a: number, b: number) => boolean {
  const whole = toOcl(model, false);
  const inRing = new Set<number>();
  const n = model.atoms.length;
  for (let b = 0; b < whole.getAllBonds(); b++) {
    const [a, c] = [whole.getBondAtom(0, b), whole.getBondAtom(1, b)];
    if (whole.isRingBond(b)) inRing.add(Math.min(a, c) * n + Math.max(a, c));
  }
  return (a, b) => inRing.has(Math.min(a, b) * n + Math.max(a, b));
}

function invented(mol: OclMolecule, n: number): { x: number; y: number }[] {
  mol.inventCoordinates();
  return Array.from({ length: n }, (_, i) => ({ x: mol.getAtomX(i), y: -mol.getAtomY(i) }));
}
