import { AsyncLocalStorage } from 'node:async_hooks';
import type { RequestHandler } from 'express';
import type { Logger } from 'pino';
import type { Job, JobQueue } from './job-queue';

// The in-process job queue. `afterResponse` (mounted before the routes) gives each request a list of
// its jobs; a job enqueued while the request runs waits there and starts only once the response has
// been sent ('finish', or 'close' when the client went away), so a slow SMTP server never delays an
// answer. A job enqueued outside a request starts on the next turn of the event loop. A failing job
// is logged and dropped (e-mail is best effort: the notification itself is already stored).

export type JobRunner = (job: Job) => Promise<void>;

export interface InProcessQueue extends JobQueue {
  afterResponse: RequestHandler;
}

export function createInProcessQueue(run: JobRunner, log: Logger): InProcessQueue {
  /** The current request's jobs, until its response has been sent. */
  const scope = new AsyncLocalStorage<{ held: Job[]; sent: boolean }>();
  let running = 0;
  let waiting: (() => void)[] = [];

  const settle = () => {
    if (running > 0) return;
    const done = waiting;
    waiting = [];
    for (const resolve of done) resolve();
  };

  /** Runs jobs already counted in `running`. */
  const start = (jobs: Job[]) => {
    for (const job of jobs) {
      run(job)
        .catch((err: unknown) => log.error({ err, kind: job.kind, about: job.about }, 'background job failed'))
        .finally(() => {
          running -= 1;
          settle();
        });
    }
  };

  return {
    enqueue(job) {
      running += 1; // counted from acceptance, so idle() waits for it
      const request = scope.getStore();
      if (request && !request.sent) request.held.push(job);
      else setImmediate(() => start([job]));
    },
    idle() {
      return running === 0 ? Promise.resolve() : new Promise((resolve) => waiting.push(resolve));
    },
    afterResponse(_req, res, next) {
      const request = { held: [] as Job[], sent: false };
      const release = () => {
        if (request.sent) return;
        request.sent = true;
        start(request.held.splice(0));
      };
      res.on('finish', release);
      res.on('close', release);
      scope.run(request, next);
    },
  };
}
