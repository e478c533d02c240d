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
 * Atoms that are fixed (already in a bead of the draft) take no part, so a partial mapping is completed
 * around them.
 */
import type { Molecule, Resolution } from '../../src/shared/chem';
import { isFreeIon } from './free-ions';
import { prepare } from './prepared';
import { proposalCost, type SizeLimits } from './propose-cost';
import { ringBonds } from './propose-ring-bonds';
import { cutRingSystems, type RingPiece } from './propose-rings';
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

export interface ProposedPartition {
  beads: { atoms: number[]; reason: string }[];
  cost: number;
}

export const MAX_PROPOSALS = 3;

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
  const out: ProposedPartition[] = [];
  const ringCuts = new Map<boolean, RingPiece[]>();
  for (const v of variants) {
    const variantLimits: SizeLimits = { ...limits, target: v.target };
    // Ring pieces depend on the 3-atom cost only (macrocycle pieces keep the resolution's target).
    const pieces = ringCuts.get(v.threes) ?? cutRingSystems(p, rings, units, free, { target: limits.target, max: limits.max, twoCost: v.threes ? 0.5 : 0, threeCost: v.threes ? 0 : 0.5, classes });
    ringCuts.set(v.threes, pieces);
    const joined = joinNodes(...nodesOf(molecule, p, units, pieces, free, classes), variantLimits);
    const beads = [...joined, ...ions.map((a) => [a])];
    const key = beads.map((b) => b.join(',')).sort().join('|');
    if (seen.has(key)) continue;
    seen.add(key);
    const ion = beads.map((b) => b.length === 1 && isFreeIon(molecule, p, b[0]));
    const ring = beads.map((b) => b.some((a) => rings.ringAtom[a]));
    const ringCost = pieces.reduce((s, piece) => s + piece.cost, 0);
    const cost = proposalCost({ molecule, p, classes, limits, beads, ion, ring, ringCost });
    const ordered = [...beads].sort((x, y) => x[0] - y[0]);
    out.push({ beads: ordered.map((atoms) => ({ atoms, reason: describeBead(molecule, units, rings, atoms, isFreeIon(molecule, p, atoms[0])) })), cost });
  }
  return out.sort((x, y) => x.cost - y.cost).slice(0, MAX_PROPOSALS);
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
