import type { Db } from '../db/knex';
import { mappingsWithMolecule } from '../mappings/mappings.service';
import type { Resolution } from '../../src/shared/chem';
import { notFound, unprocessable } from '../http/errors';
import { libraryFor } from '../bead-types/bead-types.service';

// Knex for exports: the rows an export file and the project download are written from.

/** A mapping with the molecule an export file needs; undefined when the mapping does not exist. */
export async function mappingForExport(db: Db, mappingId: number) {
  const row = await mappingsWithMolecule(db).where('p.id', mappingId).first('p.name', 'p.resolution', 'm.id as molecule_id', 'm.name as molecule_name', 'm.model', 'm.xyz', 'm.canonical_smiles');
  return row as { name: string; resolution: Resolution; molecule_id: number; molecule_name: string; model: string | null; xyz: string | null; canonical_smiles: string } | undefined;
}

/** Every mapping of a project in download order, with whether it has a locked production version. */
export async function projectMappings(db: Db, projectId: number): Promise<{ id: number; name: string; molecule_name: string; locked: number | null }[]> {
  return mappingsWithMolecule(db)
    .leftJoin('mapping_locks as l', 'l.mapping_id', 'p.id')
    .where('m.project_id', projectId)
    .orderBy(['m.name', 'p.name', 'p.id'])
    .select('p.id', 'p.name', 'm.name as molecule_name', 'l.mapping_id as locked');
}

/** The project's name, for the download's file name. */
export async function projectName(db: Db, projectId: number): Promise<string> {
  const row = await db('projects').where({ id: projectId }).first('name');
  return row?.name ?? `project-${projectId}`;
}

/**
 * The reference analysis an engine export takes its structure from. Analyses belong to the reference
 * trajectories module; until its table exists every id is unknown (404), never a made-up structure.
 */
export async function analysisForExport(db: Db, mappingId: number, analysisId: number): Promise<never> {
  if (!(await db.schema.hasTable('analyses'))) throw notFound('That analysis');
  const row = await db('analyses').where({ id: analysisId }).first('mapping_id');
  if (!row) throw notFound('That analysis');
  if (row.mapping_id !== mappingId) throw unprocessable('analysis_of_other_mapping', 'That analysis belongs to another mapping; pick one of this mapping\'s analyses.', { analysisId });
  throw unprocessable('analysis_structure_unavailable', 'Coordinates from an analysis\'s mean structure are not available yet in this build; export without analysis to use the 3D coordinates.', { analysisId });
}

/** The non-bonded parameters of the mapping's project library, by bead type name (nulls: not set). */
export async function libraryNonbonded(db: Db, mappingId: number): Promise<Map<string, { sigma: number | null; epsilon: number | null }>> {
  const row = await mappingsWithMolecule(db).where('p.id', mappingId).first('m.project_id');
  const types = row ? await libraryFor(db, row.project_id) : [];
  return new Map(types.map((t) => [t.name, { sigma: t.sigma ?? null, epsilon: t.epsilon ?? null }]));
}
