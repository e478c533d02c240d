/**
 * Fragment logP: a bead's atoms cut out as a molecule of their own, capped with hydrogen, and typed
 * afresh by Wildman–Crippen (RDKit perceives aromaticity of the fragment itself). Shared atoms are
 * included whole; weights do not apply. Charges and isotopes travel with their atoms.
 *
 * Capping rule (ours; docs/chemistry.md), made so that the value never depends on which Kekulé
 * structure the molecule happened to be stored with:
 *  1. A cut bond that is not aromatic is replaced by as many hydrogens as its order (C=O cut at the C
 *     leaves CH2 on the other side): its order is the same in every Kekulé structure.
 *  2. An aromatic system (atoms joined by aromatic bonds) that the bead leaves whole keeps its bonds.
 *  3. An aromatic system the bead cuts open is re-bonded inside the fragment: every cut aromatic bond
 *     becomes one hydrogen; every aromatic bond inside the fragment becomes single; then the atoms
 *     that need a double bond in the aromatic system (one per Kekulé structure, the same atoms in all
 *     of them) are paired along the fragment's own aromatic bonds, in every way that pairs as many as
 *     possible (all maximum matchings); each paired bond becomes double and each atom left unpaired
 *     gets one more hydrogen. The fragment's logP is the mean over those pairings.
 * The result depends only on the fragment's atoms and bonds, so symmetry-equivalent beads get equal
 * values and rotating a ring mapping gives the same values. Benzene cut into 2-atom beads gives
 * ethene (C=C) for every bead. At most MAX_PAIRINGS pairings are typed (found in atom order); beyond
 * that the mean is over the first ones (docs/chemistry.md says so).
 *
 * Two caches: per molecule by the bead's atom set (so an unchanged bead costs one map lookup), and
 * process-wide by the capped fragment's molfile text (so any bead with the same chemistry, in any
 * molecule, is typed once). The process-wide cache keeps the most recent entries.
 */
import type { Atom, Bond, Molecule } from '../../src/shared/chem';
import { typeMolfile } from './crippen';
import { writeTypingMolfile } from './molfile';
import type { Prepared } from './prepared';
import type { RDKit } from './rdkit';

const MAX_ENTRIES = 20_000;
export const MAX_PAIRINGS = 32;
const byContent = new Map<string, number | null>();
const byAtomSet = new WeakMap<Molecule, Map<string, number | null>>();

export interface FragmentModel {
  atoms: Atom[];
  bonds: Bond[];
}

/** Aromatic bonds of the molecule, by "a,b" with a < b (openchemlib's aromaticity, as stored). */
function aromaticKeys(molecule: Molecule): Set<string> {
  const s = new Set<string>();
  for (const b of molecule.bonds) if (b.aromatic) s.add(`${Math.min(b.a, b.b)},${Math.max(b.a, b.b)}`);
  return s;
}

/** Every capped version of the fragment the rule above gives (one when no aromatic system is cut). */
export function fragmentModels(molecule: Molecule, p: Prepared, members: number[]): FragmentModel[] {
  const local = new Map(members.map((a, i) => [a, i]));
  const aromatic = aromaticKeys(molecule);
  const isAromatic = (a: number, b: number) => aromatic.has(`${Math.min(a, b)},${Math.max(a, b)}`);

  // Aromatic systems the bead cuts: components (over aromatic bonds) that lose at least one bond.
  const system = new Int32Array(p.n).fill(-1);
  let systems = 0;
  for (let s = 0; s < p.n; s++) {
    if (system[s] >= 0 || !hasAromaticBond(p, s, isAromatic)) continue;
    const stack = [s];
    system[s] = systems;
    while (stack.length) {
      const a = stack.pop()!;
      for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
        const b = p.adj[k];
        if (system[b] < 0 && isAromatic(a, b)) {
          system[b] = systems;
          stack.push(b);
        }
      }
    }
    systems++;
  }
  const cutSystems = new Set<number>();
  for (const a of members) {
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) if (!local.has(p.adj[k]) && isAromatic(a, p.adj[k])) cutSystems.add(system[a]);
  }
  const opened = (a: number) => system[a] >= 0 && cutSystems.has(system[a]);

  const atoms: Atom[] = members.map((a, i) => ({ ...molecule.atoms[a], index: i, aromatic: false }));
  const bonds: Bond[] = [];
  const need = new Int32Array(members.length);
  const candidates: [number, number][] = [];
  members.forEach((a, i) => {
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
      const b = p.adj[k];
      const order = p.adjOrder[k];
      const j = local.get(b);
      const reBonded = opened(a) && isAromatic(a, b);
      if (reBonded) need[i] += order - 1;
      if (j === undefined) atoms[i].hydrogens += reBonded ? 1 : order;
      else if (i < j) {
        if (reBonded) candidates.push([i, j]);
        bonds.push({ a: i, b: j, order: reBonded ? 1 : order, aromatic: false });
      }
    }
  });
  const pairings = maximumMatchings(members.length, candidates.filter(([i, j]) => need[i] > 0 && need[j] > 0));
  return pairings.map((pairs) => {
    const paired = new Int32Array(members.length);
    const double = new Set(pairs.map(([i, j]) => `${i},${j}`));
    for (const [i, j] of pairs) {
      paired[i]++;
      paired[j]++;
    }
    return {
      atoms: atoms.map((atom, i) => ({ ...atom, hydrogens: atom.hydrogens + Math.max(0, need[i] - paired[i]) })),
      bonds: bonds.map((b) => (double.has(`${b.a},${b.b}`) ? { ...b, order: 2 } : b)),
    };
  });
}

function hasAromaticBond(p: Prepared, a: number, isAromatic: (a: number, b: number) => boolean): boolean {
  for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) if (isAromatic(a, p.adj[k])) return true;
  return false;
}

/**
 * All maximum matchings of the graph given by `edges` (each vertex in at most one pair), found by
 * branching on the edges in order; at most MAX_PAIRINGS are returned. With no edges: one empty one.
 */
export function maximumMatchings(n: number, edges: [number, number][]): [number, number][][] {
  let best = 0;
  let found: [number, number][][] = [];
  const used = new Uint8Array(n);
  const chosen: [number, number][] = [];
  let steps = 0;
  const walk = (e: number): void => {
    if (++steps > 200_000) return;
    // Bound: even taking every remaining edge cannot beat the best found.
    if (chosen.length + (edges.length - e) < best) return;
    if (e === edges.length) {
      if (chosen.length > best) {
        best = chosen.length;
        found = [];
      }
      if (chosen.length === best && found.length < MAX_PAIRINGS) found.push([...chosen]);
      return;
    }
    const [i, j] = edges[e];
    if (!used[i] && !used[j]) {
      used[i] = used[j] = 1;
      chosen.push([i, j]);
      walk(e + 1);
      chosen.pop();
      used[i] = used[j] = 0;
    }
    walk(e + 1);
  };
  walk(0);
  return found.length ? found : [[]];
}

function typedLogP(rd: RDKit, model: FragmentModel): number | null {
  const key = writeTypingMolfile(model);
  if (byContent.has(key)) return byContent.get(key)!;
  let value: number | null;
  try {
    value = typeMolfile(rd, key, model.atoms).logP;
  } catch {
    value = null;
  }
  byContent.set(key, value);
  if (byContent.size > MAX_ENTRIES) byContent.delete(byContent.keys().next().value!);
  return value;
}

export function fragmentLogP(rd: RDKit, molecule: Molecule, p: Prepared, indices: number[]): number | null {
  if (indices.length === 0) return null;
  const members = [...new Set(indices)].sort((a, b) => a - b);
  const setKey = members.join(',');
  let local = byAtomSet.get(molecule);
  if (!local) byAtomSet.set(molecule, (local = new Map()));
  if (local.has(setKey)) return local.get(setKey)!;
  let sum = 0;
  let value: number | null = null;
  const models = fragmentModels(molecule, p, members);
  for (const model of models) {
    const v = typedLogP(rd, model);
    if (v === null) {
      sum = Number.NaN;
      break;
    }
    sum += v;
  }
  if (Number.isFinite(sum)) value = sum / models.length;
  if (local.size >= MAX_ENTRIES) local.clear();
  local.set(setKey, value);
  return value;
}

export function clearFragmentCache(): void {
  byContent.clear();
}
