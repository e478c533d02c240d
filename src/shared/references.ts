import { z } from 'zod';
import { versionRef, type VersionRef } from './versions';
export { referenceSelection, type ReferenceSelection } from './references-selection';

// References (atomistic reference simulations of a molecule) and analyses (a mapping version applied
// to one), as the API sends them. Units as the engines use them: nm, degrees, kJ/mol.

export const REFERENCE_FIELDS = { name: 'name', structure: 'structure', trajectory: 'trajectory', selection: 'selection' } as const;

export type JobStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';
export type ReferenceStatus = 'queued' | 'matching' | 'ready' | 'failed';

export interface Progress {
  done: number;
  total: number;
}

export interface ReferenceView {
  id: number;
  moleculeId: number;
  name: string;
  status: ReferenceStatus;
  progress: Progress;
  copies: number | null;
  frames: number | null;
  atomsPerCopy: number | null;
  structureName: string;
  trajectoryName: string | null;
  bytes: number;
  createdAt: string;
  /** retryable: the files were kept, so POST /api/references/:id/match may try again with another selection. */
  error?: { code: string; message: string; details?: unknown; retryable?: boolean };
}

export const referenceNameField = z.string().trim().min(1, 'Give the reference a name.').max(200);

export const analysisBody = z
  .object({
    referenceId: z.number().int().positive(),
    version: z.union([z.literal('draft'), z.literal('production'), z.number().int().positive()]),
    temperature: z.number().min(1).max(5000).optional(),
    bins: z.number().int().min(10).max(1000).optional(),
  })
  .strict();
export type AnalysisBody = z.infer<typeof analysisBody>;

export const DEFAULT_TEMPERATURE = 298.15;
export const DEFAULT_BINS = 100;

export interface Term {
  /** Bead names, in the term's order. */
  beads: string[];
  /** Bead ids (stable across renames), same order. */
  beadIds: string[];
  /** nm for bonds, degrees for angles and dihedrals. */
  mean: number;
  sd: number;
  /** kJ mol⁻¹ nm⁻² (bonds), kJ mol⁻¹ rad⁻² (angles); null for dihedrals (see fourier). */
  k: number | null;
  histogram: { edges: number[]; counts: number[] };
  /** Boltzmann-inverted potential at the bin centres, kJ/mol, minimum 0; null where a bin is empty. */
  potential: { x: number[]; u: (number | null)[] };
  /** Dihedrals: U(φ) ≈ Σ k [1 + cos(nφ − phase)], n = 1…4 (kJ/mol, degrees). */
  fourier?: { n: number; k: number; phase: number }[];
  /**
   * Dihedrals: which terms the fit has and why: `fitted` the n in `fourier`, `filledBins` the points
   * fitted, `note` why fewer than n = 1…4 (terms up to n need 2n + 1 filled bins), null when all four.
   */
  fourierFit?: { fitted: number[]; filledBins: number; note: string | null };
}

export interface AnalysisResult {
  frames: number;
  copies: number;
  beads: { id: string; name: string }[];
  bonds: Term[];
  angles: Term[];
  dihedrals: Term[];
}

export interface AnalysisView {
  id: number;
  status: JobStatus;
  progress: Progress;
  mappingId: number;
  version: VersionRef;
  versionNumber: number | null;
  contentSha256: string;
  referenceId: number;
  temperature: number;
  bins: number;
  createdBy: number | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  error?: { code: string; message: string };
  result?: AnalysisResult;
}

export const CG_TRAJECTORY_FORMATS = ['gro', 'pdb', 'trr'] as const;
export const cgTrajectoryQuery = z.object({ format: z.enum(CG_TRAJECTORY_FORMATS) });
export { versionRef };
