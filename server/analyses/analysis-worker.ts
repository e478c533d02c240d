// Thread entry of an analysis (analyse-frames.ts); messages as in workers/task-thread.ts.
import { parentPort } from 'node:worker_threads';
import { FrameError } from '../references/frame-index';
import { analyseFrames } from './analyse-frames';
import type { AnalysisTask } from './analysis-task';

parentPort!.on('message', async (task: AnalysisTask) => {
  try {
    await analyseFrames(task, (part) => parentPort!.postMessage({ part }, [part.centres.buffer, part.values.buffer] as ArrayBuffer[]));
    parentPort!.postMessage({ result: null });
  } catch (err) {
    const e = err as Error;
    parentPort!.postMessage({ error: err instanceof FrameError ? { message: e.message, code: 'unreadable_trajectory', details: { frame: err.frame } } : { message: e.message ?? String(err) } });
  }
});
