import { Worker } from 'node:worker_threads';
import type { Molecule } from '../../src/shared/chem';

// One worker thread for conformer jobs, started on first use and reused. It loads the TypeScript
// worker through tsx (the way the server itself runs). Jobs are sent one at a time by the queue.

let worker: Worker | null = null;
let pending: { id: number; resolve(xyz: number[][]): void; reject(err: Error): void } | null = null;

function thread(): Worker {
  if (worker) return worker;
  const url = new URL('./conformer-worker.ts', import.meta.url).href;
  // tsx's ESM hooks are registered inside the thread, whatever loader (tsx, vitest) runs the parent.
  const boot = `import('tsx/esm/api').then((m) => { m.register(); return import(${JSON.stringify(url)}); })`;
  const w = new Worker(boot, { eval: true });
  w.unref();
  w.on('message', (msg: { id: number; xyz?: number[][]; error?: string }) => {
    const job = pending;
    pending = null;
    if (!job || job.id !== msg.id) return;
    if (msg.xyz) job.resolve(msg.xyz);
    else job.reject(new Error(msg.error ?? 'conformer generation failed'));
  });
  const fail = (err: Error) => {
    worker = null;
    pending?.reject(err);
    pending = null;
  };
  w.on('error', fail);
  w.on('exit', (code) => fail(new Error(`the conformer thread stopped (exit ${code})`)));
  worker = w;
  return w;
}

export function conformerInThread(id: number, model: Molecule, seed: number): Promise<number[][]> {
  return new Promise((resolve, reject) => {
    pending = { id, resolve, reject };
    thread().postMessage({ id, model, seed });
  });
}

export async function stopConformerThread(): Promise<void> {
  const w = worker;
  worker = null;
  if (w) await w.terminate();
}
