/**
 * A reference's structure: every atom's element, name and residue, the first frame's coordinates
 * (Å), the box, and CONECT bonds when the file has them. GRO through molstar's reader, PDB through
 * its line tokenizer (wwPDB columns), MDL molfiles (V2000) by their fixed columns, whose bond block
 * gives the bonds. GRO has no element column: the element is read from the atom name, preferring
 * the molecule's own elements for two-letter starts (so "CL1" is chlorine only when the molecule
 * has chlorine; common practice, no source).
 */
import { readFile } from 'node:fs/promises';
import { parseGRO } from 'molstar/lib/mol-io/reader/gro/parser.js';
import { pdbFrames } from './read-frames';
import type { StructureFormat } from './formats';

export interface StructureAtoms {
  count: number;
  elements: string[];
  names: string[];
  residues: string[];
  residueNumbers: number[];
  xyz: Float32Array;
  box: Float64Array | null;
  bonds: [number, number][];
}

export class StructureError extends Error {}

interface StrColumn {
  value(row: number): string;
}
interface NumColumn {
  value(row: number): number;
}

export async function readStructure(path: string, format: StructureFormat, moleculeElements: ReadonlySet<string>): Promise<StructureAtoms> {
  const text = (await readFile(path)).toString('latin1');
  if (format === 'gro') return groStructure(text, moleculeElements);
  if (format === 'pdb') return pdbStructure(text, moleculeElements);
  return molStructure(text);
}

export function elementFromName(name: string, known: ReadonlySet<string>): string {
  const letters = name.replace(/^[0-9]+/, '').replace(/[^A-Za-z].*$/, '');
  if (letters.length >= 2) {
    const two = letters[0].toUpperCase() + letters[1].toLowerCase();
    if (known.has(two)) return two;
  }
  return letters.slice(0, 1).toUpperCase();
}

async function groStructure(text: string, known: ReadonlySet<string>): Promise<StructureAtoms> {
  // Only the first frame: the text up to the first frame's end is enough, but molstar reads all.
  const r = await parseGRO(firstGroFrame(text)).run();
  if (r.isError || r.result.structures.length === 0) throw new StructureError(`The GRO file could not be read${r.isError ? `: ${r.message}` : ''}.`);
  const s = r.result.structures[0] as { header: { box: number[] }; atoms: { count: number; x: NumColumn; y: NumColumn; z: NumColumn; atomName: StrColumn; residueName: StrColumn; residueNumber: NumColumn } };
  const n = s.atoms.count;
  const names: string[] = [];
  const residues: string[] = [];
  const residueNumbers: number[] = [];
  const xyz = new Float32Array(3 * n);
  for (let i = 0; i < n; i++) {
    names.push(s.atoms.atomName.value(i).trim());
    residues.push(s.atoms.residueName.value(i).trim());
    residueNumbers.push(s.atoms.residueNumber.value(i));
    xyz[3 * i] = 10 * s.atoms.x.value(i);
    xyz[3 * i + 1] = 10 * s.atoms.y.value(i);
    xyz[3 * i + 2] = 10 * s.atoms.z.value(i);
  }
  const [a, b, c] = s.header.box;
  return { count: n, elements: names.map((nm) => elementFromName(nm, known)), names, residues, residueNumbers, xyz, box: a > 0 ? Float64Array.from([10 * a, 0, 0, 0, 10 * b, 0, 0, 0, 10 * c]) : null, bonds: [] };
}

function firstGroFrame(text: string): string {
  let at = 0;
  const next = () => {
    const nl = text.indexOf('\n', at);
    at = nl < 0 ? text.length : nl + 1;
  };
  next();
  const countEnd = text.indexOf('\n', at);
  const n = Number(text.slice(at, countEnd < 0 ? undefined : countEnd).trim());
  if (!Number.isInteger(n) || n <= 0) throw new StructureError('The GRO file has no atom count on its second line.');
  for (let i = 0; i < n + 2; i++) next();
  return text.slice(0, at);
}

async function pdbStructure(text: string, known: ReadonlySet<string>): Promise<StructureAtoms> {
  const end = text.search(/^(ENDMDL|END)\b/m);
  const first = end < 0 ? text : text.slice(0, end);
  const names: string[] = [];
  const residues: string[] = [];
  const residueNumbers: number[] = [];
  const elements: string[] = [];
  const serialToIndex = new Map<number, number>();
  for (const line of first.split('\n')) {
    const rec = line.slice(0, 6);
    if (rec !== 'ATOM  ' && rec !== 'HETATM') continue;
    serialToIndex.set(Number(line.slice(6, 11)), names.length);
    const name = line.slice(12, 16).trim();
    names.push(name);
    residues.push(line.slice(17, 21).trim());
    residueNumbers.push(Number(line.slice(22, 26)));
    const el = line.slice(76, 78).trim();
    elements.push(el ? el[0].toUpperCase() + el.slice(1).toLowerCase() : elementFromName(name, known));
  }
  if (names.length === 0) throw new StructureError('The PDB file has no ATOM or HETATM records.');
  const frames = await pdbFrames(end < 0 ? text : text.slice(0, end) + 'END\n');
  const bonds: [number, number][] = [];
  for (const line of text.split('\n')) {
    if (!line.startsWith('CONECT')) continue;
    const from = serialToIndex.get(Number(line.slice(6, 11)));
    for (let c = 11; c + 5 <= Math.max(line.trimEnd().length, 16); c += 5) {
      const to = serialToIndex.get(Number(line.slice(c, c + 5)));
      if (from !== undefined && to !== undefined) bonds.push([from, to]);
    }
  }
  return { count: names.length, elements, names, residues, residueNumbers, xyz: frames[0].xyz, box: frames[0].box, bonds };
}

function molStructure(text: string): StructureAtoms {
  const lines = text.split(/\r?\n/);
  const counts = lines[3] ?? '';
  if (!/V2000/.test(counts)) throw new StructureError('Only V2000 molfiles are read as reference structures.');
  const n = Number(counts.slice(0, 3));
  const nb = Number(counts.slice(3, 6));
  if (!Number.isInteger(n) || n <= 0 || lines.length < 4 + n + nb) throw new StructureError('The molfile is truncated.');
  const xyz = new Float32Array(3 * n);
  const elements: string[] = [];
  for (let i = 0; i < n; i++) {
    const l = lines[4 + i];
    xyz[3 * i] = Number(l.slice(0, 10));
    xyz[3 * i + 1] = Number(l.slice(10, 20));
    xyz[3 * i + 2] = Number(l.slice(20, 30));
    elements.push(l.slice(31, 34).trim());
  }
  const bonds: [number, number][] = [];
  for (let k = 0; k < nb; k++) {
    const l = lines[4 + n + k];
    bonds.push([Number(l.slice(0, 3)) - 1, Number(l.slice(3, 6)) - 1]);
  }
  return { count: n, elements, names: elements.map((e, i) => `${e}${i + 1}`), residues: elements.map(() => 'MOL'), residueNumbers: elements.map(() => 1), xyz, box: null, bonds };
}
