import { mkdir, rename, rm } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import type { StructureFormat, TrajectoryFormat } from './formats';

// Where a reference's and an analysis's files live under the data folder (config.dataDir):
//   references/<id>/structure.<ext>, trajectory.<ext>, copies.bin, frames.json
//   analyses/<id>/centres.f32 (frames × copies × beads × 3, float32, nm); values.f32 while it runs
//     (term values, removed once the distributions are built: analysis-run.ts)
//   uploads/  multer's temporary files until a reference row takes them

// Absolute, so worker threads and later worker processes find the same files.
export const uploadDir = (dataDir: string) => join(resolve(dataDir), 'uploads');
export const referenceDir = (dataDir: string, id: number) => join(resolve(dataDir), 'references', String(id));
export const analysisDir = (dataDir: string, id: number) => join(resolve(dataDir), 'analyses', String(id));

export async function adoptUpload(tmpPath: string, dir: string, name: string): Promise<string> {
  await mkdir(dir, { recursive: true });
  const to = join(dir, name);
  await rename(tmpPath, to);
  return to;
}

export async function removeDir(dir: string): Promise<void> {
  await rm(dir, { recursive: true, force: true });
}

/** The file an analysis reads frames from: the trajectory, or the structure (a molfile's XYZ copy). */
export function sourceOf(dir: string, ref: { trajectory_format: TrajectoryFormat | null; structure_format: StructureFormat; source_format: TrajectoryFormat | null }): { path: string; format: TrajectoryFormat } {
  if (ref.trajectory_format) return { path: join(dir, `trajectory.${ref.trajectory_format}`), format: ref.trajectory_format };
  if (ref.structure_format === 'mol') return { path: join(dir, 'frames.xyz'), format: 'xyz' };
  return { path: join(dir, `structure.${ref.structure_format}`), format: ref.structure_format };
}
