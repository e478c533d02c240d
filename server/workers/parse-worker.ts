// Parses structures off the main thread. openchemlib's 2D layout and canonical SMILES take seconds
// to minutes for molecules of thousands of atoms; on the main thread that would stall every request
// and live-collaboration socket meanwhile.
import { parentPort } from 'node:worker_threads';
import { isChemError, parseMolecule, type MoleculeInput } from '../chem/index';
import type { ParseReply } from './parse-thread';

parentPort!.on('message', async (job: { id: number; input: MoleculeInput }) => {
  let reply: ParseReply & { id: number };
  try {
    reply = { id: job.id, molecule: await parseMolecule(job.input) };
  } catch (err) {
    reply = isChemError(err)
      ? { id: job.id, chemError: { code: err.code, message: err.message, details: err.details, status: err.status } }
      : { id: job.id, failure: (err as Error).message ?? String(err) };
  }
  parentPort!.postMessage(reply);
});
