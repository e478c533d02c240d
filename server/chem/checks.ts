/**
 * Mapping checks: findings a modeller should see while editing. Each has a stable code, a severity,
 * the atoms and beads involved, and a one-line hint. Size limits are common practice with no source
 * (resolution.ts); the charged-group rule is ours (charged-groups.ts). No check quotes a partition
 * value for an ionic bead: it has none ("n/a (ionic)").
 */
import type { BeadEvaluation, BeadType, Check, MappingBead, Molecule, Resolution } from '../../src/shared/chem';
import { chargedGroups } from './charged-groups';
import { isFreeIon } from './free-ions';
import type { Prepared } from './prepared';
import { RESOLUTION_LIMITS } from './resolution';

export interface CheckInput {
  molecule: Molecule;
  p: Prepared;
  beads: MappingBead[];
  evaluated: BeadEvaluation[];
  library: readonly BeadType[];
  weightSum: Float64Array;
  beadsOf: number[][];
  heavyAtoms: number[];
  resolution: Resolution;
}

const EPS = 1e-6;

export function runChecks(x: CheckInput): Check[] {
  const checks: Check[] = [];
  const ids = x.beads.map((b) => b.id);
  const add = (code: string, severity: Check['severity'], message: string, atoms: number[], beads: string[], hint: string): void => {
    checks.push({ code, severity, message, atoms, beads, hint });
  };

  const over: number[] = [];
  const under: number[] = [];
  const unassigned: number[] = [];
  for (let a = 0; a < x.p.n; a++) {
    const w = x.weightSum[a];
    if (w > 1 + EPS) over.push(a);
    else if (w === 0) {
      if (x.p.heavy[a]) unassigned.push(a);
    } else if (w < 1 - EPS) under.push(a);
  }
  if (over.length) add('weight_sum_above_one', 'error', `${over.length} atom(s) are assigned with weights summing above 1.`, over, beadsHolding(over, x.beadsOf, ids), 'Lower the shared weights so each atom sums to 1.');
  if (under.length) add('weight_sum_below_one', 'warning', `${under.length} atom(s) are assigned with weights summing below 1.`, under, beadsHolding(under, x.beadsOf, ids), 'Raise the shared weights or add the atom to another bead.');
  if (unassigned.length) add('unassigned_atom', 'warning', `${unassigned.length} heavy atom(s) belong to no bead.`, unassigned, [], 'Add each of these atoms to a bead.');

  const byName = new Map<string, string[]>();
  for (const b of x.beads) byName.set(b.name, [...(byName.get(b.name) ?? []), b.id]);
  for (const [name, same] of byName) {
    if (same.length > 1) add('duplicate_bead_name', 'warning', `${same.length} beads are named "${name}".`, [], same, 'Give each bead its own name.');
  }

  const limits = RESOLUTION_LIMITS[x.resolution];
  const stamp = new Int32Array(x.p.n).fill(-1);
  x.beads.forEach((bead, i) => {
    if (bead.atoms.length === 0) {
      add('empty_bead', 'warning', `Bead ${bead.name} has no atoms.`, [], [bead.id], 'Assign atoms to it or delete it.');
      return;
    }
    const atoms = bead.atoms.map((a) => a.index);
    if (!connected(atoms, x.p, stamp, i)) add('disconnected_bead', 'warning', `The atoms of bead ${bead.name} are not connected to each other.`, atoms, [bead.id], 'A bead should be one connected piece; split it or add the linking atoms.');
    if (atoms.every((a) => isFreeIon(x.molecule, x.p, a))) return; // a free ion is a bead of its own, whatever its size
    const h = x.heavyAtoms[i];
    if (h > limits.max + EPS) add('bead_too_large', 'warning', `Bead ${bead.name} has ${fmt(h)} heavy atoms; at ${x.resolution} a bead should have at most ${limits.max}.`, atoms, [bead.id], 'Split it into two beads.');
    else if (h < limits.min - EPS) add('bead_too_small', 'warning', `Bead ${bead.name} has ${fmt(h)} heavy atoms; at ${x.resolution} a bead should have at least ${limits.min}.`, atoms, [bead.id], 'Merge it with a neighbouring bead.');
  });

  for (const group of chargedGroups(x.molecule, x.p)) {
    const holders = new Set<number>();
    for (const a of group.atoms) for (const b of x.beadsOf[a]) holders.add(b);
    if (holders.size > 1) {
      const what = group.netCharge === 0 ? 'A charge-separated group (net charge 0)' : `A charged group (net charge ${signed(group.netCharge)})`;
      add('split_charged_group', 'warning', `${what}, atoms ${group.atoms.map((a) => a + 1).join(', ')}, is split over ${holders.size} beads.`, group.atoms, [...holders].map((b) => ids[b]), 'Put the whole group into one bead: its atoms share one charge.');
    }
  }

  const sizeOfType = new Map(x.library.map((t) => [t.name, t.heavyAtomsPerBead]));
  x.beads.forEach((bead, i) => {
    const e = x.evaluated[i];
    const typeSize = bead.type ? sizeOfType.get(bead.type) : undefined;
    if (typeSize !== undefined && e.sizeClass !== null && typeSize !== e.sizeClass) {
      add('type_size_mismatch', 'warning', `Bead ${bead.name} has ${fmt(e.heavyAtoms)} heavy atoms (size class ${e.sizeClass}), but its type ${bead.type} is for ${typeSize} heavy atoms per bead.`, bead.atoms.map((a) => a.index), [bead.id], `Choose a type for ${e.sizeClass} heavy atoms per bead, or resize the bead.`);
    }
    // A free ion (Na⁺ in its own bead) is plainly ionic; the note is for beads cut from a molecule.
    if (e.ionic && !bead.atoms.every((a) => isFreeIon(x.molecule, x.p, a.index))) {
      add('ionic_bead', 'info', `Bead ${bead.name} carries a net charge of ${signed(e.charge)}: its partition value is n/a (ionic), and its type is suggested from charge and size.`, [], [bead.id], 'Enter a measured value if you have one; the additive logP of an ion is not a partition value.');
    }
  });
  const rank = { error: 0, warning: 1, info: 2 } as const;
  return checks.sort((p, q) => rank[p.severity] - rank[q.severity]);
}

function beadsHolding(atoms: number[], beadsOf: number[][], ids: string[]): string[] {
  const s = new Set<number>();
  for (const a of atoms) for (const b of beadsOf[a]) s.add(b);
  return [...s].sort((p, q) => p - q).map((b) => ids[b]);
}

/** Whether the bead's atoms form one connected piece of the bond graph (BFS inside the bead). */
function connected(atoms: number[], p: Prepared, stamp: Int32Array, beadNo: number): boolean {
  const unique = [...new Set(atoms)];
  for (const a of unique) stamp[a] = beadNo;
  const reached = new Set<number>([unique[0]]);
  const queue = [unique[0]];
  for (let q = 0; q < queue.length; q++) {
    const a = queue[q];
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
      const b = p.adj[k];
      if (stamp[b] === beadNo && !reached.has(b)) {
        reached.add(b);
        queue.push(b);
      }
    }
  }
  return reached.size === unique.length;
}

function signed(v: number): string {
  const t = fmt(Math.abs(v));
  return v > 0 ? `+${t}` : v < 0 ? `−${t}` : '0';
}

function fmt(v: number): string {
  return Number.isInteger(v) ? String(v) : v.toFixed(2);
}
