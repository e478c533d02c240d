import type { Db } from '../db/knex';
import type { Molecule } from '../../src/shared/chem';
import type { UploadRecordResult } from '../../src/shared/molecules';
import { parseInThread } from '../workers/parse-thread';
import { AppError, unprocessable } from '../http/errors';
import { chemToAppError } from './chem-errors';
import { parseModel, toSummary } from './molecule-view';
import { findMolecule, insertMolecule, refuseDuplicate, setXyz } from './molecules.service';
import { looksLikeMolfile, SDF_RECORDS_MAX, splitSdf } from './sdf';

// Uploaded molfile / SD files: each record becomes a molecule (with a per-record result), or one
// record's 3D coordinates are attached to an existing molecule after checking its atoms match.

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

export function readStructureFile(file: UploadedFile): string {
  const text = file.buffer.toString('utf8');
  if (text.includes('\u0000') || !looksLikeMolfile(text)) {
    throw unprocessable('unsupported_format', `${file.originalname} is not an MDL molfile or SD file (no V2000/V3000 counts line and "M  END").`, { file: file.originalname });
  }
  return text;
}

function errorBody(err: unknown): { code: string; message: string; details?: unknown } {
  const e = chemToAppError(err);
  if (e instanceof AppError) return { code: e.code, message: e.message, ...(e.details !== undefined ? { details: e.details } : {}) };
  throw err;
}

export async function importRecords(db: Db, projectId: number, userId: number, file: UploadedFile, text: string, name?: string, allowDuplicate = false): Promise<UploadRecordResult[]> {
  const records = splitSdf(text);
  if (records.length > SDF_RECORDS_MAX) throw new AppError(413, 'payload_too_large', `An SD file holds at most ${SDF_RECORDS_MAX} records; this one has ${records.length}.`, { limit: SDF_RECORDS_MAX });
  const base = file.originalname.replace(/\.(sdf?|mol)$/i, '');
  const results: UploadRecordResult[] = [];
  for (const r of records) {
    const recordName = (records.length === 1 && name) || r.data.name || r.data.Name || r.title || `${base} #${r.record}`;
    try {
      const model = await parseInThread({ molfile: r.molfile });
      await refuseDuplicate(db, projectId, model.canonicalSmiles, allowDuplicate);
      const id = await insertMolecule(db, { projectId, userId, name: recordName.slice(0, 200), source: 'molfile', model });
      results.push({ record: r.record, name: recordName, ok: true, molecule: toSummary(await findMolecule(db, id), null) });
    } catch (err) {
      results.push({ record: r.record, name: recordName, ok: false, error: errorBody(err) });
    }
  }
  return results;
}

/** The first atom where the file's structure differs from the molecule's, or null when they match. */
export function firstMismatch(molecule: Molecule, file: Molecule): { message: string; details: Record<string, unknown> } | null {
  const n = Math.max(molecule.atoms.length, file.atoms.length);
  for (let i = 0; i < n; i++) {
    const a = molecule.atoms[i];
    const b = file.atoms[i];
    if (!a || !b) {
      return { message: `The file has ${file.atoms.length} heavy atoms; the molecule has ${molecule.atoms.length}.`, details: { atom: i, expected: a?.element ?? null, found: b?.element ?? null } };
    }
    if (a.element !== b.element) return { message: `Atom ${i + 1} is ${a.element} in the molecule but ${b.element} in the file.`, details: { atom: i, expected: a.element, found: b.element } };
    if (a.hydrogens !== b.hydrogens) {
      return { message: `Atom ${i + 1} (${a.element}) carries ${a.hydrogens} hydrogen(s) in the molecule but ${b.hydrogens} in the file.`, details: { atom: i, expected: a.hydrogens, found: b.hydrogens } };
    }
  }
  return null;
}

export async function attachCoordinates(db: Db, moleculeId: number, text: string): Promise<void> {
  const records = splitSdf(text);
  if (records.length !== 1) throw unprocessable('one_record_expected', `Coordinates come from a file with one structure; this one has ${records.length}.`, { records: records.length });
  const row = await findMolecule(db, moleculeId);
  // A ChemError propagates; the error middleware answers it in the shared shape.
  const file: Molecule = await parseInThread({ molfile: records[0].molfile });
  const mismatch = firstMismatch(parseModel(row), file);
  if (mismatch) throw unprocessable('structure_mismatch', `The file's atoms do not match the molecule: ${mismatch.message}`, mismatch.details);
  if (!file.coordinates) {
    throw unprocessable('no_3d_coordinates', 'The file has no usable 3D coordinates (it is flat, or not every hydrogen is given).', { warnings: file.warnings });
  }
  await setXyz(db, moleculeId, file.coordinates, 'upload');
}
