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
import { CHUNK_ATOMS, chunkAtoms } from './layout-chunks';


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
  let raw = model.atoms.length > CHUNK_ATOMS ? piecewise(model, mol) : null;
  // The pieces are trusted only when every bond came out at the inventor's one length; else the
  // whole molecule is laid out at once (slower, never wrong).
  if (!raw || !evenBonds(raw, model.bonds)) raw = invented(mol, model.atoms.length);
  return cleanLayout(raw, model.bonds).map((p) => ({ x: Math.round(p.x * 1e4) / 1e4, y: Math.round(p.y * 1e4) / 1e4 }));
}

function evenBonds(points: { x: number; y: number }[], bonds: readonly Bond[]): boolean {
  return bonds.every((b) => Math.abs(Math.hypot(points[b.a].x - points[b.b].x, points[b.a].y - points[b.b].y) - 1) < 0.05);
}

function invented(mol: OclMolecule, n: number): { x: number; y: number }[] {
  mol.inventCoordinates();
  return Array.from({ length: n }, (_, i) => ({ x: mol.getAtomX(i), y: -mol.getAtomY(i) }));
}

/**
 * A large molecule laid out piece by piece (layout-chunks.ts). Each piece is laid out with a stub
 * carbon on every cut bond, where the atom across the cut should go; then, in breadth-first order,
 * each piece is turned and moved rigidly so that its end of a cut bond sits on the placed piece's
 * stub and its own stub on the placed atom.
 */
function piecewise(model: { atoms: Atom[]; bonds: Bond[] }, whole: OclMolecule): { x: number; y: number }[] {
  const n = model.atoms.length;
  const ringBond = new Set<string>();
  for (let b = 0; b < whole.getAllBonds(); b++) if (whole.isRingBond(b)) ringBond.add(`${Math.min(whole.getBondAtom(0, b), whole.getBondAtom(1, b))},${Math.max(whole.getBondAtom(0, b), whole.getBondAtom(1, b))}`);
  const piece = chunkAtoms(n, model.bonds, (a, b) => ringBond.has(`${Math.min(a, b)},${Math.max(a, b)}`));
  const count = Math.max(...piece) + 1;
  const local: { x: number; y: number }[][] = [];
  /** stubs[p] : atom across the cut (global) → its stub's position in piece p's own layout. */
  const stubs: Map<number, { x: number; y: number }>[] = [];
  for (let p = 0; p < count; p++) {
    const atoms = model.atoms.filter((_, i) => piece[i] === p);
    const index = new Map(atoms.map((a, k) => [a.index, k]));
    const cut = model.bonds.filter((b) => (piece[b.a] === p) !== (piece[b.b] === p) && (piece[b.a] === p || piece[b.b] === p));
    const across = cut.map((b) => (piece[b.a] === p ? b.b : b.a));
    const stubAtoms = across.map((g, k): Atom => ({ ...model.atoms[g], index: atoms.length + k, element: 'C', charge: 0, isotope: null, radical: 0, hydrogens: 3, hydrogenIsotopes: [] }));
    const bonds: Bond[] = model.bonds.filter((b) => piece[b.a] === p && piece[b.b] === p).map((b) => ({ ...b, a: index.get(b.a)!, b: index.get(b.b)! }));
    cut.forEach((b, k) => bonds.push({ a: index.get(piece[b.a] === p ? b.a : b.b)!, b: atoms.length + k, order: 1, aromatic: false }));
    const pos = invented(toOcl({ atoms: [...atoms.map((a, k) => ({ ...a, index: k })), ...stubAtoms], bonds }, false), atoms.length + stubAtoms.length);
    local.push(pos.slice(0, atoms.length));
    stubs.push(new Map(across.map((g, k) => [g, pos[atoms.length + k]])));
    atoms.forEach((a, k) => (local[p][k] = { ...local[p][k], i: a.index } as never));
  }
  const out: { x: number; y: number }[] = Array.from({ length: n }, () => ({ x: 0, y: 0 }));
  type Placed = { x: number; y: number } & { i: number };
  const moves: ((q: { x: number; y: number }) => { x: number; y: number })[] = [];
  const place = (p: number, move: (q: { x: number; y: number }) => { x: number; y: number }) => {
    for (const q of local[p] as Placed[]) out[q.i] = move(q);
    moves[p] = move;
  };
  const localOf = (g: number) => (local[piece[g]] as Placed[]).find((q) => q.i === g)!;
  place(0, (q) => q);
  const queue = [0];
  for (let k = 0; k < queue.length; k++) {
    const p = queue[k];
    for (const b of model.bonds) {
      const [u, v] = piece[b.a] === p ? [b.a, b.b] : piece[b.b] === p ? [b.b, b.a] : [-1, -1];
      if (u < 0 || piece[v] === p || moves[piece[v]]) continue;
      const c = piece[v];
      // v goes where the placed piece's stub for v went; its own stub for u goes onto u.
      const vGlobal = moves[p](stubs[p].get(v)!);
      const vLocal = localOf(v);
      const uStubInC = stubs[c].get(u)!;
      const angle = Math.atan2(out[u].y - vGlobal.y, out[u].x - vGlobal.x) - Math.atan2(uStubInC.y - vLocal.y, uStubInC.x - vLocal.x);
      place(c, (q) => rotate(q, vLocal, angle, vGlobal));
      queue.push(c);
    }
  }
  // Pieces of other components (a salt's ions) keep their own layouts, set beside the rest.
  for (let p = 0; p < count; p++) if (!moves[p]) place(p, (q) => ({ x: q.x + 2 * CHUNK_ATOMS ** 0.5 * (p + 1), y: q.y }));
  return out;
}

/** q turned by `angle` about `centre`, then moved so that `centre` lands on `to`. */
function rotate(q: { x: number; y: number }, centre: { x: number; y: number }, angle: number, to: { x: number; y: number }): { x: number; y: number } {
  const [cos, sin] = [Math.cos(angle), Math.sin(angle)];
  const dx = q.x - centre.x;
  const dy = q.y - centre.y;
  return { x: to.x + dx * cos - dy * sin, y: to.y + dx * sin + dy * cos };
}
