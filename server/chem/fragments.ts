/**
 * Fragment logP: a bead's atoms cut out as a molecule of their own, every cut bond capped with
 * hydrogen (as many hydrogens as the cut bond's Kekulé order, so every valence stays satisfied), and
 * typed afresh by Wildman–Crippen. Shared atoms are included whole; weights do not apply. Charges and
 * isotopes travel with their atoms. RDKit re-perceives aromaticity, so a ring cut open is no longer
 * aromatic.
 *
 * Two caches: per molecule by the bead's atom set (so an unchanged bead costs one map lookup), and
 * process-wide by the fragment's own molfile text (so any bead with the same chemistry, in any
 * molecule, is typed once). The process-wide cache keeps the most recent entries.
 */
import type { Atom, Bond, Molecule } from '../../src/shared/chem';
import { typeMolfile } from './crippen';
import { writeTypingMolfile } from './molfile';
import type { Prepared } from './prepared';
import type { RDKit } from './rdkit';

const MAX_ENTRIES = 20_000;
const byContent = new Map<string, number | null>();
const byAtomSet = new WeakMap<Molecule, Map<string, number | null>>();

export function fragmentModel(molecule: Molecule, p: Prepared, members: number[]): { atoms: Atom[]; bonds: Bond[] } {
  const local = new Map(members.map((a, i) => [a, i]));
  const atoms: Atom[] = members.map((a, i) => ({ ...molecule.atoms[a], index: i }));
  const bonds: Bond[] = [];
  members.forEach((a, i) => {
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
      const j = local.get(p.adj[k]);
      if (j === undefined) atoms[i].hydrogens += p.adjOrder[k];
      else if (i < j) bonds.push({ a: i, b: j, order: p.adjOrder[k], aromatic: false });
    }
  });
  return { atoms, bonds };
}

export function fragmentLogP(rd: RDKit, molecule: Molecule, p: Prepared, indices: number[]): number | null {
  if (indices.length === 0) return null;
  const members = [...new Set(indices)].sort((a, b) => a - b);
  const setKey = members.join(',');
  let local = byAtomSet.get(molecule);
  if (!local) byAtomSet.set(molecule, (local = new Map()));
  if (local.has(setKey)) return local.get(setKey)!;
  const model = fragmentModel(molecule, p, members);
  const key = writeTypingMolfile(model);
  let value: number | null;
  if (byContent.has(key)) {
    value = byContent.get(key)!;
  } else {
    try {
      value = typeMolfile(rd, key, model.atoms).logP;
    } catch {
      value = null;
    }
    byContent.set(key, value);
    if (byContent.size > MAX_ENTRIES) byContent.delete(byContent.keys().next().value!);
  }
  if (local.size >= MAX_ENTRIES) local.clear();
  local.set(setKey, value);
  return value;
}

export function clearFragmentCache(): void {
  byContent.clear();
}
