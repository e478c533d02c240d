import type { Db } from '../db/knex';
import type { Molecule } from '../../src/shared/chem';
import type { DuplicateMoleculeDetails, ListMoleculesQuery, UpdateMoleculeBody } from '../../src/shared/molecules';
import { conflict, notFound } from '../http/errors';
import { SUMMARY_COLUMNS, type MoleculeRow } from './molecule-view';

// Knex for the `molecules` table. The model is written once, at creation: atom indices never change.

export interface NewMolecule {
  projectId: number;
  userId: number | null;
  name: string;
  notes?: string;
  tags?: string[];
  source: 'smiles' | 'molfile';
  /** The SMILES as entered (smiles source) — uploads store the canonical SMILES. */
  smiles?: string;
  model: Molecule;
}

const mappingCount = (db: Db) => db('mappings').count('*').whereRaw('mappings.molecule_id = m.id').as('mapping_count');

export async function insertMolecule(db: Db, m: NewMolecule): Promise<number> {
  const hasXyz = m.model.coordinates !== null;
  const [id] = await db('molecules').insert({
    project_id: m.projectId,
    name: m.name,
    smiles: m.smiles ?? m.model.canonicalSmiles,
    notes: m.notes ?? '',
    created_by: m.userId,
    source: m.source,
    canonical_smiles: m.model.canonicalSmiles,
    formula: m.model.formula,
    molecular_weight: m.model.molecularWeight,
    log_p: m.model.logP,
    heavy_atoms: m.model.heavyAtoms ?? m.model.atoms.length,
    net_charge: m.model.netCharge,
    model: JSON.stringify(m.model),
    xyz: hasXyz ? JSON.stringify(m.model.coordinates) : null,
    xyz_source: hasXyz ? 'upload' : null,
    conformer_status: hasXyz ? 'none' : 'queued',
    tags: JSON.stringify(m.tags ?? []),
  });
  return id;
}

/** The project's molecule with this canonical SMILES (a live one before an archived one), or null. */
export async function findDuplicate(db: Db, projectId: number, canonicalSmiles: string): Promise<DuplicateMoleculeDetails | null> {
  const row = await db('molecules').where({ project_id: projectId, canonical_smiles: canonicalSmiles }).orderBy('archived').orderBy('id').first('id', 'name', 'archived');
  return row ? { existing: { id: row.id, name: row.name, archived: !!row.archived }, canonicalSmiles } : null;
}

/**
 * Refuses (409 duplicate_molecule, the existing molecule in `details`) a structure the project
 * already has, unless the caller said to allow it: a second copy is usually an accident, and its
 * mappings would be split from the first one's.
 */
export async function refuseDuplicate(db: Db, projectId: number, canonicalSmiles: string, allow: boolean | undefined): Promise<void> {
  if (allow) return;
  const dup = await findDuplicate(db, projectId, canonicalSmiles);
  if (!dup) return;
  throw conflict('duplicate_molecule', `This project already has this structure as ${dup.existing.name}${dup.existing.archived ? ' (archived)' : ''}; open it, or add this one anyway.`, dup);
}

export async function listMolecules(db: Db, projectId: number, q: ListMoleculesQuery): Promise<MoleculeRow[]> {
  const query = db('molecules as m').where('m.project_id', projectId).select(...SUMMARY_COLUMNS, mappingCount(db)).orderBy('m.name').orderBy('m.id');
  if (q.archived === 'exclude') query.where('m.archived', false);
  if (q.archived === 'only') query.where('m.archived', true);
  if (q.tag) query.whereRaw('JSON_CONTAINS(m.tags, JSON_QUOTE(?))', [q.tag]);
  if (q.q) {
    const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    query.where((w) => {
      for (const col of ['m.name', 'm.notes', 'm.formula', 'm.canonical_smiles', 'm.smiles']) w.orWhere(col, 'like', like);
    });
  }
  return query;
}

export async function findMolecule(db: Db, id: number, withXyz = false): Promise<MoleculeRow> {
  const row = await db('molecules as m')
    .where('m.id', id)
    .first(...SUMMARY_COLUMNS, ...(withXyz ? ['m.xyz'] : []), mappingCount(db));
  if (!row) throw notFound('That molecule');
  return row;
}

export async function updateMolecule(db: Db, id: number, patch: UpdateMoleculeBody): Promise<void> {
  await db('molecules')
    .where({ id })
    .update({
      ...(patch.name !== undefined ? { name: patch.name } : {}),
      ...(patch.notes !== undefined ? { notes: patch.notes } : {}),
      ...(patch.tags !== undefined ? { tags: JSON.stringify(patch.tags) } : {}),
      ...(patch.archived !== undefined ? { archived: patch.archived } : {}),
      updated_at: db.fn.now(),
    });
}

/**
 * Whether any mapping of the molecule has a saved version. Versions are stored by the versions
 * feature in `mapping_versions` (mapping_id); until that table exists nothing is versioned.
 */
async function hasVersions(db: Db, moleculeId: number): Promise<boolean> {
  if (!(await db.schema.hasTable('mapping_versions'))) return false;
  const row = await db('mapping_versions as v').join('mappings as p', 'p.id', 'v.mapping_id').where('p.molecule_id', moleculeId).first('v.mapping_id');
  return !!row;
}

/** Deletes the molecule (and its mappings), or archives it when a mapping of it has a version. */
export async function deleteOrArchive(db: Db, id: number): Promise<'deleted' | 'archived'> {
  if (await hasVersions(db, id)) {
    await updateMolecule(db, id, { archived: true });
    return 'archived';
  }
  await db('molecules').where({ id }).delete();
  return 'deleted';
}

export async function setXyz(db: Db, id: number, xyz: number[][], source: 'upload' | 'conformer'): Promise<void> {
  await db('molecules').where({ id }).update({ xyz: JSON.stringify(xyz), xyz_source: source, conformer_status: source === 'upload' ? 'none' : 'done', conformer_error: null, updated_at: db.fn.now() });
}

/** Whether the molecule belongs to the project (an upload may replace only its own project's coordinates). */
export async function isMoleculeOf(db: Db, moleculeId: number, projectId: number): Promise<boolean> {
  return !!(await db('molecules').where({ id: moleculeId, project_id: projectId }).first('id'));
}
