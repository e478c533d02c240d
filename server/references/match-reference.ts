/**
 * Finds every copy of the molecule in a reference (run in a thread: match-worker.ts). Bonds come from
 * the structure's first frame (bond-perception.ts, plus CONECT/molfile bonds), candidate copies from
 * the selection or, without one, from the connected groups of atoms of the molecule's size; each is
 * matched to the molecule's atom order (copy-matching.ts). The trajectory is indexed frame by frame
 * (frame-index.ts), which also proves it whole. Results go to files in `outDir`: copies.bin (Int32,
 * copy after copy, the reference atom of each molecule point) and frames.json (the frame index).
 */
import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Molecule } from '../../src/shared/chem';
import type { ReferenceSelection } from '../../src/shared/references-selection';
import { perceiveBonds, type BondGraph } from '../trajectory/bond-perception';
import { matchCopy, type CopyMisfit } from '../trajectory/copy-matching';
import { moleculeGraph, type MoleculeGraph } from '../trajectory/molecule-graph';
import { FrameError, indexFrames, type FrameIndex } from './frame-index';
import type { StructureFormat, TrajectoryFormat } from './formats';
import { MatchError } from './match-errors';
import { readStructure, StructureError, type StructureAtoms } from './structure-file';

export interface MatchTask {
  structure: { path: string; format: StructureFormat };
  trajectory: { path: string; format: TrajectoryFormat } | null;
  selection: ReferenceSelection | null;
  molecule: Pick<Molecule, 'atoms' | 'bonds'>;
  outDir: string;
}

export interface MatchResult {
  copies: number;
  atomsPerCopy: number;
  atomsTotal: number;
  frames: number;
  /** The trajectory the analyses read: the uploaded one, or the structure (or its XYZ copy). */
  source: { path: string; format: TrajectoryFormat };
}

export async function matchReference(task: MatchTask, progress: (done: number, total: number) => void): Promise<MatchResult> {
  if (task.molecule.atoms.some((a) => a.element === '*')) {
    throw new MatchError('repeat_unit_reference', 'This molecule is a repeat unit (it has attachment points); references of polymers are not read yet.');
  }
  const mol = moleculeGraph(task.molecule);
  let s: StructureAtoms;
  try {
    s = await readStructure(task.structure.path, task.structure.format, new Set(mol.elements));
  } catch (err) {
    if (err instanceof StructureError) throw new MatchError('unreadable_structure', err.message);
    throw err;
  }
  progress(1, 4);
  const candidates = candidatesOf(s, mol, task.selection);
  const inSelection = candidates.flat();
  if (mol.hydrogens > 0 && !inSelection.some((a) => s.elements[a] === 'H')) {
    throw new MatchError('united_atom_reference', 'The reference has no hydrogen atoms: it looks like a united-atom model. Beadloom matches all-atom references only (every hydrogen written out), so bead centres follow the molecule’s atoms exactly.');
  }
  const graph = perceiveBonds(s.elements, s.xyz, s.box, s.bonds, Int32Array.from(inSelection));
  const groups = task.selection && 'start' in task.selection ? candidates : componentsOf(graph, candidates);
  progress(2, 4);

  const copies: Int32Array[] = [];
  let firstMisfit: CopyMisfit | null = null;
  let wrongSize: number[] | null = null;
  let template: Int32Array | undefined;
  let templateBase: number | undefined;
  for (const group of groups) {
    if (group.length !== mol.total && !(task.selection && 'start' in task.selection)) {
      if (!wrongSize && group.some((a) => mol.elements.includes(s.elements[a]))) wrongSize = group;
      continue;
    }
    const sorted = [...group].sort((a, b) => a - b);
    const m = matchCopy(mol, s.elements, graph, sorted, template, templateBase);
    if (m.ok) {
      copies.push(m.atoms);
      template = m.atoms;
      templateBase = sorted[0];
    } else {
      firstMisfit ??= m;
      if (task.selection) break;
    }
  }
  if (firstMisfit && (task.selection || copies.length === 0)) {
    const a = firstMisfit.atom;
    throw new MatchError('molecule_not_found', `Atom ${a + 1} (${s.names[a]} of residue ${s.residues[a]} ${s.residueNumbers[a]}) does not fit the molecule: ${firstMisfit.reason}.`, { atom: a + 1, name: s.names[a], residue: s.residues[a] });
  }
  if (copies.length === 0) {
    if (wrongSize) {
      const a = Math.min(...wrongSize);
      throw new MatchError('molecule_not_found', `The molecule (${mol.total} atoms with hydrogens) is not in the reference: atom ${a + 1} (${s.names[a]} of residue ${s.residues[a]} ${s.residueNumbers[a]}) is in a bonded group of ${wrongSize.length} atoms.`, { atom: a + 1, groupSize: wrongSize.length, expected: mol.total });
    }
    throw new MatchError('molecule_not_found', `The molecule (${mol.total} atoms with hydrogens) is not in the reference.`, { expected: mol.total });
  }

  let index: FrameIndex;
  let source: MatchResult['source'];
  if (task.trajectory) source = task.trajectory;
  else if (task.structure.format === 'mol') {
    source = { path: join(task.outDir, 'frames.xyz'), format: 'xyz' };
    await writeFile(source.path, xyzOf(s));
  } else source = { path: task.structure.path, format: task.structure.format };
  try {
    index = await indexFrames(source.path, source.format, (done, total) => progress(2 + done / Math.max(1, total), 4));
  } catch (err) {
    if (err instanceof FrameError) throw new MatchError('unreadable_trajectory', err.message, { frame: err.frame });
    throw err;
  }
  if (index.atoms !== s.count) {
    throw new MatchError('atom_count_mismatch', `The trajectory has ${index.atoms} atoms per frame; the structure has ${s.count}.`, { trajectory: index.atoms, structure: s.count });
  }
  const all = new Int32Array(copies.length * mol.total);
  copies.forEach((c, i) => all.set(c, i * mol.total));
  await writeFile(join(task.outDir, 'copies.bin'), new Uint8Array(all.buffer));
  await writeFile(join(task.outDir, 'frames.json'), JSON.stringify(index));
  progress(4, 4);
  return { copies: copies.length, atomsPerCopy: mol.total, atomsTotal: s.count, frames: index.offsets.length - 1, source };
}

function candidatesOf(s: StructureAtoms, mol: MoleculeGraph, sel: ReferenceSelection | null): number[][] {
  if (!sel) return [Array.from({ length: s.count }, (_, i) => i)];
  if ('residue' in sel) {
    const atoms: number[] = [];
    for (let i = 0; i < s.count; i++) if (s.residues[i] === sel.residue) atoms.push(i);
    if (atoms.length === 0) throw new MatchError('molecule_not_found', `No atom of the reference belongs to a residue named ${sel.residue}.`, { residue: sel.residue });
    return [atoms];
  }
  if (sel.atomsPerCopy !== mol.total) {
    throw new MatchError('molecule_not_found', `The selection has ${sel.atomsPerCopy} atoms per copy; the molecule has ${mol.total} (hydrogens included).`, { atomsPerCopy: sel.atomsPerCopy, expected: mol.total });
  }
  const end = sel.start - 1 + sel.atomsPerCopy * sel.copies;
  if (end > s.count) throw new MatchError('molecule_not_found', `The selection runs to atom ${end}; the reference has ${s.count} atoms.`, { end, atoms: s.count });
  return Array.from({ length: sel.copies }, (_, c) => Array.from({ length: sel.atomsPerCopy }, (_, k) => sel.start - 1 + c * sel.atomsPerCopy + k));
}

/** Connected groups of bonded atoms within the candidate atoms, in order of their first atom. */
function componentsOf(graph: BondGraph, candidates: number[][]): number[][] {
  const allowed = new Set(candidates.flat());
  const seen = new Set<number>();
  const out: number[][] = [];
  for (const root of [...allowed].sort((a, b) => a - b)) {
    if (seen.has(root)) continue;
    seen.add(root);
    const group = [root];
    for (let q = 0; q < group.length; q++) {
      const u = group[q];
      for (let k = graph.start[u]; k < graph.start[u + 1]; k++) {
        const v = graph.adj[k];
        if (seen.has(v) || !allowed.has(v)) continue;
        seen.add(v);
        group.push(v);
      }
    }
    out.push(group);
  }
  return out;
}

function xyzOf(s: StructureAtoms): string {
  const lines = [String(s.count), 'structure'];
  for (let i = 0; i < s.count; i++) lines.push(`${s.elements[i]} ${s.xyz[3 * i]} ${s.xyz[3 * i + 1]} ${s.xyz[3 * i + 2]}`);
  return lines.join('\n') + '\n';
}
