import type { BeadType, Mapping, Molecule, Resolution } from '../../src/shared/chem';
import type { Proposal, ProposalScope, TransferResult } from '../../src/shared/proposals';
import { ChemError } from '../chem/errors';
import { JobThread } from '../workers/job-thread';
import { chemJobTimeout, tooComplex } from '../workers/chem-limits';

// The main thread's side of the proposal thread (proposal-worker.ts): proposals and transfers run
// there, since a large molecule takes up to seconds (docs/benchmarks.md) and RDKit's MCS up to its
// own time-out; the main thread only sends the stored model, draft and library. One thread, jobs in
// order, under the chemistry job time limit; it stops after a minute without work.

export type ProposalJob =
  | { kind: 'propose'; model: Molecule; resolution: Resolution; scope: ProposalScope; draft: Mapping; library: BeadType[] | undefined }
  | { kind: 'transfer'; source: Molecule; sourceMapping: Mapping; target: Molecule; resolution: Resolution; library: BeadType[] | undefined };

export type ProposalReply = { proposals: Proposal[] } | { transfer: TransferResult } | { failure: string; code?: string; details?: unknown };

const thread = new JobThread<ProposalJob, ProposalReply>(new URL('./proposal-worker.ts', import.meta.url), { idleMs: 60_000, timeoutMs: chemJobTimeout, timeoutError: tooComplex });

function unwrap(reply: ProposalReply): ProposalReply {
  if ('failure' in reply) {
    if (reply.code) throw new ChemError(reply.code, reply.failure, reply.details as Record<string, unknown> | undefined);
    throw new Error(`proposal failed: ${reply.failure}`);
  }
  return reply;
}

export async function proposeInThread(job: Extract<ProposalJob, { kind: 'propose' }>): Promise<Proposal[]> {
  const reply = unwrap(await thread.run(job));
  if (!('proposals' in reply)) throw new Error('the proposal thread answered a different job');
  return reply.proposals;
}

export async function transferInThread(job: Extract<ProposalJob, { kind: 'transfer' }>): Promise<TransferResult> {
  const reply = unwrap(await thread.run(job));
  if (!('transfer' in reply)) throw new Error('the proposal thread answered a different job');
  return reply.transfer;
}

export const stopProposalThread = () => thread.stop();
