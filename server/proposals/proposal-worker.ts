// Mapping proposals and transfers off the main thread (proposal-thread.ts). Loads the chemistry
// modules it needs and RDKit (for fragment logP in type suggestions, and for the MCS of a transfer).
import { parentPort } from 'node:worker_threads';
import { isChemError } from '../chem/errors';
import { proposeMapping } from '../chem/propose-mapping';
import { loadRdkit } from '../chem/rdkit';
import { transferMapping } from '../chem/transfer';
import type { ProposalJob, ProposalReply } from './proposal-thread';

parentPort!.on('message', async (job: ProposalJob & { id: number }) => {
  let reply: ProposalReply & { id: number };
  try {
    const rd = await loadRdkit();
    if (job.kind === 'propose') {
      reply = { id: job.id, proposals: proposeMapping(job.model, { resolution: job.resolution, scope: job.scope, draft: job.draft, library: job.library }) };
    } else {
      reply = { id: job.id, transfer: transferMapping(rd, job.source, job.sourceMapping, job.target, { resolution: job.resolution, library: job.library }) };
    }
  } catch (err) {
    reply = isChemError(err) ? { id: job.id, failure: err.message, code: err.code, details: err.details } : { id: job.id, failure: (err as Error).message ?? String(err) };
  }
  parentPort!.postMessage(reply);
});

await loadRdkit();
