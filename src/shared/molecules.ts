import { z } from 'zod';
import { NAME_MAX } from './fields';
import type { Molecule } from './chem';
import { refineSmilesCharacters } from './smiles-text';

// Molecules of a project: create from SMILES or molfile text, upload molfile/SDF files, list, edit.

export const SMILES_MAX = 5000;
export const MOLFILE_MAX = 1_000_000;
export const UPLOAD_MAX_BYTES = 2 * 1024 * 1024;
export const UPLOAD_FIELD = 'file';
export const TAG_MAX = 40;
export const TAGS_MAX = 20;
export const NOTES_MAX = 10_000;

const name = z.string().trim().min(1, 'Enter a molecule name.').max(NAME_MAX, `A name has at most ${NAME_MAX} characters.`);
const notes = z.string().trim().max(NOTES_MAX, `Notes have at most ${NOTES_MAX} characters.`);
const tag = z.string().trim().toLowerCase().min(1, 'A tag is not empty.').max(TAG_MAX, `A tag has at most ${TAG_MAX} characters.`);
const tags = z.array(tag).max(TAGS_MAX, `At most ${TAGS_MAX} tags.`).transform((t) => [...new Set(t)]);

/** A SMILES string: trimmed, within the length limit, printable ASCII only (the bad character's position is named). */
export const smilesText = z
  .string()
  .trim()
  .min(1, 'Enter a SMILES string.')
  .max(SMILES_MAX, `A SMILES string has at most ${SMILES_MAX} characters.`)
  .superRefine(refineSmilesCharacters);

/** Exactly one of `smiles` and `molfile`. */
export const createMoleculeBody = z
  .strictObject({
    name,
    smiles: smilesText.optional(),
    molfile: z.string().min(1, 'Paste a molfile.').max(MOLFILE_MAX, `A molfile has at most ${MOLFILE_MAX} characters.`).optional(),
    notes: notes.optional(),
    tags: tags.optional(),
    /** Create it even when the project already has a molecule with the same canonical SMILES. */
    allowDuplicate: z.boolean().optional(),
  })
  .refine((b) => (b.smiles === undefined) !== (b.molfile === undefined), { message: 'Give either smiles or molfile, not both.', path: ['smiles'] });
export type CreateMoleculeBody = z.infer<typeof createMoleculeBody>;

export const updateMoleculeBody = z
  .strictObject({ name, notes, tags, archived: z.boolean() })
  .partial()
  .refine((b) => Object.keys(b).length > 0, 'Change at least one field.');
export type UpdateMoleculeBody = z.infer<typeof updateMoleculeBody>;

/** `GET /api/projects/:id/molecules?q=&tag=&archived=` — q searches name, notes, formula and SMILES. */
export const listMoleculesQuery = z.strictObject({
  q: z.string().trim().max(200).optional(),
  tag: tag.optional(),
  archived: z.enum(['include', 'only', 'exclude']).default('exclude'),
});
export type ListMoleculesQuery = z.infer<typeof listMoleculesQuery>;

/** Multipart fields of `POST /api/projects/:id/molecules/upload` besides the file. */
export const uploadFields = z.strictObject({
  /** Name for a single-record file; records of an SDF use their title line, else "<file> #n". */
  name: name.optional(),
  /** Attach the file's 3D coordinates to this existing molecule instead of creating molecules. */
  moleculeId: z.coerce.number().int().positive().optional(),
  /** "true": create records even when the project already has a molecule with the same canonical SMILES. */
  allowDuplicate: z.enum(['true', 'false']).transform((v) => v === 'true').optional(),
});
export type UploadFields = z.infer<typeof uploadFields>;

export type ConformerStatus = 'none' | 'queued' | 'running' | 'done' | 'failed';
export type CoordinatesSource = 'upload' | 'conformer';

export interface CoordinatesState {
  source: CoordinatesSource | null;
  status: ConformerStatus;
  /** Jobs ahead of this one while queued, else null. */
  queuePosition: number | null;
  error: string | null;
}

/**
 * A small drawing for lists, enough for the app's renderer (src/shared/drawing/sketch.ts):
 * [element, x, y, charge, hydrogens, isotope (0 = none), attachment (1 = `*`)] per heavy atom and
 * [a, b, Kekulé order, aromatic (1/0)] per bond.
 */
export interface MoleculeSketch {
  atoms: [string, number, number, number, number, number, number][];
  bonds: [number, number, number, number][];
}

export interface MoleculeSummary {
  id: number;
  projectId: number;
  name: string;
  /** The SMILES as entered; for uploads, the canonical SMILES. */
  smiles: string;
  canonicalSmiles: string;
  formula: string;
  molecularWeight: number;
  logP: number;
  /** Set for a charged species (ion, salt, zwitterion): its additive logP is not a partition value. */
  logPWarning: string | null;
  heavyAtoms: number;
  netCharge: number;
  notes: string;
  tags: string[];
  archived: boolean;
  source: 'smiles' | 'molfile';
  coordinates: CoordinatesState;
  mappingCount: number;
  sketch: MoleculeSketch;
  createdAt: string;
  updatedAt: string;
}

export interface MoleculeDetail extends MoleculeSummary {
  /** The canonical model, fixed at creation: atom indices never change afterwards. */
  model: Molecule;
  /** 3D coordinates (Å) in the contract's order (heavy atoms, then hydrogens), or null. */
  xyz: number[][] | null;
}

/** DELETE answers 204 when nothing was versioned, else 200 with `{ archived: true }` and the molecule kept. */
export interface DeleteMoleculeResponse {
  archived: true;
  molecule: MoleculeSummary;
}

/**
 * `details` of a 409 `duplicate_molecule` (create) or of a record's `duplicate_molecule` error
 * (upload): the project's molecule with the same canonical SMILES. Send `allowDuplicate: true` to
 * create it anyway (molecules with the same structure may differ in atom order, e.g. from a molfile).
 */
export interface DuplicateMoleculeDetails {
  existing: { id: number; name: string; archived: boolean };
  canonicalSmiles: string;
}

export type UploadRecordResult =
  | { record: number; name: string; ok: true; molecule: MoleculeSummary }
  | { record: number; name: string; ok: false; error: { code: string; message: string; details?: unknown } };

/** 201 when at least one record became a molecule, else 422 in the shared error shape. */
export interface UploadResponse {
  records: UploadRecordResult[];
  created: number;
  failed: number;
}
