import type { Mapping, Resolution } from '../../src/shared/chem';
import type { TransferResult } from '../../src/shared/proposals';
import type { SourceVersion } from '../../src/shared/mappings';

/**
 * How a new mapping's draft can start besides empty: from the automatic proposal, as a copy of a state
 * of another mapping, or by transfer from a related molecule's mapping (implemented in server/proposals).
 * A seam, so the mappings routes depend on neither the proposal nor the versions module.
 */
export interface MappingStarts {
  proposal(moleculeId: number, resolution: Resolution): Promise<Mapping>;
  transfer(moleculeId: number, from: { transferFrom: number; version?: SourceVersion }, resolution: Resolution): Promise<TransferResult>;
  /** A state of another mapping of the same molecule to copy (its draft, production or a saved version). */
  copy(moleculeId: number, from: { copyOf: number; version?: SourceVersion }): Promise<Mapping>;
}
