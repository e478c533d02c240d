import { mkdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Db } from '../db/knex';
import type { TaskHooks, TaskRunner } from '../jobs/background-task';
import { TaskCancelled, TaskFailed } from '../workers/task-thread';
import type { FrameIndex } from '../references/frame-index';
import { analysisDir, referenceDir, sourceOf } from '../references/reference-files';
import { findReference } from '../references/references.service';
import type { AnalysisPlan } from './analysis-plan';
import { runAnalysis } from './analysis-run';
import { analysisFinished, analysisStarted, analysisStopped, cancelRequested, findAnalysis, setAnalysisProgress } from './analyses.service';

// The analysis job: plain data (which analysis) and a runner around runAnalysis (analysis-run.ts:
// threads, files, distributions) that records the row's state, progress and outcome in MariaDB.

export interface AnalysisJobData {
  analysisId: number;
}

export function analysisJobRunner(db: Db, dataDir: string): TaskRunner<AnalysisJobData> {
  return async ({ analysisId }: AnalysisJobData, hooks: TaskHooks) => {
    const row = await findAnalysis(db, analysisId);
    if (!row || row.status !== 'queued') return;
    const ref = await findReference(db, row.reference_id);
    if (!ref || ref.status !== 'ready' || !ref.copies || !ref.frames || !ref.atoms_per_copy) {
      await analysisStopped(db, analysisId, 'failed', 'reference_not_ready', 'The reference is gone or not ready.');
      return;
    }
    if (await hooks.isCancelled()) {
      await analysisStopped(db, analysisId, 'cancelled', 'cancelled', 'Cancelled before it started.');
      return;
    }
    const plan = JSON.parse(row.mapping_state) as AnalysisPlan;
    const dir = referenceDir(dataDir, ref.id);
    const index = JSON.parse(await readFile(join(dir, 'frames.json'), 'utf8')) as FrameIndex;
    await analysisStarted(db, analysisId, ref.frames);
    const out = analysisDir(dataDir, analysisId);
    await mkdir(out, { recursive: true });
    try {
      const result = await runAnalysis({
        plan,
        source: sourceOf(dir, ref),
        index,
        copiesFile: join(dir, 'copies.bin'),
        copies: ref.copies,
        atomsPerCopy: ref.atoms_per_copy,
        outDir: out,
        temperature: row.temperature,
        bins: row.bins,
        keepWarm: true,
        onProgress: (done, total) => hooks.reportProgress(done, total),
        isCancelled: () => hooks.isCancelled(),
      });
      // A cancel that arrived while the last frames were read still counts.
      if (await hooks.isCancelled()) throw new TaskCancelled();
      await analysisFinished(db, analysisId, result);
    } catch (err) {
      if (err instanceof TaskCancelled) await analysisStopped(db, analysisId, 'cancelled', 'cancelled', 'Cancelled by its starter or a supervisor.');
      else if (err instanceof TaskFailed) await analysisStopped(db, analysisId, 'failed', err.code ?? 'analysis_failed', err.message);
      else await analysisStopped(db, analysisId, 'failed', 'analysis_failed', `The analysis stopped: ${(err as Error).message}`);
    }
  };
}

/** The job's progress and cancel flag, in MariaDB: the same from the app server that started it or a worker process. */
export function analysisJobHooks(db: Db, analysisId: number): TaskHooks {
  return {
    reportProgress: (done, total) => setAnalysisProgress(db, analysisId, { done, total }),
    isCancelled: () => cancelRequested(db, analysisId),
  };
}
