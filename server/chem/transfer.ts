/**
 * Transfer: a new molecule's first mapping from a related molecule's mapping.
 *
 * 1. Atom correspondence by maximum common substructure: RDKit's FMCS (MinimalLib `get_mcs_as_json`)
 *    on the two models written as molfiles (molfile.ts, so RDKit atom k is our atom k), elements
 *    compared, bond orders compared, ring atoms matching ring atoms only and only complete rings,
 *    10 s at most; then the MCS pattern's first match in each molecule pairs the atoms.
 * 2. A source bead whose atoms all have a counterpart is carried over: same name, type, centre rule,
 *    measured value and weights, on the counterpart atoms (when two beads share an atom and only one
 *    is carried, that atom's weights sum below 1 and the checks say so).
 * 3. The atoms no carried bead holds are proposed (propose.ts, as for scope 'unassigned'), with
 *    names that do not clash with the carried ones; a proposed bead that shares atoms keeps its weights.
 * A report lists carried, changed (partly matched) and added beads.
 */
import type { BeadType, Mapping, MappingBead, Molecule, Resolution } from '../../src/shared/chem';
import { proposedAtoms, type TransferResult } from '../../src/shared/proposals';
import { writeTypingMolfile } from './molfile';
import { proposeMapping } from './propose-mapping';
import type { RDKit } from './rdkit';

export interface TransferOptions {
  resolution: Resolution;
  library?: BeadType[];
}

const MCS_PARAMETERS = JSON.stringify({ AtomCompare: 'Elements', BondCompare: 'Order', RingMatchesRingOnly: true, CompleteRingsOnly: true, Timeout: 10 });

/** target atom → source atom (or -1), by maximum common substructure. */
export function correspondence(rd: RDKit, source: Molecule, target: Molecule): Int32Array {
  const out = new Int32Array(target.atoms.length).fill(-1);
  const a = rd.get_mol(writeTypingMolfile(source));
  const b = rd.get_mol(writeTypingMolfile(target));
  const list = new rd.MolList();
  try {
    if (!a || !b) return out;
    list.append(a);
    list.append(b);
    const mcs = JSON.parse(rd.get_mcs_as_json(list, MCS_PARAMETERS)) as { smarts?: string; numAtoms?: number };
    if (!mcs.smarts || !mcs.numAtoms) return out;
    const q = rd.get_qmol(mcs.smarts);
    if (!q) return out;
    try {
      const inA = JSON.parse(a.get_substruct_match(q)) as { atoms?: number[] };
      const inB = JSON.parse(b.get_substruct_match(q)) as { atoms?: number[] };
      if (inA.atoms && inB.atoms) inB.atoms.forEach((t, k) => (out[t] = inA.atoms![k]));
    } finally {
      q.delete();
    }
  } finally {
    list.delete();
    a?.delete();
    b?.delete();
  }
  return out;
}

export function transferMapping(rd: RDKit, source: Molecule, sourceMapping: Mapping, target: Molecule, o: TransferOptions): TransferResult {
  const toTarget = new Map<number, number>();
  const map = correspondence(rd, source, target);
  map.forEach((s, t) => {
    if (s >= 0) toTarget.set(s, t);
  });
  const carried: MappingBead[] = [];
  const changed: TransferResult['report']['changed'] = [];
  for (const bead of sourceMapping.beads) {
    const matched = bead.atoms.filter((a) => toTarget.has(a.index)).length;
    if (bead.atoms.length > 0 && matched === bead.atoms.length) {
      carried.push({ ...bead, atoms: bead.atoms.map((a) => ({ index: toTarget.get(a.index)!, weight: a.weight })).sort((x, y) => x.index - y.index) });
    } else if (matched > 0) changed.push({ name: bead.name, matched, total: bead.atoms.length });
  }
  const partial: Mapping = { beads: carried, ...(sourceMapping.partitionBasis ? { partitionBasis: sourceMapping.partitionBasis } : {}) };
  const [best] = proposeMapping(target, { resolution: o.resolution, scope: 'unassigned', draft: partial, library: o.library });
  const added = (best?.beads ?? []).map((b, i) => ({ id: `t${i + 1}`, name: b.name, ...(b.type ? { type: b.type } : {}), centre: 'mass' as const, atoms: proposedAtoms(b) }));
  return {
    draft: { beads: [...carried, ...added], ...(partial.partitionBasis ? { partitionBasis: partial.partitionBasis } : {}) },
    report: {
      carried: carried.map((b) => ({ name: b.name, atoms: b.atoms.map((a) => a.index) })),
      changed,
      added: added.map((b) => ({ name: b.name, atoms: b.atoms.map((a) => a.index) })),
      matchedAtoms: toTarget.size,
    },
  };
}
