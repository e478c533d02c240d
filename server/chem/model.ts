/**
 * openchemlib molecule → Beadloom's canonical atom model (the atom-index contract).
 *
 * Contract: the model's atoms are openchemlib's atoms after parsing, in openchemlib's order, minus every
 * hydrogen bonded to exactly one non-hydrogen atom; those hydrogens (plain or isotope-labelled) are
 * folded into that atom's `hydrogens` count. A hydrogen with no heavy neighbour (H2, a proton) stays an
 * atom. Per-atom 3D data lists the heavy atoms in index order, then the hydrogens grouped by parent in
 * parent order, unlabelled first. openchemlib itself drops explicit [H] from SMILES and may reorder the
 * heavy atoms when it does, so the model's order, not the input string's, is the contract.
 * An attachment point (`*` of a repeat unit or end group) is an atom of its own kind: element '*',
 * `attachment: true`, no hydrogens, no mass; it keeps its place in the order.
 */
import type { Atom, Bond } from '../../src/shared/chem';
import type { OclMolecule } from './parse';

export interface CanonicalModel {
  atoms: Atom[];
  bonds: Bond[];
  /** openchemlib atom index of each model atom. */
  oclIndex: number[];
  /** 3D coordinates in contract order when every hydrogen had coordinates of its own, else null. */
  coordinates3d: number[][] | null;
  foldedExplicitH: number;
}

export function buildModel(mol: OclMolecule, threeD: boolean, attachments: ReadonlySet<number> = new Set()): CanonicalModel {
  const n = mol.getAllAtoms();
  const parentOf = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    if (mol.getAtomicNo(i) !== 1 || mol.getAllConnAtoms(i) !== 1) continue;
    const p = mol.getConnAtom(i, 0);
    if (mol.getAtomicNo(p) !== 1) parentOf[i] = p;
  }
  const modelIndex = new Int32Array(n).fill(-1);
  const oclIndex: number[] = [];
  for (let i = 0; i < n; i++) if (parentOf[i] < 0) modelIndex[i] = oclIndex.push(i) - 1;

  const explicitH: number[][] = oclIndex.map(() => []);
  for (let i = 0; i < n; i++) if (parentOf[i] >= 0) explicitH[modelIndex[parentOf[i]]].push(i);

  const atoms: Atom[] = oclIndex.map((o, index) => {
    if (attachments.has(o)) {
      // An attachment point (`*`, parse.ts): no hydrogens, charge or mass of its own.
      return { index, element: '*', attachment: true, isotope: null, charge: 0, aromatic: false, hydrogens: 0, hydrogenIsotopes: [], radical: 0, x: round(mol.getAtomX(o)), y: round(-mol.getAtomY(o)) };
    }
    const folded = explicitH[index];
    const labelled = folded.map((h) => mol.getAtomMass(h)).filter((m) => m > 0);
    return {
      index,
      element: mol.getAtomLabel(o),
      isotope: mol.getAtomMass(o) > 0 ? mol.getAtomMass(o) : null,
      charge: mol.getAtomCharge(o),
      aromatic: mol.isAromaticAtom(o),
      hydrogens: mol.getImplicitHydrogens(o) + folded.length,
      hydrogenIsotopes: labelled.sort((a, b) => a - b),
      radical: radicalElectrons(mol.getAtomRadical(o)),
      x: round(mol.getAtomX(o)),
      y: round(-mol.getAtomY(o)),
    };
  });

  const bonds: Bond[] = [];
  for (let b = 0; b < mol.getAllBonds(); b++) {
    const a0 = modelIndex[mol.getBondAtom(0, b)];
    const a1 = modelIndex[mol.getBondAtom(1, b)];
    if (a0 < 0 || a1 < 0) continue;
    bonds.push({ a: Math.min(a0, a1), b: Math.max(a0, a1), order: mol.getBondOrder(b), aromatic: mol.isAromaticBond(b) });
  }

  const implicitAnywhere = oclIndex.some((o) => mol.getImplicitHydrogens(o) > 0);
  let coordinates3d: number[][] | null = null;
  if (threeD && !implicitAnywhere) {
    const xyz = (i: number): number[] => [mol.getAtomX(i), -mol.getAtomY(i), -mol.getAtomZ(i)];
    coordinates3d = oclIndex.map(xyz);
    for (const group of explicitH) {
      const plainFirst = [...group].sort((p, q) => (mol.getAtomMass(p) > 0 ? 1 : 0) - (mol.getAtomMass(q) > 0 ? 1 : 0));
      for (const h of plainFirst) coordinates3d.push(xyz(h));
    }
  }
  let foldedExplicitH = 0;
  for (const g of explicitH) foldedExplicitH += g.length;
  return { atoms, bonds, oclIndex, coordinates3d, foldedExplicitH };
}

function radicalElectrons(state: number): number {
  // openchemlib: 16 singlet (2 paired electrons, treated as carbene), 32 doublet, 48 triplet.
  if (state === 32) return 1;
  if (state === 16 || state === 48) return 2;
  return 0;
}

function round(v: number): number {
  return Math.round(v * 1e4) / 1e4;
}
