import type { Db } from '../db/knex';
import { mappingsWithMolecule } from '../mappings/mappings.service';
import type { Resolution } from '../../src/shared/chem';
import { conflict, notFound, unprocessable } from '../http/errors';
import type { AnalysisResult } from '../../src/shared/references';
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
 * A finished analysis of this mapping, for an export's structure or a fill of the bonded terms: 404
 * when it does not exist or belongs to another project (the caller was authorised for this mapping
 * only, so nothing about other projects leaks), 422 `analysis_of_other_mapping` for another mapping of
 * the same project, 409 `analysis_not_finished` until it is done.
 */
export async function finishedAnalysisOf(db: Db, mappingId: number, analysisId: number): Promise<{ id: number; referenceId: number; versionNumber: number | null; result: AnalysisResult }> {
  const row = await db('analyses as a')
    .join('mappings as p', 'p.id', 'a.mapping_id')
    .join('molecules as m', 'm.id', 'p.molecule_id')
    .where('a.id', analysisId)
    .first('a.id', 'a.mapping_id', 'a.reference_id', 'a.status', 'a.version_number', 'a.result', 'm.project_id');
  const own = await mappingsWithMolecule(db).where('p.id', mappingId).first('m.project_id');
  if (!row || !own || row.project_id !== own.project_id) throw notFound('That analysis');
  if (row.mapping_id !== mappingId) throw unprocessable('analysis_of_other_mapping', 'That analysis belongs to another mapping; pick one of this mapping\'s analyses.', { analysisId });
  if (row.status !== 'done' || !row.result) throw conflict('analysis_not_finished', `That analysis is ${row.status}; only a finished analysis has fitted values and a mean structure.`, { analysisId, status: row.status });
  return { id: row.id, referenceId: row.reference_id, versionNumber: row.version_number, result: JSON.parse(row.result) as AnalysisResult };
}

/** The non-bonded parameters of the mapping's project library, by bead type name (nulls: not set). */
export async function libraryNonbonded(db: Db, mappingId: number): Promise<Map<string, { sigma: number | null; epsilon: number | null }>> {
  const row = await mappingsWithMolecule(db).where('p.id', mappingId).first('m.project_id');
  const types = row ? await libraryFor(db, row.project_id) : [];
  return new Map(types.map((t) => [t.name, { sigma: t.sigma ?? null, epsilon: t.epsilon ?? null }]));
}
