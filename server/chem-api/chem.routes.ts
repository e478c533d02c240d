import type { RequestHandler } from 'express';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { authorizeSite } from '../auth/access';
import { tooLarge } from '../http/errors';
import { evaluateBodySchema, moleculeBodySchema, SMILES_MAX, type MoleculeBody } from '../../src/shared/mapping-schema';
import { parseAndEvaluateInThread, parseInThread } from '../workers/parse-thread';
import { logPWarningOf } from '../chem/charged-groups';

// Stateless chemistry endpoints for previews: parse a structure, or parse it and
// evaluate a mapping on it. Nothing is stored.

/** A SMILES over the limit is a size problem (413), not a malformed request. */
const smilesLimit: RequestHandler = (req, _res, next) => {
  const smiles = req.body?.smiles;
  if (typeof smiles === 'string' && smiles.trim().length > SMILES_MAX) {
    throw tooLarge(`A SMILES string has at most ${SMILES_MAX} characters; this one has ${smiles.trim().length}.`, { limit: SMILES_MAX, length: smiles.trim().length });
  }
  next();
};

const structureOf = (body: MoleculeBody) => ('smiles' in body ? { smiles: body.smiles } : { molfile: body.molfile });

export function chemRoutes(r: RouteTable, ctx: AppContext): void {
  r.post('/api/chem/molecule', smilesLimit, typed({ body: moleculeBodySchema }, async ({ body }, req, res) => {
    await authorizeSite(ctx.db, req, 'chem:use');
    const molecule = await parseInThread(structureOf(body));
    // The logP of an ion, salt or zwitterion is not a partition value: say so beside it.
    res.json({ ...molecule, logPWarning: logPWarningOf(molecule) });
  }));

  r.post('/api/chem/evaluate', smilesLimit, typed({ body: evaluateBodySchema }, async ({ body }, req, res) => {
    await authorizeSite(ctx.db, req, 'chem:use');
    res.json(await parseAndEvaluateInThread(structureOf(body), body.mapping, body.options ?? {}));
  }));
}
