import { Worker } from 'node:worker_threads';

/** The message a thread started here posts once its module has loaded (its libraries are in). */
export const WORKER_READY = '__beadloom_worker_ready';

/**
 * Starts a worker thread running a TypeScript module. tsx's ESM hooks are registered inside the
 * thread first, whatever loader (tsx, vitest) runs the parent, so the worker runs like the server.
 * Once the module has loaded, the thread posts `WORKER_READY` (job time limits start from there:
 * loading openchemlib and RDKit is the server's cost, not the job's).
 */
export function startTsWorker(moduleUrl: URL): Worker {
  const boot = `const { parentPort } = require('node:worker_threads');
import('tsx/esm/api').then((m) => { m.register(); return import(${JSON.stringify(moduleUrl.href)}); }).then(() => parentPort.postMessage(${JSON.stringify(WORKER_READY)}));`;
  const worker = new Worker(boot, { eval: true });
  worker.unref();
  return worker;
}
