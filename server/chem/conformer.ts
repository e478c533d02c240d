/**
 * generateConformer: reproducible 3D coordinates (Å) in the atom-index contract's order.
 *
 * openchemlib's ConformerGenerator (torsion-library based, seeded, bitwise reproducible for a given
 * seed) builds a collision-free conformer of the model with explicit hydrogens; openchemlib's MMFF94s+
 * force field then relaxes it with a capped number of minimiser iterations (more for small molecules,
 * fewer for large ones). The cap bounds the minimisation; the generator's own set-up time is
 * openchemlib's and grows with the number of rotatable bonds (see docs/benchmarks.md). References: T. A. Halgren,
 * J. Comput. Chem. 1996, 17, 490 (MMFF94); the openchemlib ConformerGenerator documentation.
 * The conformer tables load once from openchemlib's own package files (Resources.registerFromNodejs).
 */
import { ConformerGenerator, ForceFieldMMFF94, Resources } from 'openchemlib';
import type { Molecule } from '../../src/shared/chem';
import { ChemError } from './errors';
import { componentsOf } from './graph';
import { toOcl } from './ocl-build';

let registered = false;

export interface ConformerOptions {
  seed: number;
  /** Cap on MMFF94 minimiser iterations; default scales with size. 0 skips minimisation. */
  maxIterations?: number;
}

/**
 * MMFF94 iterations by size. One iteration costs roughly linear-to-quadratic time in atoms (≈0.1–0.5 s
 * at 150 heavy atoms on this project's 2-core machines), so large molecules get only a short relaxation
 * of the generator's already collision-free geometry.
 */
export function defaultIterations(heavyAtoms: number): number {
  if (heavyAtoms <= 30) return 500;
  if (heavyAtoms <= 80) return 100;
  return 20;
}

export async function generateConformer(molecule: Molecule, options: ConformerOptions): Promise<number[][]> {
  if (!Number.isInteger(options.seed)) throw new ChemError('bad_seed', 'The conformer seed must be a whole number.', { seed: options.seed });
  if (!registered) {
    Resources.registerFromNodejs();
    registered = true;
  }
  const iterations = options.maxIterations ?? defaultIterations(molecule.atoms.length);
  // Each disconnected part (a salt's ions) is built on its own and the parts are set side by side with
  // a 4 Å gap along x: openchemlib's generator fails on some multi-part inputs.
  const parts = componentsOf(molecule.atoms.length, molecule.bonds);
  const heavy: number[][] = new Array(molecule.atoms.length);
  const hydrogens: number[][][] = molecule.atoms.map(() => []);
  let shift = 0;
  for (const members of parts) {
    const sub = subModel(molecule, members);
    const xyz = members.length === 1 && sub.atoms[0].hydrogens === 0 ? [[0, 0, 0]] : conformerOf(sub, options.seed, iterations);
    const xs = xyz.map((c) => c[0]);
    const dx = shift - Math.min(...xs);
    const moved = xyz.map(([x, y, z]) => [x + dx, y, z]);
    shift += Math.max(...xs) - Math.min(...xs) + 4;
    let h = members.length;
    members.forEach((a, i) => {
      heavy[a] = moved[i];
      for (let k = 0; k < sub.atoms[i].hydrogens; k++, h++) if (!molecule.atoms[a].attachment) hydrogens[a].push(moved[h]);
    });
  }
  return [...heavy, ...hydrogens.flat()];
}

function conformerOf(sub: Pick<Molecule, 'atoms' | 'bonds'>, seed: number, iterations: number): number[][] {
  let generated: ReturnType<typeof toOcl> | null;
  try {
    generated = new ConformerGenerator(seed).getOneConformerAsMolecule(toOcl(sub, true));
  } catch {
    generated = null;
  }
  if (!generated) throw new ChemError('conformer_failed', 'No collision-free 3D conformer could be built for this molecule.');
  if (iterations > 0) {
    try {
      new ForceFieldMMFF94(generated, ForceFieldMMFF94.MMFF94SPLUS).minimise({ maxIts: iterations });
    } catch {
      // MMFF94 has no parameters for some elements (metals, B, Si …); keep the unrelaxed conformer.
    }
  }
  return readBack(sub, generated);
}

/**
 * The atoms of one part. An attachment point is built as a methyl carbon: it then sits where the next
 * unit's carbon would (C–C 1.53 Å, tetrahedral), and its three hydrogens are dropped on reading back.
 */
function subModel(molecule: Molecule, members: number[]): Pick<Molecule, 'atoms' | 'bonds'> {
  const local = new Map(members.map((a, i) => [a, i]));
  return {
    atoms: members.map((a, i) => {
      const atom = molecule.atoms[a];
      return atom.attachment ? { ...atom, index: i, element: 'C', hydrogens: 3 } : { ...atom, index: i };
    }),
    bonds: molecule.bonds.filter((b) => local.has(b.a)).map((b) => ({ ...b, a: local.get(b.a)!, b: local.get(b.b)! })),
  };
}

/** Coordinates in our order: heavy atoms by index, then each parent's hydrogens in contract order. */
function readBack(molecule: Pick<Molecule, 'atoms'>, mol: ReturnType<typeof toOcl>): number[][] {
  const n = molecule.atoms.length;
  const xyz = (i: number): number[] => [mol.getAtomX(i), -mol.getAtomY(i), -mol.getAtomZ(i)];
  const out: number[][] = [];
  for (let i = 0; i < n; i++) {
    if (mol.getAtomLabel(i) !== molecule.atoms[i].element) throw new Error(`conformer atom ${i} moved`);
    out.push(xyz(i));
  }
  const hOf: number[][] = Array.from({ length: n }, () => []);
  for (let h = n; h < mol.getAllAtoms(); h++) {
    const parent = mol.getConnAtom(h, 0);
    if (mol.getAtomicNo(h) !== 1 || parent < 0 || parent >= n) throw new Error(`conformer atom ${h} is not a hydrogen of a heavy atom`);
    hOf[parent].push(h);
  }
  molecule.atoms.forEach((a, i) => {
    const hs = hOf[i].sort((p, q) => (mol.getAtomMass(p) > 0 ? 1 : 0) - (mol.getAtomMass(q) > 0 ? 1 : 0) || p - q);
    if (hs.length !== a.hydrogens) throw new Error(`conformer gave atom ${i} ${hs.length} hydrogens, expected ${a.hydrogens}`);
    for (const h of hs) out.push(xyz(h));
  });
  return out;
}
