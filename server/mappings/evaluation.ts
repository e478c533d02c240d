import type { Db } from '../db/knex';
import type { BeadType, Evaluation, Mapping, Molecule, Resolution } from '../../src/shared/chem';
import { evaluateMapping, isChemError, loadRdkit } from '../chem/index';
import { parseModel } from '../molecules/molecule-view';
import { libraryFor } from '../bead-types/bead-types.service';

// What the chemistry core needs to evaluate one mapping's draft, read from the database, and the
// evaluation itself with the core's refusals turned into data (a draft mid-edit may be unevaluable).

export interface EvaluationInputs {
  mappingId: number;
  moleculeId: number;
  projectId: number;
  locked: boolean;
  resolution: Resolution;
  model: Molecule;
  xyz: number[][] | null;
  /** The project's library, or undefined for the core's illustrative default when the project has none. */
  library: BeadType[] | undefined;
}

export interface EvaluationResult {
  evaluation: Evaluation | null;
  error: { code: string; message: string } | null;
  evaluatedAt: string;
}

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

export function evaluateDraft(inputs: EvaluationInputs, mapping: Mapping): EvaluationResult {
  const evaluatedAt = new Date().toISOString();
  try {
    const evaluation = evaluateMapping(inputs.model, mapping, {
      resolution: inputs.resolution,
      ...(inputs.xyz ? { coordinates: inputs.xyz } : {}),
      ...(inputs.library ? { library: inputs.library } : {}),
    });
    return { evaluation, error: null, evaluatedAt };
  } catch (err) {
    if (!isChemError(err)) throw err;
    return { evaluation: null, error: { code: err.code, message: err.message }, evaluatedAt };
  }
}
