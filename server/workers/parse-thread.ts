import type { EvaluateOptions, Evaluation, Mapping, Molecule } from '../../src/shared/chem';
import { ChemError, type ChemErrorStatus } from '../chem/errors';
import type { MoleculeInput } from '../chem/parse';
import { Lanes } from './lanes';
import { chemJobTimeout, tooComplex } from './chem-limits';
import { screenInput } from './screen-input';

// Stateless chemistry jobs in worker threads (parse-worker.ts): parse a structure, and optionally
// evaluate a mapping on it, with the same results and the same ChemError as calling the core here.
// The main thread never loads openchemlib or RDKit itself. Inputs are screened first (screen-input.ts);
// each job runs under the time limit (chem-limits.ts), in one of two lanes so that a big structure
// never holds up a small one. Each lane's thread stops after 30 s without work.

export interface ParseJob {
  input: MoleculeInput;
  evaluate?: { mapping: Mapping; options: EvaluateOptions };
}

export type ParseReply =
  | { molecule: Molecule; evaluation?: Evaluation }
  | { chemError: { code: string; message: string; details: Record<string, unknown>; status: ChemErrorStatus } }
  | { failure: string };

/** Structures above these sizes go to the large lane (a few hundred heavy atoms already take seconds). */
export const SMALL_JOB = { smilesLength: 200, molfileLength: 20_000 } as const;

export const parseLanes = new Lanes<ParseJob, ParseReply>(new URL('./parse-worker.ts', import.meta.url), {
  idleMs: 30_000,
  timeoutMs: chemJobTimeout,
  timeoutError: tooComplex,
});

const isBig = (input: MoleculeInput) => ('smiles' in input ? input.smiles.length > SMALL_JOB.smilesLength : input.molfile.length > SMALL_JOB.molfileLength);

async function runJob(job: ParseJob): Promise<{ molecule: Molecule; evaluation?: Evaluation }> {
  screenInput(job.input);
  const reply = await parseLanes.pick(isBig(job.input)).run(job);
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

export const stopParseThread = () => parseLanes.stop();
