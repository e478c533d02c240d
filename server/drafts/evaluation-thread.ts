import type { Mapping } from '../../src/shared/chem';
import { JobThread } from '../workers/job-thread';
import { chemJobTimeout, tooComplex } from '../workers/chem-limits';
import type { EvaluationInputs, EvaluationResult } from './evaluate-draft';

// The main thread's side of the evaluation threads (evaluation-worker.ts). A live room's inputs
// (molecule model, coordinates, library) cross to a thread once per stamp; after that each job
// carries only the draft. Two lanes by molecule size, so a big molecule's evaluation never holds up
// a small one's; a mapping always goes to the same lane. Each job runs under the time limit
// (workers/chem-limits.ts). A thread stops after a minute without work.

export interface EvaluationJob {
  mappingId: number;
  stamp: number;
  inputs?: EvaluationInputs;
  /** Evaluate with these inputs and keep nothing (no room holds them). */
  once?: boolean;
  mapping: Mapping;
}

export type EvaluationReply = { result: EvaluationResult } | { missingInputs: true } | { failure: string };

/** Molecules with more heavy atoms than this are evaluated in the large lane. */
export const SMALL_EVALUATION_ATOMS = 300;

/** Which stamp of each mapping's inputs each lane's running thread holds. */
const sent = { small: new Map<number, number>(), large: new Map<number, number>() };
const options = (lane: keyof typeof sent) => ({ idleMs: 60_000, onRestart: () => sent[lane].clear(), timeoutMs: chemJobTimeout, timeoutError: tooComplex });
const workerUrl = new URL('./evaluation-worker.ts', import.meta.url);
const lanes = {
  small: new JobThread<EvaluationJob, EvaluationReply>(workerUrl, options('small')),
  large: new JobThread<EvaluationJob, EvaluationReply>(workerUrl, options('large')),
};

const laneOf = (inputs: EvaluationInputs): keyof typeof sent => (inputs.model.atoms.length > SMALL_EVALUATION_ATOMS ? 'large' : 'small');

function resultOf(reply: EvaluationReply): EvaluationResult {
  if ('failure' in reply) throw new Error(`evaluation failed: ${reply.failure}`);
  if ('missingInputs' in reply) throw new Error('the evaluation thread lost the inputs');
  return reply.result;
}

/** Evaluates a live room's draft in its evaluation thread. `stamp` changes whenever `inputs` do. */
export async function evaluateInThread(inputs: EvaluationInputs, stamp: number, mapping: Mapping): Promise<EvaluationResult> {
  const lane = laneOf(inputs);
  const thread = lanes[lane];
  const withInputs = sent[lane].get(inputs.mappingId) !== stamp;
  if (withInputs) sent[lane].set(inputs.mappingId, stamp);
  let reply = await thread.run({ mappingId: inputs.mappingId, stamp, mapping, ...(withInputs ? { inputs } : {}) });
  if ('missingInputs' in reply) reply = await thread.run({ mappingId: inputs.mappingId, stamp, mapping, inputs });
  return resultOf(reply);
}

/** Evaluates a draft no room holds (the thread keeps nothing of it). */
export async function evaluateOnceInThread(inputs: EvaluationInputs, mapping: Mapping): Promise<EvaluationResult> {
  return resultOf(await lanes[laneOf(inputs)].run({ mappingId: inputs.mappingId, stamp: -1, mapping, inputs, once: true }));
}

/** Forgets a mapping's inputs (its room closed), here and in the threads. */
export function forgetInputs(mappingId: number): void {
  for (const lane of ['small', 'large'] as const) if (sent[lane].delete(mappingId)) lanes[lane].tell({ forget: mappingId });
}

/** Evaluation in the evaluation threads, for the rooms. */
export const threadEvaluation = { evaluate: evaluateInThread, forget: forgetInputs };

export const stopEvaluationThread = () => Promise.all([lanes.small.stop(), lanes.large.stop()]);
