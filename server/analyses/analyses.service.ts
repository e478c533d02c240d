import type { Db } from '../db/knex';
import type { AnalysisResult, AnalysisView, JobStatus, Progress } from '../../src/shared/references';
import type { VersionRef } from '../../src/shared/versions';
import type { AnalysisPlan } from './analysis-plan';

// All Knex of analyses: rows, job state (status, progress, cancel flag) and results.

export interface AnalysisRow {
  id: number;
  mapping_id: number;
  reference_id: number;
  version_ref: string;
  version_number: number | null;
  content_sha256: string;
  temperature: number;
  bins: number;
  status: JobStatus;
  progress_done: number;
  progress_total: number;
  cancel_requested: number | boolean;
  mapping_state: string;
  result: string | null;
  error_code: string | null;
  error: string | null;
  created_by: number | null;
  created_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
const refOf = (s: string): VersionRef => (s === 'draft' || s === 'production' ? s : Number(s));

export function toAnalysisView(r: AnalysisRow, withResult: boolean): AnalysisView {
  return {
    id: r.id,
    status: r.status,
    progress: { done: r.progress_done, total: r.progress_total },
    mappingId: r.mapping_id,
    version: refOf(r.version_ref),
    versionNumber: r.version_number,
    contentSha256: r.content_sha256,
    referenceId: r.reference_id,
    temperature: r.temperature,
    bins: r.bins,
    createdBy: r.created_by,
    createdAt: iso(r.created_at)!,
    startedAt: iso(r.started_at),
    finishedAt: iso(r.finished_at),
    ...(r.error ? { error: { code: r.error_code ?? 'failed', message: r.error } } : {}),
    ...(withResult && r.result ? { result: JSON.parse(r.result) as AnalysisResult } : {}),
  };
}

export interface NewAnalysis {
  mappingId: number;
  referenceId: number;
  version: VersionRef;
  versionNumber: number | null;
  contentSha256: string;
  temperature: number;
  bins: number;
  plan: AnalysisPlan;
  createdBy: number | null;
}

export async function insertAnalysis(db: Db, a: NewAnalysis): Promise<number> {
  const [id] = await db('analyses').insert({
    mapping_id: a.mappingId,
    reference_id: a.referenceId,
    version_ref: String(a.version),
    version_number: a.versionNumber,
    content_sha256: a.contentSha256,
    temperature: a.temperature,
    bins: a.bins,
    status: 'queued',
    mapping_state: JSON.stringify(a.plan),
    created_by: a.createdBy,
  });
  return id;
}

export async function findAnalysis(db: Db, id: number): Promise<AnalysisRow | undefined> {
  return db('analyses').where({ id }).first();
}

/** The project an analysis belongs to (through its mapping's molecule). */
export async function projectOfAnalysis(db: Db, id: number): Promise<number | null> {
  const row = await db('analyses as a').join('mappings as p', 'p.id', 'a.mapping_id').join('molecules as m', 'm.id', 'p.molecule_id').where('a.id', id).first('m.project_id');
  return row?.project_id ?? null;
}

export async function analysesOf(db: Db, mappingId: number): Promise<AnalysisRow[]> {
  return db('analyses').where({ mapping_id: mappingId }).orderBy('id', 'desc');
}

export async function deleteAnalysis(db: Db, id: number): Promise<void> {
  await db('analyses').where({ id }).delete();
}

export async function requestCancel(db: Db, id: number): Promise<void> {
  await db('analyses').where({ id }).whereIn('status', ['queued', 'running']).update({ cancel_requested: true });
}

export async function cancelRequested(db: Db, id: number): Promise<boolean> {
  const row = await db('analyses').where({ id }).first('cancel_requested');
  return !row || !!row.cancel_requested;
}

export async function analysisStarted(db: Db, id: number, total: number): Promise<void> {
  await db('analyses').where({ id }).update({ status: 'running', started_at: db.fn.now(3), progress_done: 0, progress_total: total });
}

export async function setAnalysisProgress(db: Db, id: number, p: Progress): Promise<void> {
  await db('analyses').where({ id }).update({ progress_done: p.done, progress_total: p.total });
}

export async function analysisFinished(db: Db, id: number, result: AnalysisResult): Promise<void> {
  await db('analyses').where({ id }).update({ status: 'done', result: JSON.stringify(result), finished_at: db.fn.now(3) });
}

export async function analysisStopped(db: Db, id: number, status: 'failed' | 'cancelled', code: string, message: string): Promise<void> {
  await db('analyses').where({ id }).update({ status, error_code: code, error: message, finished_at: db.fn.now(3) });
}
