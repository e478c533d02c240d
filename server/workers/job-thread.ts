import type { Worker } from 'node:worker_threads';
import { startTsWorker, WORKER_READY } from './ts-worker';

export interface JobThreadOptions {
  /** The thread stops after this long without jobs, so an idle server gives its memory back. */
  idleMs: number;
  /** Lets the owner forget state the old thread held (it crashed, timed out or was stopped). */
  onRestart?: () => void;
  /**
   * How long one job may run (read at each job's start, so a setting changed later applies); 0 or
   * absent: no limit. A job over it is answered with `timeoutError(limitMs)` and its thread is
   * ended — a stuck openchemlib call cannot be interrupted any other way — and started again for
   * the jobs behind it.
   */
  timeoutMs?: () => number;
  timeoutError?: (limitMs: number) => Error;
}

interface Queued<Job, Reply> {
  id: number;
  job: Job;
  resolve(r: Reply): void;
  reject(e: Error): void;
}

/**
 * A worker thread that answers jobs in order, one at a time: `run(job)` queues `{ id, ...job }` and
 * resolves with the thread's `{ id, ... }` reply. Jobs wait here, not in the thread, so the running
 * job is always known and its time limit counts its own running time only. The thread starts on first
 * use, and after a crash or a time-out the running job is rejected and the queue goes on in a new
 * thread. `started` / `finished` listeners see each job start and end (tests time lanes by them).
 */
export class JobThread<Job extends object, Reply extends object> {
  private worker: Worker | null = null;
  /** The worker's module has loaded; a running job's clock starts then. */
  private ready = false;
  private nextId = 1;
  private readonly queue: Queued<Job, Reply>[] = [];
  private running: (Queued<Job, Reply> & { timer: NodeJS.Timeout | null }) | null = null;
  private idleTimer: NodeJS.Timeout | null = null;
  private readonly listeners = { started: new Set<(job: Job) => void>(), finished: new Set<(job: Job) => void>() };

  constructor(
    private readonly moduleUrl: URL,
    private readonly options: JobThreadOptions,
  ) {}

  /** True while a job runs; lanes send small jobs elsewhere then. */
  get busy(): boolean {
    return this.running !== null;
  }

  /** Jobs running or waiting. */
  get load(): number {
    return this.queue.length + (this.running ? 1 : 0);
  }

  on(event: 'started' | 'finished', listener: (job: Job) => void): () => void {
    this.listeners[event].add(listener);
    return () => this.listeners[event].delete(listener);
  }

  run(job: Job): Promise<Reply> {
    if (this.idleTimer) clearTimeout(this.idleTimer);
    this.idleTimer = null;
    return new Promise((resolve, reject) => {
      this.queue.push({ id: this.nextId++, job, resolve, reject });
      this.next();
    });
  }

  /** Sends a message that gets no reply. Dropped when the thread is not running (it holds no state then). */
  tell(message: object): void {
    this.worker?.postMessage(message);
  }

  /** Stops the thread; running and waiting jobs are rejected (their callers must not wait for a thread that is gone). */
  async stop(): Promise<void> {
    const w = this.worker;
    this.worker = null;
    if (this.idleTimer) clearTimeout(this.idleTimer);
    this.idleTimer = null;
    this.options.onRestart?.();
    const stopped = new Error('the worker thread was stopped');
    const all = [...(this.running ? [this.running] : []), ...this.queue.splice(0)];
    if (this.running?.timer) clearTimeout(this.running.timer);
    this.running = null;
    for (const q of all) q.reject(stopped);
    if (w) await w.terminate();
  }

  private next(): void {
    if (this.running) return;
    const q = this.queue.shift();
    if (!q) {
      this.armIdle();
      return;
    }
    this.running = { ...q, timer: null };
    for (const l of this.listeners.started) l(q.job);
    this.thread().postMessage({ ...q.job, id: q.id });
    if (this.ready) this.startClock();
  }

  private startClock(): void {
    const limit = this.options.timeoutMs?.() ?? 0;
    if (this.running && limit > 0) this.running.timer = setTimeout(() => this.timeOut(limit), limit);
  }

  /** Ends the running job with `err` and goes on with the queue. */
  private settle(outcome: { reply: Reply } | { err: Error }): void {
    const r = this.running;
    if (!r) return;
    this.running = null;
    if (r.timer) clearTimeout(r.timer);
    for (const l of this.listeners.finished) l(r.job);
    if ('reply' in outcome) r.resolve(outcome.reply);
    else r.reject(outcome.err);
    this.next();
  }

  private timeOut(limitMs: number): void {
    const w = this.worker;
    this.dropWorker();
    void w?.terminate();
    this.settle({ err: this.options.timeoutError?.(limitMs) ?? new Error(`the job ran over its ${limitMs} ms limit`) });
  }

  private dropWorker(): void {
    this.worker = null;
    this.options.onRestart?.();
  }

  private thread(): Worker {
    if (this.worker) return this.worker;
    const w = startTsWorker(this.moduleUrl);
    this.ready = false;
    w.on('message', (reply: (Reply & { id: number }) | typeof WORKER_READY) => {
      if (this.worker !== w) return;
      if (reply === WORKER_READY) {
        this.ready = true;
        return this.startClock();
      }
      if (this.running?.id === reply.id) this.settle({ reply });
    });
    const fail = (err: Error) => {
      if (this.worker !== w) return;
      this.dropWorker();
      this.settle({ err });
    };
    w.on('error', fail);
    w.on('exit', (code) => fail(new Error(`the worker thread stopped (exit ${code})`)));
    this.worker = w;
    return w;
  }

  private armIdle(): void {
    if (this.idleTimer) clearTimeout(this.idleTimer);
    this.idleTimer = setTimeout(() => void this.stop(), this.options.idleMs);
    this.idleTimer.unref();
  }
}
