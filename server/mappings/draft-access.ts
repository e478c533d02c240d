import type * as Y from 'yjs';
import type { Evaluation, Mapping } from '../../src/shared/chem';

/** One evaluation of a draft: the numbers, or the error that stopped them, and when. */
export interface EvaluationResult {
  evaluation: Evaluation | null;
  error: { code: string; message: string } | null;
  evaluatedAt: string;
}

/**
 * The live drafts as the REST side needs them (implemented by the collab server): the current state
 * of a draft, live or from MariaDB, and a nudge when a mapping's settings change. A seam, so routes
 * and services depend on this small interface rather than on the live-draft module.
 */
export interface DraftAccess {
  read(mappingId: number): Promise<{ draft: Mapping; result: EvaluationResult }>;
  /**
   * `make(doc)` of the draft as MariaDB stores it, computed once per stored state and kept (null: no
   * such mapping). `name` tells derivations apart; `doc` is shared, so `make` only reads it.
   */
  storedDerived<T>(mappingId: number, name: string, make: (doc: Y.Doc) => T): Promise<T | null>;
  /** The mapping's settings changed (resolution, lock): re-read them and re-evaluate if live. */
  refresh(filter: { mappingId?: number; moleculeId?: number; projectId?: number }): void;
}
