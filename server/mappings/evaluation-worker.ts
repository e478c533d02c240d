// Evaluates mapping drafts off the main thread. Evaluation (with RDKit typing of the fragments a
// change touched) takes milliseconds to tens of milliseconds; on the main thread it would hold up
// every live-collaboration socket meanwhile. The thread keeps each mapping's inputs (and so the
// chemistry core's per-molecule caches) until the main thread sends a newer stamp.
import { parentPort } from 'node:worker_threads';
import type { Mapping } from '../../src/shared/chem';
import { loadRdkit } from '../chem/index';
import { evaluateDraft, type EvaluationInputs } from './evaluate-draft';
import type { EvaluationJob, EvaluationReply } from './evaluation-thread';

const known = new Map<number, { stamp: number; inputs: EvaluationInputs }>();

parentPort!.on('message', async (job: (EvaluationJob & { id: number }) | { forget: number }) => {
  if ('forget' in job) {
    known.delete(job.forget);
    return;
  }
  let reply: EvaluationReply & { id: number };
  try {
    await loadRdkit();
    if (job.inputs) known.set(job.mappingId, { stamp: job.stamp, inputs: job.inputs });
    const entry = known.get(job.mappingId);
    if (!entry || entry.stamp !== job.stamp) {
      reply = { id: job.id, missingInputs: true };
    } else {
      reply = { id: job.id, result: evaluateDraft(entry.inputs, job.mapping as Mapping) };
    }
  } catch (err) {
    reply = { id: job.id, failure: (err as Error).message ?? String(err) };
  }
  parentPort!.postMessage(reply);
});

parentPort!.on('close', () => known.clear());
