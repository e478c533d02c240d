import * as Y from 'yjs';
import type { Db } from '../db/knex';
import type { Mapping } from '../../src/shared/chem';
import type { ProjectMappingSummary, CreateMappingBody, MappingSummary, UpdateMappingBody } from '../../src/shared/mappings';
import { mappingToDoc } from '../../src/shared/mapping-doc';
import { conflict, notFound } from '../http/errors';
import { writeSnapshot } from './draft-snapshots.service';

// Knex for `mappings`. The draft itself lives in mapping_updates / mapping_snapshots (drafts/drafts.service.ts).

interface MappingRow {
  id: number;
  molecule_id: number;
  project_id: number;
  name: string;
  resolution: MappingSummary['resolution'];
  description: string;
  locked: number | boolean;
  bead_count: number;
  created_at: Date;
  updated_at: Date;
}

const COLUMNS = ['p.id', 'p.molecule_id', 'm.project_id', 'p.name', 'p.resolution', 'p.description', 'p.locked', 'p.bead_count', 'p.created_at', 'p.updated_at'];

export function toMappingSummary(row: MappingRow): MappingSummary {
  return {
    id: row.id,
    moleculeId: row.molecule_id,
    projectId: row.project_id,
    name: row.name,
    resolution: row.resolution,
    description: row.description,
    locked: !!row.locked,
    beadCount: row.bead_count,
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

/**
 * The mapping→molecule join, written once: `p` is the mapping, `m` its molecule (and through it the
 * project). Every query that needs a mapping with its molecule or project starts here.
 */
export const mappingsWithMolecule = (db: Db) => db('mappings as p').join('molecules as m', 'm.id', 'p.molecule_id');
const base = mappingsWithMolecule;

export async function listMappings(db: Db, moleculeId: number): Promise<MappingSummary[]> {
  const rows = await base(db).where('p.molecule_id', moleculeId).orderBy('p.name').orderBy('p.id').select(COLUMNS);
  return rows.map(toMappingSummary);
}

/** Every mapping of the project's live molecules, with its molecule's name (transfer sources). */
export async function listProjectMappings(db: Db, projectId: number): Promise<ProjectMappingSummary[]> {
  const rows = await base(db).where('m.project_id', projectId).where('m.archived', false).orderBy('m.name').orderBy('p.name').orderBy('p.id').select([...COLUMNS, 'm.name as molecule_name']);
  return rows.map((r) => ({ ...toMappingSummary(r), moleculeName: r.molecule_name as string }));
}

export async function findMapping(db: Db, id: number): Promise<MappingSummary> {
  const row = await base(db).where('p.id', id).first(COLUMNS);
  if (!row) throw notFound('That mapping');
  return toMappingSummary(row);
}

/** Creates a mapping whose draft is empty or a copy of `draft` (bead ids kept). */
export async function createMapping(db: Db, moleculeId: number, body: CreateMappingBody, userId: number, draft: Mapping | null): Promise<number> {
  return db.transaction(async (trx) => {
    const [id] = await trx('mappings').insert({
      molecule_id: moleculeId,
      name: body.name,
      resolution: body.resolution,
      description: body.description ?? '',
      created_by: userId,
      bead_count: draft?.beads.length ?? 0,
    });
    if (draft) {
      const doc = new Y.Doc();
      mappingToDoc(doc, draft);
      await writeSnapshot(trx, id, Y.encodeStateAsUpdate(doc), 0);
    }
    return id;
  });
}

export async function updateMapping(db: Db, id: number, patch: UpdateMappingBody): Promise<void> {
  await db('mappings').where({ id }).update({ ...patch, updated_at: db.fn.now() });
}

/** A mapping of this molecule (the source of a copy must be one). */
/** REST edits of a locked mapping answer 409 mapping_locked (the lock itself is server/lock's). */
export async function assertUnlocked(db: Db, mappingId: number): Promise<void> {
  const row = await db('mappings').where({ id: mappingId }).first('locked');
  if (row?.locked) throw conflict('mapping_locked', 'This mapping is locked for production; unlock it before changing the draft.');
}

