import { mkdir, open, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Db } from '../db/knex';
import type { TaskHooks, TaskRunner } from '../jobs/background-task';
import { runTaskThread, TaskCancelled, TaskFailed } from '../workers/task-thread';
import type { FrameIndex } from '../references/frame-index';
import { analysisDir, referenceDir, sourceOf } from '../references/reference-files';
import { findReference } from '../references/references.service';
import type { AnalysisPart, AnalysisTask } from './analysis-task';
import type { AnalysisPlan } from './analysis-plan';
import { buildResult } from './analysis-result';
import { analysisFinished, analysisStarted, analysisStopped, cancelRequested, findAnalysis, setAnalysisProgress } from './analyses.service';

// The analysis job: plain data (which analysis) and a runner. Two threads (the machine's two cores;
// frames are independent) each take half of the trajectory in chunks; their bead centres go to
// centres.f32 (frames × copies × beads × 3, float32, nm) at the chunk's place, their term values into
// one array per term; then the distributions and fits are stored with the row.

export interface AnalysisJobData {
  analysisId: number;
}

export const ANALYSIS_THREADS = 2;
const CHUNK_FRAMES = 16;

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
    const frames = ref.frames;
    const copies = ref.copies;
    const nb = plan.beads.length;
    await analysisStarted(db, analysisId, frames);
    const out = analysisDir(dataDir, analysisId);
    await mkdir(out, { recursive: true });
    const centresFile = await open(join(out, 'centres.f32'), 'w');
    const values = plan.terms.map(() => new Float32Array(frames * copies));
    let done = 0;
    let reported = 0;
    const onPart = async (part: AnalysisPart) => {
      await centresFile.write(new Uint8Array(part.centres.buffer, part.centres.byteOffset, part.centres.byteLength), 0, part.centres.byteLength, part.from * copies * nb * 12);
      const nf = part.to - part.from;
      plan.terms.forEach((_, ti) => values[ti].set(part.values.subarray(ti * nf * copies, (ti + 1) * nf * copies), part.from * copies));
      done += nf;
      const now = Date.now();
      if (now - reported > 500 || done === frames) {
        reported = now;
        await hooks.reportProgress(done, frames);
      }
    };
    const base: Omit<AnalysisTask, 'from' | 'to'> = {
      source: sourceOf(dir, ref),
      index,
      copiesFile: join(dir, 'copies.bin'),
      copies,
      atomsPerCopy: ref.atoms_per_copy,
      order: plan.order,
      via: plan.via,
      beads: plan.beads.map((b) => ({ points: b.points, weights: b.weights })),
      terms: plan.terms,
      chunk: CHUNK_FRAMES,
    };
    const threads = Math.min(ANALYSIS_THREADS, frames);
    try {
      await Promise.all(
        Array.from({ length: threads }, (_, k) => {
          const task: AnalysisTask = { ...base, from: Math.floor((k * frames) / threads), to: Math.floor(((k + 1) * frames) / threads) };
          return runTaskThread<AnalysisTask, null, AnalysisPart>(new URL('./analysis-worker.ts', import.meta.url), task, { onPart, isCancelled: () => hooks.isCancelled() });
        }),
      );
      await centresFile.close();
      // A cancel that arrived while the last frames were read still counts.
      if (await hooks.isCancelled()) throw new TaskCancelled();
      await analysisFinished(db, analysisId, buildResult(plan, values, frames, copies, row.temperature, row.bins));
    } catch (err) {
      await centresFile.close().catch(() => undefined);
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
