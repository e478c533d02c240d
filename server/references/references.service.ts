import type { Db } from '../db/knex';
import type { Progress, ReferenceStatus, ReferenceView } from '../../src/shared/references';
import type { ReferenceSelection } from '../../src/shared/references-selection';
import type { StructureFormat, TrajectoryFormat } from './formats';

// All Knex of references: rows, job state (status, progress) and what matching found.

export interface ReferenceRow {
  id: number;
  molecule_id: number;
  project_id: number;
  name: string;
  status: ReferenceStatus;
  progress_done: number;
  progress_total: number;
  structure_name: string;
  structure_format: StructureFormat;
  trajectory_name: string | null;
  trajectory_format: TrajectoryFormat | null;
  selection: string | null;
  bytes: number | string;
  copies: number | null;
  frames: number | null;
  atoms_per_copy: number | null;
  atoms_total: number | null;
  source_format: TrajectoryFormat | null;
  error_code: string | null;
  error: string | null;
  error_details: string | null;
  created_by: number | null;
  created_at: Date;
}

export interface NewReference {
  moleculeId: number;
  projectId: number;
  name: string;
  structureName: string;
  structureFormat: StructureFormat;
  trajectoryName: string | null;
  trajectoryFormat: TrajectoryFormat | null;
  selection: ReferenceSelection | null;
  bytes: number;
  createdBy: number | null;
}

export function toReferenceView(r: ReferenceRow): ReferenceView {
  return {
    id: r.id,
    moleculeId: r.molecule_id,
    name: r.name,
    status: r.status,
    progress: { done: r.progress_done, total: r.progress_total },
    copies: r.copies,
    frames: r.frames,
    atomsPerCopy: r.atoms_per_copy,
    structureName: r.structure_name,
    trajectoryName: r.trajectory_name,
    bytes: Number(r.bytes),
    createdAt: new Date(r.created_at).toISOString(),
    ...(r.error
      ? { error: { code: r.error_code ?? 'failed', message: r.error, ...(r.error_details ? { details: JSON.parse(r.error_details) } : {}), ...(r.status === 'failed' && Number(r.bytes) > 0 ? { retryable: true } : {}) } }
      : {}),
  };
}

export async function projectBytes(db: Db, projectId: number): Promise<number> {
  const row = await db('simulation_references').where({ project_id: projectId }).sum({ total: 'bytes' }).first();
  return Number(row?.total ?? 0);
}

export async function insertReference(db: Db, r: NewReference): Promise<number> {
  const [id] = await db('simulation_references').insert({
    molecule_id: r.moleculeId,
    project_id: r.projectId,
    name: r.name,
    status: 'queued',
    structure_name: r.structureName,
    structure_format: r.structureFormat,
    trajectory_name: r.trajectoryName,
    trajectory_format: r.trajectoryFormat,
    selection: r.selection ? JSON.stringify(r.selection) : null,
    bytes: r.bytes,
    created_by: r.createdBy,
  });
  return id;
}

export async function findReference(db: Db, id: number): Promise<ReferenceRow | undefined> {
  return db('simulation_references').where({ id }).first();
}

export async function referencesOf(db: Db, moleculeId: number): Promise<ReferenceRow[]> {
  return db('simulation_references').where({ molecule_id: moleculeId }).orderBy('id', 'desc');
}

/** Deletes the row (its analyses go with it, by the foreign key) and returns those analyses' ids, whose files the caller removes. */
export async function deleteReference(db: Db, id: number): Promise<number[]> {
  const analyses = (await db('analyses').where({ reference_id: id }).select('id')).map((r: { id: number }) => r.id);
  await db('simulation_references').where({ id }).delete();
  return analyses;
}

export async function setReferenceState(db: Db, id: number, status: ReferenceStatus, progress?: Progress): Promise<void> {
  await db('simulation_references')
    .where({ id })
    .update({ status, ...(progress ? { progress_done: progress.done, progress_total: progress.total } : {}), updated_at: db.fn.now(3) });
}

export async function setReferenceProgress(db: Db, id: number, progress: Progress): Promise<void> {
  await db('simulation_references').where({ id }).update({ progress_done: progress.done, progress_total: progress.total, updated_at: db.fn.now(3) });
}

export async function referenceMatched(db: Db, id: number, found: { copies: number; frames: number; atomsPerCopy: number; atomsTotal: number; sourceFormat: TrajectoryFormat }): Promise<void> {
  await db('simulation_references').where({ id }).update({
    status: 'ready',
    copies: found.copies,
    frames: found.frames,
    atoms_per_copy: found.atomsPerCopy,
    atoms_total: found.atomsTotal,
    source_format: found.sourceFormat,
    updated_at: db.fn.now(3),
  });
}

/**
 * The reference failed. `filesKept`: its uploaded files stay (a narrowed search may still find the
 * molecule, match-job.ts), and so do their bytes in the project's quota; otherwise they are gone and
 * count no more.
 */
export async function referenceFailed(db: Db, id: number, code: string, message: string, details?: unknown, filesKept = false): Promise<void> {
  await db('simulation_references')
    .where({ id })
    .update({ status: 'failed', ...(filesKept ? {} : { bytes: 0 }), error_code: code, error: message, error_details: details === undefined ? null : JSON.stringify(details), updated_at: db.fn.now(3) });
}

/**
 * A failed reference whose files were kept goes back to the queue with a new selection (null: the
 * whole system). False when it is not such a reference (any more): the state check is in the UPDATE,
 * so two retries at once cannot both start.
 */
export async function requeueReference(db: Db, id: number, selection: ReferenceSelection | null): Promise<boolean> {
  const n = await db('simulation_references')
    .where({ id, status: 'failed' })
    .andWhere('bytes', '>', 0)
    .update({ status: 'queued', selection: selection ? JSON.stringify(selection) : null, progress_done: 0, progress_total: 0, error_code: null, error: null, error_details: null, updated_at: db.fn.now(3) });
  return n > 0;
}

/** The molecule's stored model (JSON) and project, for matching. */
export async function moleculeForReference(db: Db, moleculeId: number): Promise<{ projectId: number; model: string } | undefined> {
  const row = await db('molecules').where({ id: moleculeId }).first('project_id', 'model');
  return row ? { projectId: row.project_id, model: row.model } : undefined;
}
