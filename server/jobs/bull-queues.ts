import { Queue, QueueEvents, type JobsOptions } from 'bullmq';
import type { Logger } from 'pino';
import type { Job, JobQueue } from './job-queue';
import type { BackgroundTasks } from './background-task';

/**
 * The BullMQ side of the job seam (REDIS_URL set): jobs go to Redis queues and run in `npm run worker`
 * processes (server/worker.ts), any number of them, on any machine that sees the same Redis, MariaDB
 * and data folder. Names of the queues and what their jobs carry (plain JSON):
 *   beadloom-mail        a Job of job-queue.ts ({ kind: 'mail', mail, about })
 *   beadloom-conformers  { moleculeId }
 *   beadloom-tasks       the long jobs of background-task.ts, the job's name being its kind
 *                        ('reference-match' { referenceId }, 'analysis' { analysisId }); tried once,
 *                        since the runner records its own failure (and progress, cancellation) in MariaDB
 * A job that fails is tried again with a back-off (`attempts`); what it did is kept in MariaDB rows, not
 * in Redis, so a lost Redis loses queued work, never results (docs/scaling.md).
 */
export const QUEUES = { mail: 'beadloom-mail', conformers: 'beadloom-conformers', tasks: 'beadloom-tasks' } as const;

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

  add(data: T, options: JobsOptions & { name?: string } = {}): void {
    const { name, ...jobOptions } = options;
    const done = this.queue
      .add(name ?? this.queue.name, data, jobOptions)
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

/**
 * Long jobs on BullMQ: `start` queues the kind and its data; the worker process builds the runner and
 * its hooks (progress, cancellation: MariaDB rows) from the kind (server/worker.ts), so the runner and
 * hooks passed here are not sent. `idle()` waits for the jobs this process started.
 */
export function createBullTasks(redisUrl: string, log: Pick<Logger, 'error'>): BackgroundTasks & { close(): Promise<void> } {
  const tasks = new BullProducer<unknown>(QUEUES.tasks, redisUrl, log);
  return {
    start: (kind, _runner, data) => tasks.add(data, { name: kind, attempts: 1 }),
    idle: () => tasks.idle(),
    close: () => tasks.close(),
  };
}
