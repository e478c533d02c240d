import { EventEmitter } from 'node:events';
import type { Logger } from 'pino';
import type { Redis } from 'ioredis';
import type { Db } from '../db/knex';
import { BullProducer, QUEUES } from '../jobs/bull-queues';
import type { Conformers } from './conformer-queue';

/**
 * Conformer jobs on BullMQ (REDIS_URL set): the molecule row says queued → running → done | failed as
 * before; the computation runs on a worker (server/worker.ts), which afterwards tells every app
 * server's live drafts of that molecule to re-read their inputs (the invalidation bus). At start-up
 * each app server queues the molecules left queued or running that have no job waiting in Redis.
 */
export class BullConformerQueue extends EventEmitter implements Conformers {
  private readonly producer: BullProducer<{ moleculeId: number }>;

  constructor(
    private readonly db: Db,
    redisUrl: string,
    log: Pick<Logger, 'error'>,
    private readonly redis: Redis,
  ) {
    super();
    this.producer = new BullProducer(QUEUES.conformers, redisUrl, log);
  }

  enqueue(moleculeId: number): void {
    this.producer.add({ moleculeId });
  }

  position(): number | null {
    return null;
  }

  async resume(): Promise<void> {
    // App servers start together: one of them queues what was left (the others would queue it again).
    if ((await this.redis.set('beadloom:conformer-resume', String(process.pid), 'PX', 60_000, 'NX')) !== 'OK') return;
    const rows = await this.db('molecules').whereIn('conformer_status', ['queued', 'running']).orderBy('id').select('id');
    // Jobs already waiting in Redis keep their place: only molecules without one are queued.
    const waiting = new Set((await this.producer.queue.getJobs(['waiting', 'active', 'delayed', 'prioritized'])).map((j) => (j?.data as { moleculeId?: number })?.moleculeId));
    for (const r of rows) if (!waiting.has(r.id)) this.enqueue(r.id);
  }

  idle(): Promise<void> {
    return this.producer.idle();
  }

  close(): Promise<void> {
    return this.producer.close();
  }
}
