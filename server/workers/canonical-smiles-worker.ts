// The canonical SMILES of a large structure, in a thread of its own, while the parse thread that asked
// lays out and types the same structure (canonical-smiles-thread.ts). Only openchemlib is loaded here;
// an input that needs RDKit's kekulization fails here and its SMILES is computed by the parse itself.
import { parentPort } from 'node:worker_threads';
import { canonicalSmilesOf } from '../chem/canonical-smiles';
import type { CanonicalSmilesJob, CanonicalSmilesReply } from './canonical-smiles-thread';

canonicalSmilesOf({ smiles: 'CCO' }); // loads openchemlib before the thread reports ready

parentPort!.on('message', (job: CanonicalSmilesJob & { id: number }) => {
  let reply: CanonicalSmilesReply & { id: number };
  try {
    reply = { id: job.id, smiles: canonicalSmilesOf(job.input) };
  } catch (err) {
    reply = { id: job.id, failure: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply);
});
