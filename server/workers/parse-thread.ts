import type { EvaluateOptions, Evaluation, Mapping, Molecule } from '../../src/shared/chem';
import { ChemError, type ChemErrorStatus } from '../chem/errors';
import type { MoleculeInput } from '../chem/parse';
import { JobThread } from './job-thread';

// Stateless chemistry jobs in a worker thread (parse-worker.ts): parse a structure, and optionally
// evaluate a mapping on it, with the same results and the same ChemError as calling the core here.
// The main thread never loads openchemlib or RDKit itself. The thread stops after 30 s without work.

export interface ParseJob {
  input: MoleculeInput;
  evaluate?: { mapping: Mapping; options: EvaluateOptions };
}

export type ParseReply =
  | { molecule: Molecule; evaluation?: Evaluation }
  | { chemError: { code: string; message: string; details: Record<string, unknown>; status: ChemErrorStatus } }
  | { failure: string };

const thread = new JobThread<ParseJob, ParseReply>(new URL('./parse-worker.ts', import.meta.url), 30_000);

async function runJob(job: ParseJob): Promise<{ molecule: Molecule; evaluation?: Evaluation }> {
  const reply = await thread.run(job);
  if ('molecule' in reply) return reply;
  if ('chemError' in reply) {
    const e = reply.chemError;
    throw new ChemError(e.code, e.message, e.details, e.status);
  }
  throw new Error(`parsing failed: ${reply.failure}`);
}

export async function parseInThread(input: MoleculeInput): Promise<Molecule> {
  return (await runJob({ input })).molecule;
}

/** Parses a structure and evaluates `mapping` on it (nothing stored). */
export async function parseAndEvaluateInThread(input: MoleculeInput, mapping: Mapping, options: EvaluateOptions): Promise<{ molecule: Molecule; evaluation: Evaluation }> {
  const { molecule, evaluation } = await runJob({ input, evaluate: { mapping, options } });
  return { molecule, evaluation: evaluation! };
}

export const stopParseThread = () => thread.stop();
