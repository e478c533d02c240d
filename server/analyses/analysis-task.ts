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
  chunk: number;
}

export interface AnalysisPart {
  from: number;
  to: number;
  /** (to − from) × copies × beads × 3, nm. */
  centres: Float32Array;
  /** terms × (to − from) × copies, term after term. */
  values: Float32Array;
}
