import { startTsWorker, WORKER_READY } from './ts-worker';

/**
 * One long task in a thread of its own (trajectory matching and analysis): the thread gets the task
 * once its module has loaded, may post `{ progress }` and `{ part }` messages while it works, and ends
 * with `{ result }` or `{ error: { message, code?, details? } }`. `isCancelled` is asked twice a
 * second; when it says yes the thread is terminated (a tight loop cannot be interrupted any other way)
 * and the promise rejects with TaskCancelled.
 */
export class TaskCancelled extends Error {
  constructor() {
    super('the task was cancelled');
  }
}

export class TaskFailed extends Error {
  constructor(
    message: string,
    readonly code?: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export interface TaskHooks<Part> {
  onProgress?(done: number, total: number): void;
  onPart?(part: Part): void | Promise<void>;
  isCancelled?(): Promise<boolean> | boolean;
}

export function runTaskThread<Task extends object, Result, Part = never>(moduleUrl: URL, task: Task, hooks: TaskHooks<Part> = {}, transfer: ArrayBuffer[] = []): Promise<Result> {
  const worker = startTsWorker(moduleUrl);
  return new Promise<Result>((resolve, reject) => {
    let settled = false;
    let parts = Promise.resolve();
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      clearInterval(poll);
      fn();
      void worker.terminate();
    };
    const poll = setInterval(() => {
      void Promise.resolve(hooks.isCancelled?.()).then((yes) => {
        if (yes) finish(() => reject(new TaskCancelled()));
      });
    }, 500);
    worker.on('message', (m: typeof WORKER_READY | { progress?: [number, number]; part?: Part; result?: Result; error?: { message: string; code?: string; details?: unknown } }) => {
      if (m === WORKER_READY) return worker.postMessage(task, transfer);
      if (m.progress) hooks.onProgress?.(m.progress[0], m.progress[1]);
      if (m.part !== undefined) {
        const part = m.part;
        parts = parts.then(() => hooks.onPart?.(part));
      }
      if ('result' in m) {
        const result = m.result as Result;
        void parts.then(
          () => finish(() => resolve(result)),
          (err: unknown) => finish(() => reject(err)),
        );
      }
      if (m.error) {
        const e = m.error;
        finish(() => reject(new TaskFailed(e.message, e.code, e.details)));
      }
    });
    worker.on('error', (err) => finish(() => reject(err)));
    worker.on('exit', (code) => finish(() => reject(new Error(`the task thread stopped (exit ${code})`))));
  });
}
