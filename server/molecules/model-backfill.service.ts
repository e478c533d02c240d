import type { Logger } from 'pino';
import type { Db } from '../db/knex';
import { isChemError } from '../chem/errors';
import { parseInThread } from '../workers/parse-thread';

/**
 * Molecules stored before canonical models existed (migration 007 left their `model` null) get one
 * at start-up, parsed from the SMILES they were created with, with the same derived columns a new
 * molecule gets, and a queued conformer. Such rows never have mappings (mappings came later), so
 * no atom index can change under anyone. Their SMILES passed the parser when they were created; one
 * that no longer parses is logged and left as it is. Returns how many rows were filled.
 * Migration 007 also left such rows' `tags` empty (MySQL-family TEXT columns take no default), which
 * is not JSON: they get an empty list.
 */
export async function backfillModels(db: Db, log: Logger): Promise<number> {
  await db('molecules').where({ tags: '' }).update({ tags: '[]' });
  const rows = await db('molecules').whereNull('model').select('id', 'smiles');
  let filled = 0;
  for (const row of rows) {
    try {
      const model = await parseInThread({ smiles: row.smiles });
      await db('molecules').where({ id: row.id }).whereNull('model').update({
        source: 'smiles',
        canonical_smiles: model.canonicalSmiles,
        formula: model.formula,
        molecular_weight: model.molecularWeight,
        log_p: model.logP,
        heavy_atoms: model.heavyAtoms ?? model.atoms.length,
        net_charge: model.netCharge,
        model: JSON.stringify(model),
        conformer_status: 'queued',
      });
      filled++;
    } catch (err) {
      if (!isChemError(err)) throw err;
      log.warn({ moleculeId: row.id, err }, 'a molecule stored without a model could not be parsed again');
    }
  }
  return filled;
}
