import type { BeadType, Mapping, Molecule, Resolution } from '../../src/shared/chem';
import { evaluateMapping } from '../chem/evaluate';
import { isChemError } from '../chem/errors';
import type { EvaluationResult } from '../mappings/draft-access';
export type { EvaluationResult };

// One mapping draft's evaluation with the core's refusals turned into data (a draft mid-edit may be
// unevaluable). No database here: the evaluation thread loads this module.

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
