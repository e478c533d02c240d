import type { Logger } from 'pino';

// Long jobs a request starts and everyone then watches (reference matching, analyses). A job is plain
// JSON data and a runner `(data, hooks) => Promise<void>` in its own module; the runner keeps its
// state (status, progress, cancel flag) in MariaDB, so every app server and viewer sees the same job.
// Today they run in this process (their heavy work in worker threads); a queue with worker processes
// (the scale-out issue) can call the same runners with the same data.

export interface TaskHooks {
  /** Records progress where every viewer reads it (throttled by the caller's runner). */
  reportProgress(done: number, total: number): Promise<void>;
  /** Whether someone asked for the job to stop (read from MariaDB). */
  isCancelled(): Promise<boolean>;
}

export type TaskRunner<Data> = (data: Data, hooks: TaskHooks) => Promise<void>;

export interface BackgroundTasks {
  /** Starts a job after the current turn; its failure is the runner's to record (and is logged). */
  start<Data>(kind: string, runner: TaskRunner<Data>, data: Data, hooks: TaskHooks): void;
  /** Resolves once every job started so far has finished (tests and shutdown). */
  idle(): Promise<void>;
}

export function createInProcessTasks(log: Logger): BackgroundTasks {
  const running = new Set<Promise<void>>();
  return {
    start(kind, runner, data, hooks) {
      const p: Promise<void> = new Promise<void>((resolve) => setImmediate(resolve))
        .then(() => runner(data, hooks))
        .catch((err: unknown) => log.error({ err, kind }, 'background task failed'))
        .finally(() => running.delete(p));
      running.add(p);
    },
    async idle() {
      while (running.size) await Promise.all([...running]);
    },
  };
}
