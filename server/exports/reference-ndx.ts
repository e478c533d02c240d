// The index file of a mapping in a reference's numbering: one group per bead holding, for every copy
// the matcher found, the reference atoms (1-based) of the bead's atoms and their hydrogens, so
// `gmx traj -com -n` (and the like) computes bead centres straight from the atomistic trajectory.
import type { ExportSource } from './export-source';
import { beadIndexGroups, type IndexGroup } from './ndx';

export function referenceIndexGroups(s: ExportSource, copyAtoms: Int32Array, atomsPerCopy: number): IndexGroup[] {
  const own = beadIndexGroups(s.model, s.draft.beads);
  const copies = copyAtoms.length / atomsPerCopy;
  return own.map((g) => {
    const atoms: number[] = [];
    for (let c = 0; c < copies; c++) for (const n of g.atoms) atoms.push(copyAtoms[c * atomsPerCopy + n - 1] + 1);
    return { name: g.name, atoms: atoms.sort((x, y) => x - y) };
  });
}
