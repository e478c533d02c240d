import { Queue, QueueEvents, type JobsOptions } from 'bullmq';
import type { Logger } from 'pino';
import type { Job, JobQueue } from './job-queue';

/**
 * The BullMQ side of the job seam (REDIS_URL set): jobs go to Redis queues and run in `npm run worker`
 * processes (server/worker.ts), any number of them, on any machine that sees the same Redis, MariaDB
 * and data folder. Names of the queues and what their jobs carry (plain JSON):
 *   beadloom-mail        a Job of job-queue.ts ({ kind: 'mail', mail, about })
 *   beadloom-conformers  { moleculeId } (the job id is the molecule's, so it is queued once)
 * A job that fails is tried again with a back-off (`attempts`); what it did is kept in MariaDB rows, not
 * in Redis, so a lost Redis loses queued work, never results (docs/scaling.md).
 */
export const QUEUES = { mail: 'beadloom-mail', conformers: 'beadloom-conformers' } as const;

export const bullConnection = (redisUrl: string) => ({ url: redisUrl, maxRetriesPerRequest: null });

const DEFAULTS: JobsOptions = { attempts: 3, backoff: { type: 'exponential', delay: 2000 }, removeOnComplete: 1000, removeOnFail: 5000 };

/**
 * A queue this process adds jobs to, and can wait on (tests, shutdown): `idle()` resolves once every
 * job it added has finished on a worker (or failed for good).
 */
export class BullProducer<T> {
  readonly queue: Queue;
  private readonly events: QueueEvents;
  private readonly pending = new Set<Promise<unknown>>();

  constructor(
    name: string,
    redisUrl: string,
    private readonly log: Pick<Logger, 'error'>,
  ) {
    this.queue = new Queue(name, { connection: bullConnection(redisUrl), defaultJobOptions: DEFAULTS });
    this.events = new QueueEvents(name, { connection: bullConnection(redisUrl) });
  }

  add(data: T, jobId?: string): void {
    const done = this.queue
      .add(this.queue.name, data, jobId ? { jobId } : {})
      .then((job) => job.waitUntilFinished(this.events).catch(() => undefined))
      .catch((err: unknown) => this.log.error({ err, queue: this.queue.name }, 'could not queue a job'))
      .finally(() => this.pending.delete(done));
    this.pending.add(done);
  }

  async idle(): Promise<void> {
    while (this.pending.size) await Promise.all([...this.pending]);
  }

  async close(): Promise<void> {
    await this.events.close();
    await this.queue.close();
  }
}

/** Outgoing mail on BullMQ: the answer never waits for SMTP, and a worker retries a failed send. */
export function createBullJobQueue(redisUrl: string, log: Pick<Logger, 'error'>): JobQueue & { close(): Promise<void> } {
  const mail = new BullProducer<Job>(QUEUES.mail, redisUrl, log);
  return {
    enqueue: (job) => mail.add(job),
    idle: () => mail.idle(),
    close: () => mail.close(),
  };
}
