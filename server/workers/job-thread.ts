import type { Worker } from 'node:worker_threads';
import { startTsWorker } from './ts-worker';

/**
 * A worker thread that answers jobs by id: `run(job)` posts `{ id, ...job }` and resolves with the
 * thread's `{ id, ... }` reply. The thread starts on first use, restarts after a crash (every job
 * in flight is rejected), and stops after `idleMs` without jobs so an idle server gives its memory back.
 * `onRestart` lets the owner forget state the old thread held.
 */
export class JobThread<Job extends object, Reply extends object> {
  private worker: Worker | null = null;
  private nextId = 1;
  private readonly pending = new Map<number, { resolve(r: Reply): void; reject(e: Error): void }>();
  private idleTimer: NodeJS.Timeout | null = null;

  constructor(
    private readonly moduleUrl: URL,
    private readonly idleMs: number,
    private readonly onRestart: () => void = () => undefined,
  ) {}

  run(job: Job): Promise<Reply> {
    const id = this.nextId++;
    if (this.idleTimer) clearTimeout(this.idleTimer);
    this.idleTimer = null;
    return new Promise((resolve, reject) => {
      this.pending.set(id, { resolve, reject });
      this.thread().postMessage({ ...job, id });
    });
  }

  /** Sends a message that gets no reply. Dropped when the thread is not running (it holds no state then). */
  tell(message: object): void {
    this.worker?.postMessage(message);
  }

  /** Stops the thread; jobs in flight are rejected (their callers must not wait for a thread that is gone). */
  async stop(): Promise<void> {
    const w = this.worker;
    this.worker = null;
    if (this.idleTimer) clearTimeout(this.idleTimer);
    this.idleTimer = null;
    this.onRestart();
    const stopped = new Error('the worker thread was stopped');
    for (const p of this.pending.values()) p.reject(stopped);
    this.pending.clear();
    if (w) await w.terminate();
  }

  private thread(): Worker {
    if (this.worker) return this.worker;
    const w = startTsWorker(this.moduleUrl);
    w.on('message', (reply: Reply & { id: number }) => {
      this.pending.get(reply.id)?.resolve(reply);
      this.pending.delete(reply.id);
      if (this.pending.size === 0) this.armIdle();
    });
    const fail = (err: Error) => {
      if (this.worker !== w) return;
      this.worker = null;
      this.onRestart();
      for (const p of this.pending.values()) p.reject(err);
      this.pending.clear();
    };
    w.on('error', fail);
    w.on('exit', (code) => fail(new Error(`the worker thread stopped (exit ${code})`)));
    this.worker = w;
    return w;
  }

  private armIdle(): void {
    if (this.idleTimer) clearTimeout(this.idleTimer);
    this.idleTimer = setTimeout(() => void this.stop(), this.idleMs);
    this.idleTimer.unref();
  }
}
