/**
 * Typical bond lengths and bond angles for building a 3D structure (embed-3d.ts).
 *
 * Common practice, no source (textbook values, from memory): C–C 1.53 Å between sp3 carbons, 1.51 sp3–sp2,
 * 1.47 between conjugated sp2 carbons, C=C 1.34, C≡C 1.20, aromatic 1.39; C–H 1.09, N–H 1.01, O–H 0.96,
 * S–H 1.34; C–N 1.47 (1.36 at an sp2 carbon), C=N 1.28, C≡N 1.16, aromatic C–N 1.34; C–O 1.43 (1.35 at an
 * sp2 carbon), C=O 1.21; C–S 1.82, C=S 1.67, aromatic C–S 1.71; C–F 1.35, C–Cl 1.77, C–Br 1.94, C–I 2.14;
 * S=O 1.44, P=O 1.49; angles 109.47° (four neighbours), 120° (trigonal), 180° (linear), and the ring's
 * own angle in three- to five-membered rings. Pairs not in the table use the sum of single-bond covalent
 * radii (P. Pyykkö, M. Atsumi, Chem. Eur. J. 2009, 15, 186; values from memory) shortened by Pauling's
 * bond-order rule, 0.71 Å × log10(order) (L. Pauling, J. Am. Chem. Soc. 1947, 69, 542).
 */
import type { Atom, Bond } from '../../src/shared/chem';

export type Hybrid = 'sp' | 'sp2' | 'sp3' | 'other';

const RADIUS: Record<string, number> = {
  H: 0.32, Li: 1.33, Be: 1.02, B: 0.85, C: 0.75, N: 0.71, O: 0.63, F: 0.64, Na: 1.55, Mg: 1.39, Al: 1.26, Si: 1.16,
  P: 1.11, S: 1.03, Cl: 0.99, K: 1.96, Ca: 1.71, Zn: 1.18, Ge: 1.21, As: 1.21, Se: 1.16, Br: 1.14, Sn: 1.4, Sb: 1.4,
  Te: 1.36, I: 1.33,
};
const DEFAULT_RADIUS = 1.3;

/** Hybridisation of each atom from its neighbours (hydrogens counted) and bond orders. */
export function hybridisation(atoms: readonly Atom[], bonds: readonly Bond[]): Hybrid[] {
  const degree = atoms.map((a) => a.hydrogens);
  const doubles = atoms.map(() => 0);
  const triple = atoms.map(() => false);
  const aromatic = atoms.map((a) => a.aromatic);
  for (const b of bonds) {
    for (const i of [b.a, b.b]) {
      degree[i]++;
      if (b.aromatic) aromatic[i] = true;
      else if (b.order === 2) doubles[i]++;
      else if (b.order === 3) triple[i] = true;
    }
  }
  const base: Hybrid[] = atoms.map((_, i) => {
    if (degree[i] > 4) return 'other';
    if (degree[i] === 4) return 'sp3';
    if (triple[i] || doubles[i] >= 2) return 'sp';
    if (aromatic[i] || doubles[i] === 1) return 'sp2';
    return 'sp3';
  });
  // A nitrogen next to a conjugated atom (amide, aniline, enamine) is planar: its lone pair is shared.
  return base.map((h, i) => {
    if (h !== 'sp3' || atoms[i].element !== 'N' || degree[i] !== 3) return h;
    const conjugated = bonds.some((b) => (b.a === i || b.b === i) && base[b.a === i ? b.b : b.a] === 'sp2');
    return conjugated ? 'sp2' : h;
  });
}

const pair = (x: string, y: string) => (x < y ? `${x}${y}` : `${y}${x}`);

/** Typical length (Å) of a bond between two heavy atoms. */
export function bondLength(atoms: readonly Atom[], hybrid: readonly Hybrid[], bond: Bond): number {
  const [i, j] = [bond.a, bond.b];
  const [x, y] = [atoms[i].element, atoms[j].element];
  const key = pair(x, y);
  const sp2 = hybrid[i] !== 'sp3' || hybrid[j] !== 'sp3';
  if (bond.aromatic) {
    const aromaticLengths: Record<string, number> = { CC: 1.39, CN: 1.34, NN: 1.35, CO: 1.36, CS: 1.71 };
    if (aromaticLengths[key]) return aromaticLengths[key];
    return fallback(x, y, 1.5);
  }
  if (bond.order === 1) {
    if (key === 'CC') {
      const rank = (h: Hybrid) => (h === 'sp3' ? 0 : h === 'sp2' ? 1 : 2);
      return [[1.53, 1.51, 1.47], [1.51, 1.47, 1.43], [1.47, 1.43, 1.38]][rank(hybrid[i])][rank(hybrid[j])];
    }
    const single: Record<string, [number, number]> = {
      CN: [1.47, 1.36], CO: [1.43, 1.35], CS: [1.82, 1.76], CF: [1.35, 1.34], CCl: [1.77, 1.73], BrC: [1.94, 1.89],
      CI: [2.14, 2.1], NN: [1.45, 1.4], NO: [1.4, 1.36], OO: [1.48, 1.48], SS: [2.05, 2.05], OS: [1.58, 1.58],
      OP: [1.6, 1.6], CP: [1.84, 1.8], CSi: [1.87, 1.87], OSi: [1.64, 1.64], BC: [1.57, 1.55], BO: [1.37, 1.37],
    };
    const s = single[key];
    const length = s ? s[sp2 ? 1 : 0] : fallback(x, y, 1);
    // A terminal O− or S− on a centre with a double bond shares it by resonance (carboxylate, sulfonate,
    // nitro, phosphate): halfway between single and double.
    const terminalAnion = [i, j].some((k) => atoms[k].charge < 0 && (atoms[k].element === 'O' || atoms[k].element === 'S') && atoms[k].hydrogens === 0);
    if (terminalAnion && sp2) return (length + doubleLength(x, y)) / 2;
    if (terminalAnion && (x === 'S' || y === 'S' || x === 'P' || y === 'P')) return (length + doubleLength(x, y)) / 2;
    return length;
  }
  if (bond.order === 2) return doubleLength(x, y);
  if (bond.order === 3) {
    const triple: Record<string, number> = { CC: 1.2, CN: 1.16 };
    return triple[key] ?? fallback(x, y, 3);
  }
  return fallback(x, y, 1) + 0.3; // a metal–ligand (order 0) link: a longer, weaker contact
}

function doubleLength(x: string, y: string): number {
  const double: Record<string, number> = { CC: 1.34, CN: 1.28, CO: 1.21, CS: 1.67, NN: 1.25, NO: 1.21, OS: 1.44, OP: 1.49, CP: 1.67 };
  return double[pair(x, y)] ?? fallback(x, y, 2);
}

function fallback(x: string, y: string, order: number): number {
  return (RADIUS[x] ?? DEFAULT_RADIUS) + (RADIUS[y] ?? DEFAULT_RADIUS) - 0.71 * Math.log10(order);
}

const XH: Record<string, number> = { C: 1.09, N: 1.01, O: 0.96, S: 1.34 };

/** Typical length (Å) of a bond from a heavy atom to one of its hydrogens. */
export function hydrogenBondLength(element: string): number {
  return XH[element] ?? (RADIUS[element] ?? DEFAULT_RADIUS) + RADIUS.H;
}

/** The ideal angle (degrees) at a centre of this hybridisation, outside small rings. */
export function idealAngle(h: Hybrid): number | null {
  if (h === 'sp') return 180;
  if (h === 'sp2') return 120;
  if (h === 'sp3') return 109.47;
  return null;
}
