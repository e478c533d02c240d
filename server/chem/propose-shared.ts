/**
 * Symmetric cuts with shared atoms, for the parts of a molecule that no cut into separate beads maps
 * symmetrically (propose.ts). Adamantane's 4 CH and 6 CH2, or cyclopentane's five equal atoms, admit
 * no symmetric partition into beads of 2–4 atoms: every symmetric set of beads is either one bead for
 * the whole part or a whole orbit of beads, and an orbit of beads covers the part only if they share.
 *
 * Construction (ours; common practice, no source, for the idea that a shared atom counts with its
 * weight): the bead centres are one symmetry class of the part — either its atoms of one class, each a
 * centre, or its bonds of one kind (the two atoms' classes and the bond order), each a centre. A bead
 * is its centre's atoms plus the part's atoms bonded to the centre that are in no centre. An atom held
 * by k beads sits in each at weight 1/k, so every atom's weights sum to 1 and equivalent atoms get
 * equivalent places: the set of beads is mapped onto itself by every symmetry of the part. Adamantane
 * with its CH as centres: four beads, each one CH and three CH2 at ½ (2.5 heavy atoms). The whole part
 * as one bead is also a candidate. A candidate is kept only if it covers every atom of the part and
 * leaves every unit (charged group, listed functional group: propose-units.ts) and every charged
 * atom wholly in one bead.
 *
 * Cost of a candidate, on the standard scale (propose-cost.ts): per bead (s − target)² of its weighted
 * size s, + 20 per heavy atom outside the resolution's limits; CUT_COST per bond whose atoms share no
 * bead; LOGP_COST × |Δ logP| per bond inside a bead; SHARE_COST per shared atom, so a cut without
 * sharing wins a tie (cyclopentane at 2:1: five one-atom beads rather than five beads on the bonds).
 */
import type { Molecule } from '../../src/shared/chem';
import type { Prepared } from './prepared';
import { beadSizeCost, CUT_COST, LOGP_COST, type SizeLimits } from './propose-cost';
import type { Units } from './propose-units';

export const SHARE_COST = 0.2;

export interface SharedCut {
  /** Beads of the part: atoms ascending; weights aligned with them, undefined when all are 1. */
  beads: { atoms: number[]; weights: number[] | undefined }[];
  cost: number;
}

/** The cheapest symmetric cut of one connected part (`part`: its heavy atoms), or null if none fits. */
export function symmetricSharedCut(molecule: Molecule, p: Prepared, classes: Int32Array, units: Units, part: readonly number[], limits: SizeLimits): SharedCut | null {
  const inPart = new Uint8Array(p.n);
  for (const a of part) inPart[a] = 1;
  const centreSets = new Map<string, number[][]>();
  const add = (key: string, centre: number[]) => centreSets.set(key, [...(centreSets.get(key) ?? []), centre]);
  for (const a of part) add(`a${classes[a]}`, [a]);
  for (const b of molecule.bonds) {
    if (!inPart[b.a] || !inPart[b.b]) continue;
    const [x, y] = classes[b.a] <= classes[b.b] ? [b.a, b.b] : [b.b, b.a];
    add(`b${classes[x]}-${classes[y]}-${b.aromatic ? 'a' : b.order}`, [x, y]);
  }
  let best: SharedCut | null = null;
  const consider = (cut: SharedCut | null) => {
    if (cut && (!best || cut.cost < best.cost - 1e-9)) best = cut;
  };
  consider(costed(molecule, units, [{ atoms: [...part].sort((x, y) => x - y), weights: undefined }], limits));
  // Keys in sorted order, so ties go the same way whatever the atom order.
  for (const key of [...centreSets.keys()].sort()) consider(fromCentres(molecule, p, units, inPart, part, centreSets.get(key)!, limits));
  return best;
}

function fromCentres(molecule: Molecule, p: Prepared, units: Units, inPart: Uint8Array, part: readonly number[], centres: number[][], limits: SizeLimits): SharedCut | null {
  const isCentre = new Uint8Array(p.n);
  for (const c of centres) for (const a of c) isCentre[a] = 1;
  const members = centres.map((c) => {
    const set = new Set(c);
    for (const a of c) {
      for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
        const b = p.adj[k];
        if (inPart[b] && !isCentre[b]) set.add(b);
      }
    }
    return [...set].sort((x, y) => x - y);
  });
  const held = new Int32Array(p.n);
  for (const m of members) for (const a of m) held[a]++;
  if (part.some((a) => held[a] === 0)) return null;
  const beads = members.map((atoms) => {
    const weights = atoms.map((a) => 1 / held[a]);
    return { atoms, weights: weights.every((w) => w === 1) ? undefined : weights };
  });
  return costed(molecule, units, beads, limits);
}

function costed(molecule: Molecule, units: Units, beads: SharedCut['beads'], limits: SizeLimits): SharedCut | null {
  const beadsOf = new Map<number, number[]>();
  beads.forEach((b, i) => b.atoms.forEach((a) => beadsOf.set(a, [...(beadsOf.get(a) ?? []), i])));
  // Units stay whole: every atom of a group (a unit of two or more atoms, a unit with a reason, a
  // charged atom) wholly in one and the same bead.
  for (const [u, atoms] of units.atoms.entries()) {
    if (!beadsOf.has(atoms[0])) continue;
    if (atoms.length < 2 && !units.reason[u] && molecule.atoms[atoms[0]].charge === 0) continue;
    const first = beadsOf.get(atoms[0])!;
    if (atoms.some((a) => { const list = beadsOf.get(a); return !list || list.length !== 1 || list[0] !== first[0]; })) return null;
  }
  let cost = 0;
  let shared = 0;
  for (const b of beads) cost += beadSizeCost(b.weights ? b.weights.reduce((s, w) => s + w, 0) : b.atoms.length, limits);
  for (const list of beadsOf.values()) if (list.length > 1) shared++;
  cost += SHARE_COST * shared;
  for (const bond of molecule.bonds) {
    const x = beadsOf.get(bond.a);
    const y = beadsOf.get(bond.b);
    if (!x || !y) continue;
    const together = x.filter((i) => y.includes(i)).length;
    if (together === 0) cost += CUT_COST;
    else cost += together * LOGP_COST * Math.abs(molecule.atomLogP[bond.a] - molecule.atomLogP[bond.b]);
  }
  return { beads, cost };
}
