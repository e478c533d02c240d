import type { Mapping, Resolution } from '../../src/shared/chem';
import type { TransferResult } from '../../src/shared/proposals';

/**
 * How a new mapping's draft can start besides empty or a copy: from the automatic proposal, or by
 * transfer from a related molecule's mapping (implemented in server/proposals). A seam, so the
 * mappings routes do not depend on the proposal module.
 */
export interface MappingStarts {
  proposal(moleculeId: number, resolution: Resolution): Promise<Mapping>;
  transfer(moleculeId: number, from: { transferFrom: number; version?: number }, resolution: Resolution): Promise<TransferResult>;
}
