import type { MoleculeInput } from '../chem/parse';
import { JobThread } from './job-thread';

// Used from inside the parse thread (parse-worker.ts), not from the main thread: for a large structure
// the canonical SMILES (openchemlib's canonicaliser, ~70% of a 2,000-atom parse) is computed by a
// nested thread from the same input while the parse thread lays out and types the atoms, so a parse
// takes the longer of the two instead of their sum on a machine with a core to spare. The nested
// thread ends with its parse thread (a timed-out job ends both) or after 30 s without work.

export interface CanonicalSmilesJob {
  input: MoleculeInput;
}

export type CanonicalSmilesReply = { smiles: string } | { failure: string };

/** Inputs from this size on are worth a second thread (below it, the hand-over costs more than it saves). */
export const SPLIT_FROM = { smilesLength: 1_000, molfileLength: 100_000 } as const;

const thread = new JobThread<CanonicalSmilesJob, CanonicalSmilesReply>(new URL('./canonical-smiles-worker.ts', import.meta.url), { idleMs: 30_000 });

export function worthSplitting(input: MoleculeInput): boolean {
  return 'smiles' in input ? input.smiles.length >= SPLIT_FROM.smilesLength : input.molfile.length >= SPLIT_FROM.molfileLength;
}

/** The canonical SMILES from the nested thread; rejects when that thread could not compute it. */
export async function canonicalSmilesInThread(input: MoleculeInput): Promise<string> {
  const reply = await thread.run({ input });
  if ('smiles' in reply) return reply.smiles;
  throw new Error(reply.failure);
}
