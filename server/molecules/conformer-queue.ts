import { EventEmitter } from 'node:events';
import type { Logger } from 'pino';
import type { Db } from '../db/knex';
import { conformerInThread, stopConformerThread } from './conformer-thread';
import { parseModel } from './molecule-view';
import { setXyz } from './molecules.service';

// Background 3D coordinates for molecules that arrived without them: one job at a time, in process,
// in arrival order, computed in a worker thread (conformer-thread.ts). The state lives in the molecule row (queued → running → done | failed), so a
// restart picks up what was waiting. An uploaded 3D structure that lands meanwhile wins.
// Emits 'queued' (moleculeId) when a job joins the queue and 'settled' when one finished either way.

/** Fixed so the same molecule always gets the same conformer (see generateConformer). */
export const CONFORMER_SEED = 1;

/** What the routes and the app ask of the conformer jobs, in process (below) or on BullMQ (bull-conformer-queue.ts). */
export interface Conformers {
  enqueue(moleculeId: number): void;
  /** Jobs ahead of this molecule's; null when not waiting here or not known (BullMQ: the row's status says "queued"). */
  position(moleculeId: number): number | null;
  resume(): Promise<void>;
  idle(): Promise<void>;
  close(): Promise<void>;
  /** 'settled' (moleculeId) when a job finished here; 'queued' (moleculeId) when one joined the queue here. */
  on(event: 'settled' | 'queued', listener: (moleculeId: number) => void): unknown;
}

export class ConformerQueue extends EventEmitter implements Conformers {
  private waiting: number[] = [];
  private current: Promise<void> | null = null;
  private closed = false;

  constructor(
    private readonly db: Db,
    private readonly log: Logger,
  ) {
    super();
  }

  /** Re-queues jobs that a previous process left waiting or running. */
  async resume(): Promise<void> {
    const rows = await this.db('molecules').whereIn('conformer_status', ['queued', 'running']).orderBy('id').select('id');
    for (const r of rows) this.enqueue(r.id);
  }

  enqueue(moleculeId: number): void {
    if (this.closed || this.waiting.includes(moleculeId)) return;
    this.waiting.push(moleculeId);
    this.emit('queued', moleculeId);
    this.pump();
  }

  /** Jobs ahead of this molecule's, or null when it is not waiting. */
  position(moleculeId: number): number | null {
    const i = this.waiting.indexOf(moleculeId);
    return i < 0 ? null : i;
  }

  /** Resolves once no job is waiting or running. */
  async idle(): Promise<void> {
    while (this.current) await this.current.catch(() => undefined);
  }

  /**
   * Stops taking jobs. A running job is abandoned, not awaited: a large molecule's conformer can take
   * minutes, and shutdown (Ctrl-C) must not wait for it. Its row stays 'running', so the next start
   * queues it again (resume()).
   */
  async close(): Promise<void> {
    this.closed = true;
    this.waiting = [];
    const running = this.current;
    if (!running) return;
    await stopConformerThread();
    await running.catch(() => undefined);
  }

  private pump(): void {
    if (this.current || this.closed) return;
    const id = this.waiting[0];
    if (id === undefined) return;
    this.current = this.run(id).finally(() => {
      this.waiting.shift();
      this.current = null;
      if (!this.closed) this.emit('settled', id);
      this.pump();
    });
  }

  private async run(id: number): Promise<void> {
    await computeConformer(this.db, this.log, id, () => this.closed);
  }
}

/**
 * One conformer job: claims the molecule (queued/running, no 3D upload), computes its conformer in the
 * conformer thread and stores it unless a 3D upload arrived meanwhile; a failure is kept in the row.
 * The in-process queue and the BullMQ worker (server/worker.ts) both run this.
 */
export async function computeConformer(db: Db, log: Pick<Logger, 'warn'>, id: number, stopped: () => boolean = () => false): Promise<void> {
  try {
    const claimed = await db('molecules').where({ id }).whereIn('conformer_status', ['queued', 'running']).whereNull('xyz_source').update({ conformer_status: 'running' });
    if (!claimed) return;
    const row = await db('molecules').where({ id }).first('id', 'model');
    const xyz = await conformerInThread(parseModel(row), CONFORMER_SEED);
    if (stopped()) return;
    // Only if no 3D upload arrived while we worked.
    const still = await db('molecules').where({ id, conformer_status: 'running' }).whereNull('xyz_source').first('id');
    if (still) await setXyz(db, id, xyz, 'conformer');
  } catch (err) {
    if (stopped()) return;
    log.warn({ err, moleculeId: id }, 'conformer generation failed');
    await db('molecules')
      .where({ id })
      .update({ conformer_status: 'failed', conformer_error: (err as Error).message?.slice(0, 1000) ?? 'unknown error' })
      .catch(() => undefined);
  }
}
