/**
 * generateConformer: reproducible 3D coordinates (Å) in the atom-index contract's order.
 *
 * Two builders, by size of each disconnected part. Up to GENERATOR_MAX_ATOMS heavy atoms: openchemlib's
 * ConformerGenerator (torsion-library based, seeded, bitwise reproducible for a given seed) builds a
 * collision-free conformer with explicit hydrogens and openchemlib's MMFF94s+ relaxes it with a capped
 * number of minimiser iterations (T. A. Halgren, J. Comput. Chem. 1996, 17, 490). Larger parts: the
 * generator's set-up (a self-organised conformer set for every rigid fragment) grows too fast, so the 2D
 * drawing is lifted into 3D and relaxed with our own geometric force field (embed-3d.ts), seeded and
 * deterministic; a part it cannot relax within its bounds (ACCEPT) goes to openchemlib after all.
 * The conformer tables load once from openchemlib's own package files (Resources.registerFromNodejs).
 */
import { ConformerGenerator, ForceFieldMMFF94, Resources } from 'openchemlib';
import type { Molecule } from '../../src/shared/chem';
import { ChemError } from './errors';
import { componentsOf } from './graph';
import { embed3d } from './embed-3d';
import { contactDistance, contactPosition } from './ion-placement';
import { toOcl } from './ocl-build';

let registered = false;

export interface ConformerOptions {
  seed: number;
  /** Cap on MMFF94 minimiser iterations for openchemlib-built parts; default scales with size. 0 skips it. */
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
  const iterations = options.maxIterations ?? defaultIterations(molecule.heavyAtoms ?? molecule.atoms.length);
  // Each disconnected part is built on its own (openchemlib's generator fails on some multi-part
  // inputs). Parts of more than one atom are set side by side with a 4 Å gap along x; free ions are
  // then put in contact with an atom of opposite charge (ion-placement.ts).
  const parts = componentsOf(molecule.atoms.length, molecule.bonds);
  const isFreeIon = (members: number[]) => members.length === 1 && molecule.atoms[members[0]].charge !== 0 && !molecule.atoms[members[0]].attachment;
  const heavy: (number[] | undefined)[] = new Array(molecule.atoms.length);
  const hydrogens: number[][][] = molecule.atoms.map(() => []);
  const build = (members: number[]): number[][] => {
    const sub = subModel(molecule, members);
    const xyz = members.length === 1 && sub.atoms[0].hydrogens === 0 ? [[0, 0, 0]] : conformerOf(sub, options.seed, iterations);
    return standardHydrogens(sub, xyz);
  };
  const store = (members: number[], xyz: number[][]): void => {
    const sub = subModel(molecule, members);
    let h = members.length;
    members.forEach((a, i) => {
      heavy[a] = xyz[i];
      for (let k = 0; k < sub.atoms[i].hydrogens; k++, h++) if (!molecule.atoms[a].attachment) hydrogens[a].push(xyz[h]);
    });
  };
  let shift = 0;
  const sideBySide = (members: number[], xyz: number[][]): void => {
    const xs = xyz.map((c) => c[0]);
    const dx = shift - Math.min(...xs);
    shift += Math.max(...xs) - Math.min(...xs) + 4;
    store(members, xyz.map(([x, y, z]) => [x + dx, y, z]));
  };
  const ions = parts.filter(isFreeIon).map((p) => p[0]);
  const rest = parts.filter((p) => !isFreeIon(p));
  for (const members of rest) sideBySide(members, build(members));
  if (rest.length === 0 && ions.length > 0) sideBySide([ions[0]], build([ions[0]]));
  const partnerUse = new Map<number, number>();
  for (const ion of ions) {
    if (heavy[ion]) continue;
    const q = molecule.atoms[ion].charge;
    const partners = molecule.atoms.filter((a) => heavy[a.index] && a.charge * q < 0).map((a) => a.index);
    const xyz = build([ion]);
    if (partners.length === 0) {
      sideBySide([ion], xyz);
      continue;
    }
    const partner = partners.reduce((best, p) => ((partnerUse.get(p) ?? 0) < (partnerUse.get(best) ?? 0) ? p : best));
    partnerUse.set(partner, (partnerUse.get(partner) ?? 0) + 1);
    const neighbours = [...molecule.bonds.filter((b) => b.a === partner || b.b === partner).map((b) => heavy[b.a === partner ? b.b : b.a]!), ...hydrogens[partner]];
    const others = [...heavy.filter((p): p is number[] => !!p), ...hydrogens.flat()];
    const at = contactPosition(heavy[partner]!, neighbours, others, contactDistance(molecule.atoms[ion].element));
    store([ion], xyz.map((p) => p.map((v, k) => v - xyz[0][k] + at[k])));
  }
  return [...(heavy as number[][]), ...hydrogens.flat()];
}

/**
 * X–H bonds set to typical lengths along the generator's direction (C–H 1.09, N–H 1.01, O–H 0.96,
 * S–H 1.34 Å; common practice, no source): openchemlib's generator places hydrogens about 1.04 Å from
 * carbon, and the short minimisation that fits the time budget does not move them far enough.
 */
const XH_LENGTH: Record<string, number> = { C: 1.09, N: 1.01, O: 0.96, S: 1.34 };

function standardHydrogens(sub: Pick<Molecule, 'atoms'>, xyz: number[][]): number[][] {
  const out = xyz.map((p) => [...p]);
  let h = sub.atoms.length;
  sub.atoms.forEach((a, i) => {
    const length = XH_LENGTH[a.element];
    for (let k = 0; k < a.hydrogens; k++, h++) {
      if (!length) continue;
      const d = out[h].map((v, c) => v - out[i][c]);
      const n = Math.hypot(...d);
      if (n > 1e-6) out[h] = out[i].map((v, c) => v + (d[c] * length) / n);
    }
  });
  return out;
}

/**
 * Parts above this many heavy atoms are built from their 2D drawing (embed-3d.ts): openchemlib's
 * generator builds every rigid fragment with its self-organiser first, which took 7–17 s at 50 heavy
 * atoms and 30–50 s at 150 on the shared machine; the drawing lifted to 3D and relaxed takes under 1 s
 * of CPU at 150. Small parts keep openchemlib's torsion-library conformer and MMFF94s+ relaxation.
 */
export const GENERATOR_MAX_ATOMS = 30;

/**
 * When an embedding is accepted (Å): every bond within 0.05 of its typical length, every 1–3 distance
 * within 0.35 of its ideal angle's (about 15°), no two atoms three or more bonds apart more than 0.6
 * inside their contact distance. Our bounds, loose enough for strained rings and cages.
 */
const ACCEPT = { bond: 0.05, angle: 0.35, contact: 0.6 };
const EMBED_STARTS = 3;

function embedded(sub: Pick<Molecule, 'atoms' | 'bonds'>, seed: number): number[][] | null {
  // Up to three starts (the seed, then seeds derived from it); the first acceptable one is kept.
  for (let k = 0; k < EMBED_STARTS; k++) {
    const r = embed3d(sub, seed + k * 7919);
    if (r.worstBond <= ACCEPT.bond && r.worstAngle <= ACCEPT.angle && r.worstContact <= ACCEPT.contact) return r.xyz;
  }
  return null;
}

function conformerOf(sub: Pick<Molecule, 'atoms' | 'bonds'>, seed: number, iterations: number): number[][] {
  if (sub.atoms.length > GENERATOR_MAX_ATOMS) {
    const xyz = embedded(sub, seed);
    // A structure the embedding cannot relax (a tangled drawing, a strained cage) goes to openchemlib.
    if (xyz) return xyz;
  }
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
