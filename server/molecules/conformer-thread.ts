import type { Worker } from 'node:worker_threads';
import { startTsWorker } from '../workers/ts-worker';
import type { Molecule } from '../../src/shared/chem';

// One worker thread for conformer jobs, started on first use and reused. Jobs are sent one at a
// time by the queue.

let worker: Worker | null = null;
let pending: { id: number; resolve(xyz: number[][]): void; reject(err: Error): void } | null = null;

function thread(): Worker {
  if (worker) return worker;
  const w = startTsWorker(new URL('./conformer-worker.ts', import.meta.url));
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
