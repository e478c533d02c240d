// Runs generateConformer off the main thread: a conformer takes from a fraction of a second to several
// seconds of CPU, which on the main thread would stall every live-collaboration socket meanwhile.
import { parentPort } from 'node:worker_threads';
import { generateConformer } from '../chem/conformer';
import type { Molecule } from '../../src/shared/chem';
import { lowerThreadPriority } from '../workers/background-priority';

// A conformer of a large molecule keeps a core busy for minutes; nobody waits on it (the editor
// works without it), so it gets what the rest of the machine leaves.
lowerThreadPriority();

parentPort!.on('message', async (job: { id: number; model: Molecule; seed: number }) => {
  try {
    parentPort!.postMessage({ id: job.id, xyz: await generateConformer(job.model, { seed: job.seed }) });
  } catch (err) {
    parentPort!.postMessage({ id: job.id, error: (err as Error).message ?? String(err) });
  }
});
