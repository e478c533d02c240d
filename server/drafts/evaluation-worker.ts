// Evaluates mapping drafts off the main thread. Evaluation (with RDKit typing of the fragments a
// change touched) takes milliseconds to tens of milliseconds; on the main thread it would hold up
// every live-collaboration socket meanwhile. The thread keeps each mapping's inputs (and so the
// chemistry core's per-molecule caches) until the main thread sends a newer stamp; a one-off job
// (a draft read with no room open) brings its inputs and leaves nothing behind.
// Only the evaluation modules and RDKit load here, not openchemlib.
import { parentPort } from 'node:worker_threads';
import type { Mapping } from '../../src/shared/chem';
import { loadRdkit } from '../chem/rdkit';
import { evaluateDraft, type EvaluationInputs } from './evaluate-draft';
import type { EvaluationJob, EvaluationReply } from './evaluation-thread';

const known = new Map<number, { stamp: number; inputs: EvaluationInputs }>();

function inputsFor(job: EvaluationJob): EvaluationInputs | null {
  if (job.once) return job.inputs ?? null;
  if (job.inputs) known.set(job.mappingId, { stamp: job.stamp, inputs: job.inputs });
  const entry = known.get(job.mappingId);
  return entry && entry.stamp === job.stamp ? entry.inputs : null;
}

parentPort!.on('message', async (job: (EvaluationJob & { id: number }) | { forget: number }) => {
  if ('forget' in job) {
    known.delete(job.forget);
    return;
  }
  let reply: EvaluationReply & { id: number };
  try {
    await loadRdkit();
    const inputs = inputsFor(job);
    reply = inputs ? { id: job.id, result: evaluateDraft(inputs, job.mapping as Mapping) } : { id: job.id, missingInputs: true };
  } catch (err) {
    reply = { id: job.id, failure: (err as Error).message ?? String(err) };
  }
  parentPort!.postMessage(reply);
});

parentPort!.on('close', () => known.clear());

// RDKit is loaded before the thread reports ready (workers/ts-worker.ts), so the job time limit is
// for the job; after the listener above, which must be attached before RDKit's loader attaches its own.
await loadRdkit();
