/**
 * Mapping proposals: a first partition of a molecule's heavy atoms into beads, from rules of our own
 * (docs/chemistry.md, "Mapping proposals"). Pure and deterministic: the same molecule and options give
 * the same proposals, whatever the atom order (up to swapping symmetry-equivalent atoms).
 *
 * 1. Symmetry classes of the atoms (propose-symmetry.ts).
 * 2. Units: charged groups and listed functional groups stay whole (propose-units.ts).
 * 3. Ring systems are cut into pieces of 2–3 ring atoms (propose-rings.ts).
 * 4. Free ions are beads of their own; the rest (ring pieces, units, lone atoms) is joined into beads
 *    near the resolution's target size by dynamic programming on the tree they form (propose-tree.ts).
 * 5. Variants (target size one lower and one higher, ring pieces of three preferred) give alternatives;
 *    every candidate is scored with one cost (propose-cost.ts) and the best three distinct ones are kept.
 * 6. Each connected part of the best candidate that breaks symmetry or holds a bead outside the size
 *    limits is also cut symmetrically around one class of its atoms or bonds, sharing atoms where beads
 *    meet (propose-shared.ts: adamantane, cyclopentane, pentane at 3:1); that candidate competes on
 *    the same cost.
 * Atoms that are fixed (already in a bead of the draft) take no part, so a partial mapping is completed
 * around them.
 */
import type { Molecule, Resolution } from '../../src/shared/chem';
import { isFreeIon } from './free-ions';
import { componentsOf } from './graph';
import { prepare } from './prepared';
import { asymmetricClasses, proposalCost, SYMMETRY_COST, type SizeLimits } from './propose-cost';
import { ringBonds } from './propose-ring-bonds';
import { cutRingSystems, type RingPiece } from './propose-rings';
import { symmetricSharedCut, type SharedCut } from './propose-shared';
import { symmetryClasses } from './propose-symmetry';
import { joinNodes, type TreeNode } from './propose-tree';
import { findUnits } from './propose-units';
import { describeBead } from './propose-reasons';
import { RESOLUTION_LIMITS } from './resolution';

export interface PartitionOptions {
  resolution: Resolution;
  /** Atoms already decided (kept out of the proposal). */
  fixed?: Iterable<number>;
}

export interface ProposedBead {
  atoms: number[];
  /** Aligned with `atoms`, present only when the bead shares atoms (some weight below 1). */
  weights?: number[];
  reason: string;
}

export interface ProposedPartition {
  beads: ProposedBead[];
  cost: number;
}

export const MAX_PROPOSALS = 3;

interface Candidate {
  beads: number[][];
  weights: (number[] | undefined)[];
  cost: number;
  broken: number[];
}

export function proposePartitions(molecule: Molecule, options: PartitionOptions): ProposedPartition[] {
  const p = prepare(molecule);
  const limits = RESOLUTION_LIMITS[options.resolution];
  const classes = symmetryClasses(molecule, p);
  const rings = ringBonds(p);
  const fixed = new Uint8Array(p.n);
  for (const a of options.fixed ?? []) if (a >= 0 && a < p.n) fixed[a] = 1;
  const ions: number[] = [];
  const free = new Uint8Array(p.n);
  for (let a = 0; a < p.n; a++) {
    if (fixed[a]) continue;
    if (isFreeIon(molecule, p, a)) ions.push(a);
    else if (p.heavy[a]) free[a] = 1;
  }
  const units = findUnits(molecule, p, free);
  const variants: { target: number; threes: boolean }[] = [
    { target: limits.target, threes: false },
    { target: Math.max(limits.min, limits.target - 1), threes: false },
    { target: Math.min(limits.max, limits.target + 1), threes: false },
    { target: limits.target, threes: true },
  ];
  const seen = new Set<string>();
  const candidates: Candidate[] = [];
  const ringCuts = new Map<boolean, RingPiece[]>();
  const keyOf = (beads: number[][], weights: (number[] | undefined)[]) => beads.map((b, i) => `${b.join(',')}${weights[i] ? `/${weights[i]!.join(',')}` : ''}`).sort().join('|');
  let bestPieces: RingPiece[] = [];
  for (const v of variants) {
    const variantLimits: SizeLimits = { ...limits, target: v.target };
    // Ring pieces depend on the 3-atom cost only (macrocycle pieces keep the resolution's target).
    const pieces = ringCuts.get(v.threes) ?? cutRingSystems(p, rings, units, free, { target: limits.target, max: limits.max, twoCost: v.threes ? 0.5 : 0, threeCost: v.threes ? 0 : 0.5, classes });
    ringCuts.set(v.threes, pieces);
    const joined = joinNodes(...nodesOf(molecule, p, units, pieces, free, classes), variantLimits);
    const beads = [...joined, ...ions.map((a) => [a])];
    const weights = beads.map(() => undefined);
    const key = keyOf(beads, weights);
    if (seen.has(key)) continue;
    seen.add(key);
    const ion = beads.map((b) => b.length === 1 && isFreeIon(molecule, p, b[0]));
    const ring = beads.map((b) => b.some((a) => rings.ringAtom[a]));
    const ringCost = pieces.reduce((s, piece) => s + piece.cost, 0);
    const cost = proposalCost({ molecule, p, classes, limits, beads, ion, ring, ringCost });
    if (!candidates.length || cost < Math.min(...candidates.map((c) => c.cost))) bestPieces = pieces;
    candidates.push({ beads, weights, cost, broken: asymmetricClasses(beads, classes) });
  }
  // Parts of the best cut that break symmetry or hold a bead outside the size limits are also cut
  // anew around one symmetry class, sharing atoms where the beads meet (propose-shared.ts); that
  // candidate competes on the same cost (pentane at 3:1: two beads sharing the middle carbon).
  if (candidates.length) {
    const best = candidates.reduce((x, y) => (y.cost < x.cost ? y : x));
    const shared = sharedVariant(molecule, p, classes, units, free, limits, best, bestPieces, rings.ringAtom);
    if (shared && !seen.has(keyOf(shared.beads, shared.weights))) candidates.push(shared);
  }
  const out: ProposedPartition[] = candidates.map((c) => {
    const order = c.beads.map((_, i) => i).sort((x, y) => c.beads[x][0] - c.beads[y][0]);
    return {
      beads: order.map((i) => {
        const atoms = c.beads[i];
        const w = c.weights[i];
        const reason = describeBead(molecule, units, rings, atoms, isFreeIon(molecule, p, atoms[0]));
        return w ? { atoms, weights: w, reason: `${reason}; shares ${w.filter((x) => x < 1).length} of them with the beads beside it` } : { atoms, reason };
      }),
      cost: c.cost,
    };
  });
  return out.sort((x, y) => x.cost - y.cost).slice(0, MAX_PROPOSALS);
}

/**
 * The best candidate with each connected part that holds a broken symmetry class or a bead outside the
 * size limits replaced by that part's cheapest symmetric cut (sharing atoms where needed); null if no
 * part could be cut so or symmetry would suffer.
 */
function sharedVariant(molecule: Molecule, p: ReturnType<typeof prepare>, classes: Int32Array, units: ReturnType<typeof findUnits>, free: Uint8Array, limits: SizeLimits, best: Candidate, pieces: RingPiece[], ringAtom: Uint8Array): Candidate | null {
  const brokenClass = new Set(best.broken);
  // Connected parts of the free atoms (free ions and fixed atoms are in none).
  const parts = componentsOf(p.n, molecule.bonds.filter((b) => free[b.a] && free[b.b])).filter((part) => free[part[0]]);
  const partOf = new Int32Array(p.n).fill(-1);
  parts.forEach((part, i) => part.forEach((a) => (partOf[a] = i)));
  const offSize = new Uint8Array(parts.length);
  for (const b of best.beads) {
    if (b.length === 1 && isFreeIon(molecule, p, b[0])) continue;
    if ((b.length < limits.min || b.length > limits.max) && partOf[b[0]] >= 0) offSize[partOf[b[0]]] = 1;
  }
  // What the best candidate's beads of some parts cost, without the symmetry term.
  const costOf = (partsOf: Set<number>) => {
    const beads = best.beads.filter((b) => partsOf.has(partOf[b[0]]));
    return proposalCost({
      molecule,
      p,
      classes,
      limits,
      beads,
      ion: beads.map((b) => b.length === 1 && isFreeIon(molecule, p, b[0])),
      ring: beads.map((b) => b.some((a) => ringAtom[a])),
      ringCost: pieces.filter((piece) => partsOf.has(partOf[piece.atoms[0]])).reduce((s, piece) => s + piece.cost, 0),
      symmetry: false,
    });
  };
  const redo = new Set<number>();
  const cuts: SharedCut['beads'] = [];
  let cutCost = 0;
  parts.forEach((part, i) => {
    const broken = new Set(part.filter((a) => brokenClass.has(classes[a])).map((a) => classes[a])).size;
    if (!offSize[i] && !broken) return;
    const cut = symmetricSharedCut(molecule, p, classes, units, part, limits);
    // A part is cut anew only when that is cheaper than its beads now with the symmetry they break.
    if (!cut || cut.cost >= costOf(new Set([i])) + SYMMETRY_COST * broken - 1e-9) return;
    redo.add(i);
    cuts.push(...cut.beads);
    cutCost += cut.cost;
  });
  if (!redo.size) return null;
  const kept = best.beads.filter((b) => !redo.has(partOf[b[0]]));
  const keptParts = new Set(parts.map((_, i) => i).filter((i) => !redo.has(i)));
  // Free ions (in no part) stay as they are.
  const keptCost = costOf(new Set([...keptParts, -1]));
  const beads = [...kept, ...cuts.map((b) => b.atoms)];
  const weights = [...kept.map(() => undefined), ...cuts.map((b) => b.weights)];
  const broken = asymmetricClasses(beads, classes, weights);
  if (broken.length > best.broken.length) return null;
  return { beads, weights, broken, cost: Math.round((keptCost + cutCost + SYMMETRY_COST * broken.length) * 1e6) / 1e6 };
}

function nodesOf(molecule: Molecule, p: ReturnType<typeof prepare>, units: ReturnType<typeof findUnits>, pieces: RingPiece[], free: Uint8Array, classes: Int32Array): [TreeNode[], [number, number][]] {
  const nodeOf = new Int32Array(p.n).fill(-1);
  const nodes: TreeNode[] = [];
  const add = (atoms: number[], ring: boolean) => {
    const id = nodes.length;
    for (const a of atoms) nodeOf[a] = id;
    const logP = atoms.reduce((s, a) => s + molecule.atomLogP[a], 0);
    nodes.push({ atoms, ring, size: atoms.length, logP, key: `${ring ? 'r' : 'u'}${atoms.map((a) => classes[a]).sort((x, y) => x - y).join('.')}` });
  };
  for (const piece of pieces) add(piece.atoms, true);
  units.atoms.forEach((atoms) => {
    if (nodeOf[atoms[0]] < 0) add(atoms, false);
  });
  const edges: [number, number][] = [];
  const seen = new Set<number>();
  for (const b of molecule.bonds) {
    if (!free[b.a] || !free[b.b]) continue;
    const i = nodeOf[b.a];
    const j = nodeOf[b.b];
    if (i === j) continue;
    const k = Math.min(i, j) * nodes.length + Math.max(i, j);
    if (seen.has(k)) continue;
    seen.add(k);
    edges.push([Math.min(i, j), Math.max(i, j)]);
  }
  return [nodes, edges];
}
