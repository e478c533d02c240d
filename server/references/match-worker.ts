// Thread entry of reference matching (match-reference.ts); see workers/task-thread.ts for the messages.
import { parentPort } from 'node:worker_threads';
import { matchReference, type MatchTask } from './match-reference';
import { MatchError } from './match-errors';

parentPort!.on('message', async (task: MatchTask) => {
  try {
    const result = await matchReference(task, (done, total) => parentPort!.postMessage({ progress: [done, total] }));
    parentPort!.postMessage({ result });
  } catch (err) {
    const e = err as Error;
    parentPort!.postMessage({ error: err instanceof MatchError ? { message: e.message, code: err.code, details: err.details } : { message: e.message ?? String(err) } });
  }
});
