import type { Mapping } from '../../src/shared/chem';
import { JobThread } from '../workers/job-thread';
import type { EvaluationInputs, EvaluationResult } from './evaluate-draft';

// The main thread's side of the evaluation thread (evaluation-worker.ts). A live room's inputs
// (molecule model, coordinates, library) cross to the thread once per stamp; after that each job
// carries only the draft. The thread stops after a minute without work.

export interface EvaluationJob {
  mappingId: number;
  stamp: number;
  inputs?: EvaluationInputs;
  /** Evaluate with these inputs and keep nothing (no room holds them). */
  once?: boolean;
  mapping: Mapping;
}

export type EvaluationReply = { result: EvaluationResult } | { missingInputs: true } | { failure: string };

/** Which stamp of each mapping's inputs the running thread holds. */
const sent = new Map<number, number>();
const thread = new JobThread<EvaluationJob, EvaluationReply>(new URL('./evaluation-worker.ts', import.meta.url), 60_000, () => sent.clear());

function resultOf(reply: EvaluationReply): EvaluationResult {
  if ('failure' in reply) throw new Error(`evaluation failed: ${reply.failure}`);
  if ('missingInputs' in reply) throw new Error('the evaluation thread lost the inputs');
  return reply.result;
}

/** Evaluates a live room's draft in the evaluation thread. `stamp` changes whenever `inputs` do. */
export async function evaluateInThread(inputs: EvaluationInputs, stamp: number, mapping: Mapping): Promise<EvaluationResult> {
  const withInputs = sent.get(inputs.mappingId) !== stamp;
  if (withInputs) sent.set(inputs.mappingId, stamp);
  let reply = await thread.run({ mappingId: inputs.mappingId, stamp, mapping, ...(withInputs ? { inputs } : {}) });
  if ('missingInputs' in reply) reply = await thread.run({ mappingId: inputs.mappingId, stamp, mapping, inputs });
  return resultOf(reply);
}

/** Evaluates a draft no room holds (the thread keeps nothing of it). */
export async function evaluateOnceInThread(inputs: EvaluationInputs, mapping: Mapping): Promise<EvaluationResult> {
  return resultOf(await thread.run({ mappingId: inputs.mappingId, stamp: -1, mapping, inputs, once: true }));
}

/** Forgets a mapping's inputs (its room closed), here and in the thread. */
export function forgetInputs(mappingId: number): void {
  if (sent.delete(mappingId)) thread.tell({ forget: mappingId });
}

export const stopEvaluationThread = () => thread.stop();
