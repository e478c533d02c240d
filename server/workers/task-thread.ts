import type { Worker } from 'node:worker_threads';
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

/**
 * Spare threads: started ahead, their module loaded, each waiting for one task. Starting a thread
 * costs about half a second of CPU (tsx's loader registers inside it, then the module's libraries
 * load), which is a large part of a short analysis; a process that has run one analysis keeps as
 * many spares ready for the next (keepSpareThreads), each used once (a cancelled task's thread is
 * terminated, so a spare is never a thread that has run anything). Spares unused for SPARE_IDLE_MS
 * are ended: an idle thread holds some 40 MB.
 */
const SPARE_IDLE_MS = 10 * 60_000;
const spares = new Map<string, { ready: Worker[]; starting: number; timer?: NodeJS.Timeout }>();
/** A spare's own listeners, removed when it is taken (never removeAllListeners: the Worker has internal ones). */
const spareListeners = new WeakMap<Worker, () => void>();

export function keepSpareThreads(moduleUrl: URL, count: number): Promise<void> {
  let pool = spares.get(moduleUrl.href);
  if (!pool) spares.set(moduleUrl.href, (pool = { ready: [], starting: 0 }));
  const p = pool;
  const started: Promise<void>[] = [];
  for (let i = p.ready.length + p.starting; i < count; i++) {
    p.starting++;
    const worker = startTsWorker(moduleUrl);
    started.push(
      new Promise<void>((resolve) => {
        let booting = true;
        const booted = () => {
          if (booting) p.starting--;
          booting = false;
          resolve();
        };
        worker.once('message', (m) => {
          if (m === WORKER_READY) p.ready.push(worker);
          else void worker.terminate();
          booted();
        });
        const gone = () => {
          p.ready = p.ready.filter((w) => w !== worker);
          booted();
        };
        worker.once('error', gone);
        worker.once('exit', gone);
        spareListeners.set(worker, () => {
          worker.off('error', gone);
          worker.off('exit', gone);
        });
      }),
    );
  }
  if (p.timer) clearTimeout(p.timer);
  p.timer = setTimeout(() => {
    for (const w of p.ready.splice(0)) void w.terminate();
  }, SPARE_IDLE_MS);
  p.timer.unref();
  return Promise.all(started).then(() => undefined);
}

/** How many spare threads of a module are ready now (for tests and the bench). */
export function readySpareThreads(moduleUrl: URL): number {
  return spares.get(moduleUrl.href)?.ready.length ?? 0;
}

function takeSpare(moduleUrl: URL): Worker | undefined {
  const worker = spares.get(moduleUrl.href)?.ready.shift();
  if (worker) spareListeners.get(worker)?.();
  return worker;
}

export function runTaskThread<Task extends object, Result, Part = never>(moduleUrl: URL, task: Task, hooks: TaskHooks<Part> = {}, transfer: ArrayBuffer[] = []): Promise<Result> {
  const spare = takeSpare(moduleUrl);
  const worker = spare ?? startTsWorker(moduleUrl);
  if (spare) worker.postMessage(task, transfer);
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
