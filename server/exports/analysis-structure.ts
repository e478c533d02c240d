import { open } from 'node:fs/promises';
import { join } from 'node:path';
import type { Vec3 } from '../../src/shared/chem';
import type { AnalysisResult } from '../../src/shared/references';
import { analysisDir } from '../references/reference-files';
import { meanStructure } from '../trajectory/mean-structure';

// The structure an engine export takes from a reference analysis: the mean of the first copy's bead
// centres over every frame (superposed; server/trajectory/mean-structure.ts), read from the analysis's
// centres.f32 (frames × copies × beads × 3 float32, nm; analysis-job.ts), which holds each copy whole.

export interface AnalysisStructure {
  /** Bead id → centre (nm). */
  centres: Map<string, Vec3>;
  /** What the .gro title and headers say about where the coordinates come from. */
  note: string;
  /** GROMACS only: the mapping's index file in the reference's atom numbering (reference-ndx.ts), when its files are there. */
  referenceNdx?: { name: string; text: string };
}

export async function analysisStructure(dataDir: string, analysis: { id: number; versionNumber: number | null; result: AnalysisResult }): Promise<AnalysisStructure> {
  const { frames, copies, beads } = analysis.result;
  const nb = beads.length;
  const perFrame = copies * nb * 3;
  const fh = await open(join(analysisDir(dataDir, analysis.id), 'centres.f32'), 'r');
  const list: Float32Array[] = [];
  try {
    for (let f = 0; f < frames; f++) {
      const xyz = new Float32Array(nb * 3);
      await fh.read(new Uint8Array(xyz.buffer), 0, nb * 12, f * perFrame * 4);
      list.push(xyz);
    }
  } finally {
    await fh.close();
  }
  const mean = meanStructure(list, nb);
  const centres = new Map<string, Vec3>(beads.map((b, i) => [b.id, [mean[3 * i], mean[3 * i + 1], mean[3 * i + 2]]]));
  const of = analysis.versionNumber === null ? 'a draft' : `version ${analysis.versionNumber}`;
  return { centres, note: `bead centres: mean structure of analysis ${analysis.id} (${of}; copy 1 over ${frames} frames, superposed), nm` };
}
