/**
 * Running one analysis over a reference, without the database (the job, analysis-job.ts, adds the
 * row's state, progress and cancelling; the demo seed and bench:trajectory call it as it is).
 *
 * ANALYSIS_THREADS threads (the machine's two cores) take chunks of frames from a shared counter
 * (analyse-frames.ts); spare threads started after an earlier analysis are used when there are. Their bead centres go to centres.f32 (frames × copies × beads × 3, float32,
 * nm) at the chunk's place, their term values to values.f32 (term after term, each frames × copies,
 * float32) likewise; then each term's distribution is built from values.f32 in blocks, in two passes
 * (trajectory/distributions.ts DistributionBuilder), and values.f32 is removed. Nothing here holds
 * a whole trajectory, nor all the values: memory stays the same for a file of any length.
 */
import { open, rm, type FileHandle } from 'node:fs/promises';
import { join } from 'node:path';
import type { AnalysisResult } from '../../src/shared/references';
import type { FrameIndex } from '../references/frame-index';
import type { TrajectoryFormat } from '../references/formats';
import { DistributionBuilder, type Distribution } from '../trajectory/distributions';
import { keepSpareThreads, runTaskThread } from '../workers/task-thread';
import type { AnalysisPlan } from './analysis-plan';
import { buildResult } from './analysis-result';
import type { AnalysisPart, AnalysisTask } from './analysis-task';

export const ANALYSIS_THREADS = 2;
export const ANALYSIS_WORKER = new URL('./analysis-worker.ts', import.meta.url);
/** Frames per chunk: a chunk of a 45,000-atom XTC is about 3 MB read and 8 MB decoded. */
const CHUNK_FRAMES = 16;
/** Values read back per block when the distributions are built (4 MB). */
const BLOCK_VALUES = 1 << 20;
/** Progress is passed on at most this often (each report is a MariaDB write in the job). */
const PROGRESS_MS = 500;

export interface AnalysisRun {
  plan: AnalysisPlan;
  source: { path: string; format: TrajectoryFormat };
  index: FrameIndex;
  copiesFile: string;
  copies: number;
  atomsPerCopy: number;
  outDir: string;
  temperature: number;
  bins: number;
  threads?: number;
  /**
   * Afterwards, start ANALYSIS_THREADS spare threads for the next analysis of this process
   * (workers/task-thread.ts keepSpareThreads): the job does; one-off callers (the seed) do not.
   */
  keepWarm?: boolean;
  onProgress?(done: number, total: number): void | Promise<void>;
  isCancelled?(): Promise<boolean> | boolean;
}

export async function runAnalysis(run: AnalysisRun): Promise<AnalysisResult> {
  const { plan, copies } = run;
  const frames = run.index.offsets.length - 1;
  const nb = plan.beads.length;
  const nt = plan.terms.length;
  const centresFile = await open(join(run.outDir, 'centres.f32'), 'w');
  const valuesPath = join(run.outDir, 'values.f32');
  const valuesFile = await open(valuesPath, 'w+');
  try {
    let done = 0;
    let reported = 0;
    const onPart = async (part: AnalysisPart) => {
      const nf = part.to - part.from;
      const writes = [centresFile.write(bytesOf(part.centres), 0, part.centres.byteLength, part.from * copies * nb * 12)];
      for (let ti = 0; ti < nt; ti++) {
        const slice = part.values.subarray(ti * nf * copies, (ti + 1) * nf * copies);
        writes.push(valuesFile.write(bytesOf(slice), 0, slice.byteLength, (ti * frames + part.from) * copies * 4));
      }
      await Promise.all(writes);
      done += nf;
      const now = Date.now();
      if (now - reported >= PROGRESS_MS || done === frames) {
        reported = now;
        await run.onProgress?.(done, frames);
      }
    };
    const task: AnalysisTask = {
      source: run.source,
      index: run.index,
      copiesFile: run.copiesFile,
      copies,
      atomsPerCopy: run.atomsPerCopy,
      order: plan.order,
      via: plan.via,
      beads: plan.beads.map((b) => ({ points: b.points, weights: b.weights })),
      terms: plan.terms,
      from: 0,
      to: frames,
      chunk: CHUNK_FRAMES,
      next: new SharedArrayBuffer(4),
    };
    const threads = Math.max(1, Math.min(run.threads ?? ANALYSIS_THREADS, Math.ceil(frames / CHUNK_FRAMES)));
    // When one thread fails, the others are stopped too (at their next cancel poll) rather than left
    // to read the rest of the file for nothing.
    let failed = false;
    const isCancelled = async () => failed || ((await run.isCancelled?.()) ?? false);
    await Promise.all(
      Array.from({ length: threads }, () =>
        runTaskThread<AnalysisTask, null, AnalysisPart>(ANALYSIS_WORKER, task, { onPart, isCancelled }).catch((err: unknown) => {
          failed = true;
          throw err;
        }),
      ),
    );
    await centresFile.close();
    const distributions: Distribution[] = [];
    const block = new Float32Array(Math.min(BLOCK_VALUES, Math.max(1, frames * copies)));
    for (let ti = 0; ti < nt; ti++) {
      const b = new DistributionBuilder(plan.terms[ti].kind, run.bins);
      await eachBlock(valuesFile, ti * frames * copies, frames * copies, block, (v) => b.add(v));
      await eachBlock(valuesFile, ti * frames * copies, frames * copies, block, (v) => b.addAgain(v));
      distributions.push(b.finish(run.temperature));
    }
    return buildResult(plan, distributions, frames, copies);
  } finally {
    await centresFile.close().catch(() => undefined);
    await valuesFile.close().catch(() => undefined);
    await rm(valuesPath, { force: true });
    // After the run, not before: starting them costs CPU the run would otherwise have.
    if (run.keepWarm) void keepSpareThreads(ANALYSIS_WORKER, ANALYSIS_THREADS);
  }
}

const bytesOf = (a: Float32Array) => new Uint8Array(a.buffer, a.byteOffset, a.byteLength);

/** count float32 values from value number `first` of the file, block by block. */
async function eachBlock(fh: FileHandle, first: number, count: number, block: Float32Array, fn: (values: Float32Array) => void): Promise<void> {
  for (let at = 0; at < count; at += block.length) {
    const n = Math.min(block.length, count - at);
    const { bytesRead } = await fh.read(bytesOf(block), 0, 4 * n, 4 * (first + at));
    if (bytesRead !== 4 * n) throw new Error('the analysis values file is shorter than expected');
    fn(block.subarray(0, n));
  }
}
