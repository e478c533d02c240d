import type { Molecule } from '../../src/shared/chem';
import { ChemError, type MoleculeInput } from '../chem/index';
import type { ChemErrorStatus } from '../chem/errors';
import { JobThread } from './job-thread';

// parseMolecule in a worker thread (parse-worker.ts), with the same result and the same ChemError
// as calling it here. The thread stops after 30 s without work.

export type ParseReply =
  | { molecule: Molecule }
  | { chemError: { code: string; message: string; details: Record<string, unknown>; status: ChemErrorStatus } }
  | { failure: string };

const thread = new JobThread<{ input: MoleculeInput }, ParseReply>(new URL('./parse-worker.ts', import.meta.url), 30_000);

export async function parseInThread(input: MoleculeInput): Promise<Molecule> {
  const reply = await thread.run({ input });
  if ('molecule' in reply) return reply.molecule;
  if ('chemError' in reply) {
    const e = reply.chemError;
    throw new ChemError(e.code, e.message, e.details, e.status);
  }
  throw new Error(`parsing failed: ${reply.failure}`);
}

export const stopParseThread = () => thread.stop();
