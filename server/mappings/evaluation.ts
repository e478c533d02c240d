import type { Db } from '../db/knex';
import type { EvaluationInputs, EvaluationResult } from './evaluate-draft';
import { parseModel } from '../molecules/molecule-view';
import { libraryFor } from '../bead-types/bead-types.service';
import { loadDraft } from '../collab/draft-store';
import { docToMapping } from '../../src/shared/mapping-doc';
import type { Mapping } from '../../src/shared/chem';
import { evaluateOnceInThread } from './evaluation-thread';

// What the chemistry core needs to evaluate one mapping's draft, read from the database.
// The evaluation itself is in evaluate-draft.ts (no database, so the evaluation thread can load it);
// the main thread only ever evaluates through that thread.

export async function loadEvaluationInputs(db: Db, mappingId: number): Promise<EvaluationInputs | null> {
  const row = await db('mappings as p')
    .join('molecules as m', 'm.id', 'p.molecule_id')
    .where('p.id', mappingId)
    .first('p.id', 'p.resolution', 'p.locked', 'm.id as molecule_id', 'm.project_id', 'm.model', 'm.xyz');
  if (!row) return null;
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

/** A stored draft and its evaluation, read while no room holds the mapping; null when there is no such mapping. */
export async function readStoredDraft(db: Db, mappingId: number): Promise<{ draft: Mapping; result: EvaluationResult } | null> {
  const inputs = await loadEvaluationInputs(db, mappingId);
  if (!inputs) return null;
  const draft = docToMapping((await loadDraft(db, mappingId, inputs.model.atoms.length)).doc);
  return { draft, result: await evaluateOnceInThread(inputs, draft) };
}

export type { EvaluationInputs, EvaluationResult } from './evaluate-draft';
