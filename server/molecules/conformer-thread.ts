import type { Molecule } from '../../src/shared/chem';
import { JobThread } from '../workers/job-thread';

// The conformer worker thread (conformer-worker.ts). The queue sends one job at a time. openchemlib's
// conformer generator holds tens of megabytes of tables, so the thread stops 30 s after its last job.

type ConformerReply = { xyz: number[][] } | { error: string };

/** How long the thread lives after its last job. */
export const CONFORMER_IDLE_MS = 30_000;

const thread = new JobThread<{ model: Molecule; seed: number }, ConformerReply>(new URL('./conformer-worker.ts', import.meta.url), { idleMs: CONFORMER_IDLE_MS });

export async function conformerInThread(model: Molecule, seed: number): Promise<number[][]> {
  const reply = await thread.run({ model, seed });
  if ('xyz' in reply) return reply.xyz;
  throw new Error(reply.error || 'conformer generation failed');
}

/** Stops the thread; a job in flight is rejected. */
export const stopConformerThread = () => thread.stop();
