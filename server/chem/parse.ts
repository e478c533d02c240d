/**
 * Input → openchemlib molecule, with every refusal as a ChemError.
 *
 * Accepts SMILES or an MDL molfile (V2000 or V3000; an SDF's first record). openchemlib does the
 * parsing; this module adds what it lets through silently: size limits, a counts line that does not
 * match the atom and bond blocks, over-full valences and aromatic rings that cannot be kekulized
 * (openchemlib turns those into radicals).
 */
import { Molecule } from 'openchemlib';
import { ChemError, LIMITS } from './errors';
import { placeMolfileAttachments, refuseMolfileQuery } from './molfile-attachments';
import { kekulizeWithRdkit } from './rdkit-kekule';
import { checkSmilesText } from './smiles-text';

/**
 * openchemlib reads `*` as a query atom and then drops every implicit hydrogen of the molecule, so an
 * attachment point is handed to it as a placeholder element instead: rutherfordium, which no molecule
 * Beadloom models contains (it has no standard atomic weight and is refused as input) and to which
 * openchemlib gives a valence of up to 6 and no implicit hydrogens. model.ts turns it into `*`.
 */
export const ATTACHMENT_PLACEHOLDER = 104;

export type OclMolecule = Molecule;

export type MoleculeInput = { smiles: string } | { molfile: string };

export interface ParsedInput {
  mol: OclMolecule;
  source: 'smiles' | 'molfile';
  /** The molfile header declares 3D coordinates (columns 21–22 of line 2). */
  declared3D: boolean;
  /** openchemlib atoms that stand for attachment points (`*`). */
  attachments: Set<number>;
  warnings: string[];
}

export function parseInput(input: MoleculeInput): ParsedInput {
  if ('smiles' in input && typeof input.smiles === 'string') return parseSmiles(input.smiles);
  if ('molfile' in input && typeof input.molfile === 'string') return parseMolfileText(input.molfile);
  throw new ChemError('empty_input', 'Give a molecule as { smiles } or { molfile }.');
}

function parseSmiles(raw: string): ParsedInput {
  const smiles = raw.trim();
  if (smiles.length === 0) throw new ChemError('empty_input', 'The SMILES string is empty.');
  if (smiles.length > LIMITS.smilesLength) {
    throw new ChemError(
      'smiles_too_long',
      `The SMILES string has ${smiles.length} characters; the limit is ${LIMITS.smilesLength}.`,
      { length: smiles.length, limit: LIMITS.smilesLength },
      413,
    );
  }
  const text = checkSmilesText(smiles);
  const oclText = text.attachments.length ? withPlaceholders(smiles) : smiles;
  let mol: OclMolecule;
  const warnings: string[] = [];
  try {
    // Coordinates are laid out once, later, on the folded model (ocl-build.ts): openchemlib's default
    // SMILES parse lays them out twice, which dominates parse time for large molecules.
    mol = Molecule.fromSmiles(oclText, { noCoordinates: true });
    checkParsed(mol, 'smiles', text.aromatic);
  } catch (err) {
    // openchemlib cannot kekulize some aromatic systems (porphyrins, corroles) and does not know
    // aromatic Te; RDKit's kekulization is tried before giving up (rdkit-kekule.ts).
    const kekulizable = text.aromatic && (!(err instanceof ChemError) || err.code === 'kekulization_failed');
    if (!kekulizable) throw err instanceof ChemError ? err : smilesError(err);
    const kekule = kekulizeWithRdkit(oclText);
    if (!kekule) throw err instanceof ChemError ? err : smilesError(err);
    mol = Molecule.fromMolfile(kekule);
    checkParsed(mol, 'smiles', false);
    warnings.push('openchemlib could not read the aromatic system; RDKit assigned its alternating bonds (Kekulé structure) and that was read.');
  }
  return { mol, source: 'smiles', declared3D: false, warnings, attachments: placeholderAtoms(mol) };
}

/** `*`, `[*]`, `[1*]`, `[*:2]` → `[Rf]` (see ATTACHMENT_PLACEHOLDER). */
function withPlaceholders(smiles: string): string {
  return smiles.replace(/\[\d*\*(?::\d+)?\]|\*/g, '[Rf]');
}

function placeholderAtoms(mol: OclMolecule): Set<number> {
  const out = new Set<number>();
  for (let i = 0; i < mol.getAllAtoms(); i++) if (mol.getAtomicNo(i) === ATTACHMENT_PLACEHOLDER) out.add(i);
  return out;
}

function smilesError(err: unknown): ChemError {
  const text = err instanceof Error ? err.message : String(err);
  const reason = text.replace(/^.*SmilesParser:\s*/, '').replace(/[;.]?\s*position:\s*\d+\s*$/i, '');
  const pos = /position:\s*(\d+)/i.exec(text);
  // openchemlib counts from 0; Beadloom's messages count characters from 1.
  const position = pos ? Number(pos[1]) + 1 : null;
  const where = position === null ? '' : ` at character ${position}`;
  return new ChemError('unparseable_smiles', `The SMILES could not be read${where}: ${reason}.`, {
    reason,
    position,
  });
}

function parseMolfileText(raw: string): ParsedInput {
  if (raw.trim().length === 0) throw new ChemError('empty_input', 'The molfile is empty.');
  if (raw.length > LIMITS.molfileLength) {
    throw new ChemError(
      'molfile_too_large',
      `The molfile has ${raw.length} characters; the limit is ${LIMITS.molfileLength}.`,
      { length: raw.length, limit: LIMITS.molfileLength },
      413,
    );
  }
  const warnings: string[] = [];
  const records = raw.replace(/\r\n?/g, '\n').split(/^\$\$\$\$\s*$/m).filter((r) => r.trim() !== '');
  if (records.length > 1) warnings.push(`The SD file holds ${records.length} records; only the first was read.`);
  const text = records[0];
  checkMolfileBlocks(text);
  const placed = placeMolfileAttachments(text);
  let mol: OclMolecule;
  try {
    mol = Molecule.fromMolfile(placed.text);
  } catch (err) {
    const reason = err instanceof Error ? err.message : String(err);
    throw new ChemError('unparseable_molfile', `The molfile could not be read: ${reason}.`, { reason });
  }
  refuseMolfileQuery(mol);
  checkParsed(mol, 'molfile', false);
  const declared3D = (text.split('\n')[1] ?? '').slice(20, 22) === '3D';
  return { mol, source: 'molfile', declared3D, warnings, attachments: placed.atoms.length ? placeholderAtoms(mol) : new Set() };
}

const ATOM_LINE = /^\s*-?\d+(\.\d+)?\s+-?\d+(\.\d+)?\s+-?\d+(\.\d+)?\s+[A-Za-z*#][A-Za-z0-9]*/;
const BOND_LINE = /^\s*\d+\s+\d+\s+\d+/;

/** The counts line must agree with the blocks below it; openchemlib would read a wrong one silently. */
function checkMolfileBlocks(text: string): void {
  const lines = text.split('\n');
  const v3 = lines.findIndex((l) => /^M {2}V30 COUNTS/.test(l));
  if (v3 >= 0) return checkV3000(lines, v3);
  const counts = lines[3];
  if (counts === undefined || !/V2000/.test(counts)) {
    throw new ChemError('unparseable_molfile', 'The molfile has no V2000 or V3000 counts line on line 4.', {
      line: 4,
    });
  }
  const atoms = Number(counts.slice(0, 3));
  const bonds = Number(counts.slice(3, 6));
  if (!Number.isInteger(atoms) || !Number.isInteger(bonds)) {
    throw new ChemError('bad_counts_line', 'The molfile counts line (line 4) does not start with atom and bond counts.', {
      line: 4,
    });
  }
  for (let i = 0; i < atoms; i++) {
    if (!ATOM_LINE.test(lines[4 + i] ?? '')) throw countsMismatch('atom', atoms, i, 5 + i);
  }
  for (let i = 0; i < bonds; i++) {
    if (!BOND_LINE.test(lines[4 + atoms + i] ?? '') || ATOM_LINE.test(lines[4 + atoms + i] ?? '')) {
      throw countsMismatch('bond', bonds, i, 5 + atoms + i);
    }
  }
  const after = lines[4 + atoms + bonds] ?? '';
  if (BOND_LINE.test(after) && !/^M /.test(after)) throw countsMismatch('bond', bonds, bonds + 1, 5 + atoms + bonds);
}

function countsMismatch(kind: 'atom' | 'bond', declared: number, found: number, line: number): ChemError {
  return new ChemError(
    'bad_counts_line',
    `The molfile counts line declares ${declared} ${kind}s, but line ${line} is not ${kind === 'atom' ? 'an atom' : 'a bond'} line as expected.`,
    { kind, declared, line },
  );
}

function checkV3000(lines: string[], countsAt: number): void {
  const m = /COUNTS\s+(\d+)\s+(\d+)/.exec(lines[countsAt]);
  if (!m) throw new ChemError('bad_counts_line', 'The V3000 COUNTS line does not give atom and bond counts.');
  const block = (name: string): number => {
    const start = lines.findIndex((l) => l.startsWith(`M  V30 BEGIN ${name}`));
    if (start < 0) return 0;
    let n = 0;
    for (let i = start + 1; i < lines.length && !lines[i].startsWith(`M  V30 END ${name}`); i++) {
      if (!lines[i - 1].endsWith('-')) n++;
    }
    return n;
  };
  const [atoms, bonds] = [Number(m[1]), Number(m[2])];
  const [foundAtoms, foundBonds] = [block('ATOM'), block('BOND')];
  if (atoms !== foundAtoms || bonds !== foundBonds) {
    throw new ChemError(
      'bad_counts_line',
      `The V3000 COUNTS line declares ${atoms} atoms and ${bonds} bonds, but the blocks hold ${foundAtoms} and ${foundBonds}.`,
      { declared: { atoms, bonds }, found: { atoms: foundAtoms, bonds: foundBonds } },
    );
  }
}

function checkParsed(mol: OclMolecule, source: 'smiles' | 'molfile', aromaticInput: boolean): void {
  mol.ensureHelperArrays(Molecule.cHelperRings);
  const n = mol.getAllAtoms();
  if (n === 0) throw new ChemError('empty_input', `The ${source === 'smiles' ? 'SMILES' : 'molfile'} holds no atoms.`);
  let heavy = 0;
  for (let i = 0; i < n; i++) if (mol.getAtomicNo(i) !== 1) heavy++;
  if (heavy > LIMITS.heavyAtoms) {
    throw new ChemError(
      'too_many_atoms',
      `The molecule has ${heavy} heavy atoms; the limit is ${LIMITS.heavyAtoms}.`,
      { heavyAtoms: heavy, limit: LIMITS.heavyAtoms },
      413,
    );
  }
  for (let i = 0; i < n; i++) {
    const atomicNo = mol.getAtomicNo(i);
    const label = `Atom ${i + 1} (${mol.getAtomLabel(i)})`;
    // A placeholder stands for `*` (SMILES) or `*`/`R`/`R#` (molfile); a real Rf was refused before parsing.
    if (atomicNo === ATTACHMENT_PLACEHOLDER) continue;
    if (atomicNo === 0 || atomicNo > 118) {
      throw new ChemError('unsupported_atom', `${label} is not a chemical element Beadloom can weigh.`, { atom: i + 1 });
    }
    if (atomicNo === 1 && mol.getAllConnAtoms(i) > 1) {
      throw new ChemError('bridging_hydrogen', `${label} is bonded to ${mol.getAllConnAtoms(i)} atoms; a hydrogen bridging two atoms (as in boranes) has no place in Beadloom's model, where each hydrogen belongs to one heavy atom.`, { atom: i + 1 });
    }
    const used = mol.getOccupiedValence(i) + mol.getImplicitHydrogens(i);
    if (used > mol.getMaxValence(i)) {
      throw new ChemError(
        'valence_error',
        `${label} has ${used} bonds' worth of valence; at most ${mol.getMaxValence(i)} are allowed with charge ${mol.getAtomCharge(i)}.`,
        { atom: i + 1, element: mol.getAtomLabel(i), valence: used, max: mol.getMaxValence(i) },
      );
    }
    // openchemlib gives up on an aromatic system it cannot kekulize by making one ring atom a radical.
    if (aromaticInput && mol.getAtomRadical(i) !== 0 && mol.isRingAtom(i)) {
      throw new ChemError(
        'kekulization_failed',
        `The aromatic ring around atom ${i + 1} (${mol.getAtomLabel(i)}) cannot be written with alternating single and double bonds (neither openchemlib nor RDKit finds a Kekulé structure): check that every pyrrole-type nitrogen that carries a hydrogen is written [nH] and that the ring's atom count and charges allow an aromatic system, or give the Kekulé form.`,
        { atom: i + 1, element: mol.getAtomLabel(i) },
      );
    }
  }
}
