// Parses structures off the main thread. openchemlib's 2D layout and canonical SMILES take seconds
// to minutes for molecules of thousands of atoms; on the main thread that would stall every request
// and live-collaboration socket meanwhile. Evaluations of previews (a mapping on a structure that is
// not stored) run here too, after the parse, with RDKit for the fragments' logP.
import { parentPort } from 'node:worker_threads';
import { isChemError, parseMolecule, evaluateMapping, loadRdkit } from '../chem/index';
import type { ParseJob, ParseReply } from './parse-thread';
import { canonicalSmilesInThread, worthSplitting } from './canonical-smiles-thread';

// Libraries are loaded and warmed before the thread reports ready (the module finishes loading at
// the `await` below; ts-worker.ts): the job time limit measures a job's own work, not the ~1–3 s
// this takes once per thread. The listener is attached first: RDKit's loader listens on the port
// too, and a job arriving while only its listener is attached would be lost.
const warmed = (async () => {
  await loadRdkit();
  await parseMolecule({ smiles: 'CCO' });
})();

parentPort!.on('message', async (job: ParseJob & { id: number }) => {
  let reply: ParseReply & { id: number };
  try {
    await warmed;
    const canonicalSmiles = worthSplitting(job.input) ? canonicalSmilesInThread(job.input) : undefined;
    canonicalSmiles?.catch(() => undefined); // a refused input rejects it too; the parse reports why
    const molecule = await parseMolecule(job.input, { canonicalSmiles });
    if (job.evaluate) {
      await loadRdkit();
      reply = { id: job.id, molecule, evaluation: evaluateMapping(molecule, job.evaluate.mapping, job.evaluate.options) };
    } else {
      reply = { id: job.id, molecule };
    }
  } catch (err) {
    reply = isChemError(err)
      ? { id: job.id, chemError: { code: err.code, message: err.message, details: err.details, status: err.status } }
      : { id: job.id, failure: (err as Error).message ?? String(err) };
  }
  parentPort!.postMessage(reply);
});

await warmed;
