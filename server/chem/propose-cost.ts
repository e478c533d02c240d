/**
 * Costs of a mapping proposal (propose.ts). Lower is better; the numbers are ours (common practice,
 * no source), chosen so that the terms rank in this order: symmetry, bead sizes, ring pieces, then
 * fewer cut bonds, then similar partition contributions inside a bead.
 *
 *   bead size      (s − target)² for a bead of s heavy atoms, + 20 per atom outside [min, max]
 *                  (resolution.ts); a free ion's bead costs 0; a bead holding a ring piece costs
 *                  2 per atom above max(target, 3), 20 per atom above max, otherwise nothing here
 *   ring pieces    propose-rings.ts (0 for 2 ring atoms, 0.5 for 3, …)
 *   cut bonds      CUT_COST per bond between two beads
 *   partition      LOGP_COST × |logP_a − logP_b| per bond inside a bead (Wildman–Crippen atom
 *                  contributions, hydrogens included)
 *   symmetry       SYMMETRY_COST per symmetry class whose atoms sit in beads of different composition;
 *                  25, more than one heavy atom outside the size limits (20), so a symmetric proposal
 *                  with one bead a size too large (cyclopentane as one bead at 3:1) wins over an
 *                  asymmetric one that fits
 */
import type { Molecule } from '../../src/shared/chem';
import type { Prepared } from './prepared';

export interface SizeLimits {
  target: number;
  min: number;
  max: number;
}

export const CUT_COST = 0.1;
export const LOGP_COST = 0.05;
export const SYMMETRY_COST = 25;
const OUTSIDE_COST = 20;

/** Heavy atoms a bead holding a ring piece reaches freely by taking in substituent atoms. */
export const ringBeadCap = (limits: SizeLimits): number => Math.max(limits.target, 3);

/**
 * A bead holding a ring piece: its ring piece is costed by propose-rings.ts; substituent atoms it
 * takes in are free up to ringBeadCap (so small substituents such as methyl or hydroxyl join their
 * ring atoms), cost a little beyond it and much beyond the resolution's maximum.
 */
export function ringBeadCost(size: number, limits: SizeLimits): number {
  const cap = ringBeadCap(limits);
  return (size > cap ? 2 * (size - cap) : 0) + (size > limits.max ? OUTSIDE_COST * (size - limits.max) : 0);
}

export function beadSizeCost(size: number, limits: SizeLimits): number {
  const d = size - limits.target;
  let c = d * d;
  if (size > limits.max) c += OUTSIDE_COST * (size - limits.max);
  if (size < limits.min) c += OUTSIDE_COST * (limits.min - size);
  return c;
}

/** Composition of a bead: its atoms' symmetry classes, sorted (with their weights when it shares atoms). */
export function compositionOf(atoms: readonly number[], classes: Int32Array, weights?: readonly number[]): string {
  if (!weights) return atoms.map((a) => classes[a]).sort((x, y) => x - y).join('.');
  return atoms.map((a, i) => `${classes[a]}:${round(weights[i])}`).sort().join('.');
}

const round = (w: number) => Math.round(w * 1e6) / 1e6;

/**
 * Symmetry classes whose (mapped) atoms sit in beads of more than one composition. With shared atoms
 * (`weights` per bead, aligned with its atoms) an atom's place is the sorted list of (bead
 * composition, its own weight there) over every bead holding it, and equivalent atoms must have the
 * same place: two adamantane CH2 each shared at ½ by two alike beads agree, a ring atom wholly in one
 * bead and its equivalent split over two do not.
 */
export function asymmetricClasses(beads: readonly (readonly number[])[], classes: Int32Array, weights?: readonly (readonly number[] | undefined)[]): number[] {
  const shared = weights?.some((w) => w !== undefined);
  if (!shared) {
    const seen = new Map<number, string>();
    const broken = new Set<number>();
    for (const bead of beads) {
      const comp = compositionOf(bead, classes);
      for (const a of bead) {
        const prev = seen.get(classes[a]);
        if (prev === undefined) seen.set(classes[a], comp);
        else if (prev !== comp) broken.add(classes[a]);
      }
    }
    return [...broken].sort((x, y) => x - y);
  }
  const place = new Map<number, string[]>();
  beads.forEach((bead, i) => {
    const w = weights![i];
    const comp = compositionOf(bead, classes, w ?? bead.map(() => 1));
    bead.forEach((a, k) => {
      const list = place.get(a) ?? [];
      list.push(`${comp}@${round(w ? w[k] : 1)}`);
      place.set(a, list);
    });
  });
  const seen = new Map<number, string>();
  const broken = new Set<number>();
  for (const [a, list] of place) {
    const sig = list.sort().join('|');
    const prev = seen.get(classes[a]);
    if (prev === undefined) seen.set(classes[a], sig);
    else if (prev !== sig) broken.add(classes[a]);
  }
  return [...broken].sort((x, y) => x - y);
}

export interface CostInput {
  molecule: Molecule;
  p: Prepared;
  classes: Int32Array;
  limits: SizeLimits;
  beads: readonly (readonly number[])[];
  /** Per bead: it is a free ion's bead. */
  ion: readonly boolean[];
  /** Per bead: it holds a ring piece. */
  ring: readonly boolean[];
  /** Ring-piece cost already counted for the beads' ring atoms. */
  ringCost: number;
  /** Count the symmetry term (default true; off when the beads are only part of a proposal). */
  symmetry?: boolean;
}

export function proposalCost(x: CostInput): number {
  const beadOf = new Int32Array(x.p.n).fill(-1);
  x.beads.forEach((bead, i) => bead.forEach((a) => (beadOf[a] = i)));
  let cost = x.ringCost;
  x.beads.forEach((bead, i) => {
    if (x.ring[i]) cost += ringBeadCost(bead.length, x.limits);
    else if (!x.ion[i]) cost += beadSizeCost(bead.length, x.limits);
  });
  for (const b of x.molecule.bonds) {
    const i = beadOf[b.a];
    const j = beadOf[b.b];
    if (i < 0 || j < 0) continue;
    if (i !== j) cost += CUT_COST;
    else cost += LOGP_COST * Math.abs(x.molecule.atomLogP[b.a] - x.molecule.atomLogP[b.b]);
  }
  if (x.symmetry !== false) cost += SYMMETRY_COST * asymmetricClasses(x.beads, x.classes).length;
  return Math.round(cost * 1e6) / 1e6;
}
