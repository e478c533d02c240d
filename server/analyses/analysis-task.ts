import type { FrameIndex } from '../references/frame-index';
import type { TrajectoryFormat } from '../references/formats';
import type { TermKind } from '../trajectory/distributions';

// What one analysis thread is given (plain data): where the frames are, which reference atom is each
// molecule point in every copy, how to make a copy whole, each bead's centre as point weights, and
// the CG terms as bead indices. It answers per chunk of frames with the bead centres (nm) and each
// term's values (nm or degrees).

export interface AnalysisTask {
  source: { path: string; format: TrajectoryFormat };
  index: FrameIndex;
  copiesFile: string;
  copies: number;
  atomsPerCopy: number;
  order: number[];
  via: number[];
  beads: { points: number[]; weights: number[] }[];
  terms: { kind: TermKind; beads: number[] }[];
  from: number;
  to: number;
  /** Frames per chunk (one read, one part sent back). */
  chunk: number;
  /**
   * Int32 counter of the next chunk, shared by the threads of one analysis (they take chunks from it
   * until none is left); without it the thread does every chunk from `from` to `to` itself.
   */
  next?: SharedArrayBuffer;
}

export interface AnalysisPart {
  from: number;
  to: number;
  /** (to − from) × copies × beads × 3, nm. */
  centres: Float32Array;
  /** terms × (to − from) × copies, term after term. */
  values: Float32Array;
}
