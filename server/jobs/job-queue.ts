import type { OutgoingMail } from '../mail/mailer';

// Work a request starts but does not wait for: today, notification e-mail. Routes and services only
// `enqueue()`; where and when a job runs is the queue's business. The in-process queue
// (in-process-queue.ts) runs each job after the response of the request that enqueued it has been
// sent; a BullMQ queue with a worker process (the scale-out issue) implements the same interface, and
// nothing that enqueues changes. Jobs are plain data (JSON), so they can cross a process boundary.

export type Job = { kind: 'mail'; mail: OutgoingMail; /** For the log when sending fails. */ about: string };

export interface JobQueue {
  /** Accepts a job; never throws because the job later fails (failures are logged where it runs). */
  enqueue(job: Job): void;
  /** Resolves once every job accepted so far has run (tests wait on this, and shutdown). */
  idle(): Promise<void>;
}
