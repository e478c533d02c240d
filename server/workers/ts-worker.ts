import { Worker } from 'node:worker_threads';

/**
 * Starts a worker thread running a TypeScript module. tsx's ESM hooks are registered inside the
 * thread first, whatever loader (tsx, vitest) runs the parent, so the worker runs like the server.
 */
export function startTsWorker(moduleUrl: URL): Worker {
  const boot = `import('tsx/esm/api').then((m) => { m.register(); return import(${JSON.stringify(moduleUrl.href)}); })`;
  const worker = new Worker(boot, { eval: true });
  worker.unref();
  return worker;
}
