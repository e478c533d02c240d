import type { Db } from '../db/knex';
import { loadRdkit } from '../chem/index';
import type { EvaluationInputs } from './evaluate-draft';
import { parseModel } from '../molecules/molecule-view';
import { libraryFor } from '../bead-types/bead-types.service';

// What the chemistry core needs to evaluate one mapping's draft, read from the database.
// The evaluation itself is in evaluate-draft.ts (no database, so the evaluation thread can load it).

export async function loadEvaluationInputs(db: Db, mappingId: number): Promise<EvaluationInputs | null> {
  const row = await db('mappings as p')
    .join('molecules as m', 'm.id', 'p.molecule_id')
    .where('p.id', mappingId)
    .first('p.id', 'p.resolution', 'p.locked', 'm.id as molecule_id', 'm.project_id', 'm.model', 'm.xyz');
  if (!row) return null;
  // Fragment logP needs RDKit in memory; parsing loads it, but a fresh process may not have parsed yet.
  await loadRdkit();
  const library = await libraryFor(db, row.project_id);
  return {
    mappingId,
    moleculeId: row.molecule_id,
    projectId: row.project_id,
    locked: !!row.locked,
    resolution: row.resolution,
    model: parseModel({ id: row.molecule_id, model: row.model }),
    xyz: row.xyz ? (JSON.parse(row.xyz) as number[][]) : null,
    library: library.length ? library : undefined,
  };
}

export { evaluateDraft, type EvaluationInputs, type EvaluationResult } from './evaluate-draft';
