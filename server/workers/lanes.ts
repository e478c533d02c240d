import { JobThread, type JobThreadOptions } from './job-thread';

/**
 * Two worker threads for one kind of chemistry job, so a small job is never queued behind a big one:
 * big jobs run only in the `large` lane; small jobs run in the `small` lane, or in the `large` one
 * when that is idle and the small one is not. Each lane runs one job at a time under the job time
 * limit, and stops when idle like any JobThread.
 */
export class Lanes<Job extends object, Reply extends object> {
  readonly small: JobThread<Job, Reply>;
  readonly large: JobThread<Job, Reply>;

  constructor(moduleUrl: URL, options: JobThreadOptions) {
    this.small = new JobThread(moduleUrl, options);
    this.large = new JobThread(moduleUrl, options);
  }

  /** The lane a job of this size goes to now. */
  pick(big: boolean): JobThread<Job, Reply> {
    if (big) return this.large;
    return this.small.busy && this.large.load === 0 ? this.large : this.small;
  }

  async stop(): Promise<void> {
    await Promise.all([this.small.stop(), this.large.stop()]);
  }
}
