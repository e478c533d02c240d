import { join } from 'node:path';
import type { Db } from '../db/knex';
import type { Molecule } from '../../src/shared/chem';
import type { ReferenceSelection } from '../../src/shared/references-selection';
import type { TaskHooks, TaskRunner } from '../jobs/background-task';
import { runTaskThread, TaskFailed } from '../workers/task-thread';
import type { MatchResult, MatchTask } from './match-reference';
import { referenceDir, removeDir } from './reference-files';
import { findReference, moleculeForReference, referenceFailed, referenceMatched, setReferenceProgress, setReferenceState } from './references.service';

// The reference matching job: plain data (which reference) and a runner that does the work in a
// thread (match-worker.ts) and records state, progress (per mille) and the outcome in MariaDB.

/** Failures another selection can mend: the molecule was not found where the search looked. */
const RETRYABLE = new Set(['molecule_not_found', 'united_atom_reference']);

export interface MatchJobData {
  referenceId: number;
}

export function matchJobRunner(db: Db, dataDir: string): TaskRunner<MatchJobData> {
  return async ({ referenceId }: MatchJobData, hooks: TaskHooks) => {
    const row = await findReference(db, referenceId);
    if (!row) return;
    const mol = await moleculeForReference(db, row.molecule_id);
    if (!mol) return;
    const model = JSON.parse(mol.model) as Molecule;
    const dir = referenceDir(dataDir, referenceId);
    await setReferenceState(db, referenceId, 'matching', { done: 0, total: 1000 });
    const task: MatchTask = {
      structure: { path: join(dir, `structure.${row.structure_format}`), format: row.structure_format },
      trajectory: row.trajectory_format ? { path: join(dir, `trajectory.${row.trajectory_format}`), format: row.trajectory_format } : null,
      selection: row.selection ? (JSON.parse(row.selection) as ReferenceSelection) : null,
      molecule: { atoms: model.atoms, bonds: model.bonds },
      outDir: dir,
    };
    let last = 0;
    try {
      const result = await runTaskThread<MatchTask, MatchResult>(new URL('./match-worker.ts', import.meta.url), task, {
        onProgress: (done, total) => {
          const now = Date.now();
          if (now - last < 250) return;
          last = now;
          void hooks.reportProgress(Math.round((1000 * done) / total), 1000);
        },
        isCancelled: () => hooks.isCancelled(),
      });
      await referenceMatched(db, referenceId, { copies: result.copies, frames: result.frames, atomsPerCopy: result.atomsPerCopy, atomsTotal: result.atomsTotal, sourceFormat: result.source.format });
      await hooks.reportProgress(1000, 1000);
    } catch (err) {
      // A refused reference keeps its row (so everyone sees why). Its files stay when a narrowed
      // search may still find the molecule (POST /api/references/:id/match, without uploading
      // again); a file that cannot be read, or that disagrees with the other, is removed.
      const code = err instanceof TaskFailed ? (err.code ?? 'matching_failed') : 'matching_failed';
      const keep = RETRYABLE.has(code);
      if (err instanceof TaskFailed) await referenceFailed(db, referenceId, code, err.message, err.details, keep);
      else await referenceFailed(db, referenceId, code, `Matching stopped: ${(err as Error).message}`);
      if (!keep) await removeDir(dir);
    }
  };
}

/** The job's progress, and "cancelled" when the reference was deleted meanwhile, in MariaDB (any process). */
export function matchJobHooks(db: Db, referenceId: number): TaskHooks {
  return {
    reportProgress: (done, total) => setReferenceProgress(db, referenceId, { done, total }),
    isCancelled: async () => !(await findReference(db, referenceId)),
  };
}
