import type { Worker } from 'node:worker_threads';
import type { Mapping } from '../../src/shared/chem';
import { startTsWorker } from '../workers/ts-worker';
import type { EvaluationInputs, EvaluationResult } from './evaluation';

// The main thread's side of the evaluation thread (evaluation-worker.ts): one thread for the
// process, started on first use. A mapping's inputs (molecule model, coordinates, library) cross
// to the thread once per stamp; after that each job carries only the draft.

export interface EvaluationJob {
  id: number;
  mappingId: number;
  stamp: number;
  inputs?: EvaluationInputs;
  mapping: Mapping;
}

export type EvaluationReply =
  | { id: number; result: EvaluationResult }
  | { id: number; missingInputs: true }
  | { id: number; failure: string };

let worker: Worker | null = null;
let nextId = 1;
const pending = new Map<number, { resolve(r: EvaluationReply): void; reject(e: Error): void }>();
/** Which stamp of each mapping's inputs the current thread holds. */
const sent = new Map<number, number>();

function thread(): Worker {
  if (worker) return worker;
  const w = startTsWorker(new URL('./evaluation-worker.ts', import.meta.url));
  w.on('message', (reply: EvaluationReply) => {
    pending.get(reply.id)?.resolve(reply);
    pending.delete(reply.id);
  });
  const fail = (err: Error) => {
    if (worker === w) worker = null;
    sent.clear();
    for (const p of pending.values()) p.reject(err);
    pending.clear();
  };
  w.on('error', fail);
  w.on('exit', (code) => fail(new Error(`the evaluation thread stopped (exit ${code})`)));
  worker = w;
  return w;
}

function post(job: EvaluationJob): Promise<EvaluationReply> {
  return new Promise((resolve, reject) => {
    pending.set(job.id, { resolve, reject });
    thread().postMessage(job);
  });
}

/** Evaluates a draft in the evaluation thread. `stamp` changes whenever `inputs` do. */
export async function evaluateInThread(inputs: EvaluationInputs, stamp: number, mapping: Mapping): Promise<EvaluationResult> {
  const withInputs = sent.get(inputs.mappingId) !== stamp;
  if (withInputs) sent.set(inputs.mappingId, stamp);
  let reply = await post({ id: nextId++, mappingId: inputs.mappingId, stamp, mapping, ...(withInputs ? { inputs } : {}) });
  if ('missingInputs' in reply) reply = await post({ id: nextId++, mappingId: inputs.mappingId, stamp, mapping, inputs });
  if ('failure' in reply) throw new Error(`evaluation failed: ${reply.failure}`);
  if ('missingInputs' in reply) throw new Error('the evaluation thread lost the inputs');
  return reply.result;
}

/** Forgets a mapping's inputs (its room closed), here and in the thread. */
export function forgetInputs(mappingId: number): void {
  if (sent.delete(mappingId)) worker?.postMessage({ forget: mappingId });
}

export async function stopEvaluationThread(): Promise<void> {
  const w = worker;
  worker = null;
  sent.clear();
  if (w) await w.terminate();
}
