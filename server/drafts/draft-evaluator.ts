import type { Mapping } from '../../src/shared/chem';
import type { EvaluationInputs, EvaluationResult } from './evaluate-draft';
import { DebounceWindow } from './debounce-window';

/** Where evaluations run (evaluation-thread.ts: `threadEvaluation`). */
export interface EvaluationService {
  /** Evaluates a live room's draft; `stamp` changes whenever `inputs` do. */
  evaluate(inputs: EvaluationInputs, stamp: number, draft: Mapping): Promise<EvaluationResult>;
  /** The room closed: its inputs may be dropped. */
  forget(mappingId: number): void;
}

/**
 * Keeps one room's evaluation current without holding up its sockets. Every evaluation runs in the
 * evaluation thread; the main thread never loads the chemistry libraries.
 *
 * Every change to the draft or its inputs bumps `revision` through `changed()`. Evaluation is
 * debounced: it starts `delayMs` after the last change, but never later than `maxWaitMs` after the
 * first change it has not yet covered, so during a long burst of edits (several people working at
 * once) numbers still arrive every `maxWaitMs` while the draft is evaluated — and sent to every peer —
 * far less often than it is edited. One job runs per room at a time; changes meanwhile go into the
 * next. `publish` sends each result to the room. A caller that needs the result of the draft as it is
 * now (a page load) awaits `current()`; a new peer gets `latest()` at once and any newer result when
 * it is published.
 */
export class DraftEvaluator {
  private revision = 0;
  private resultRevision = -1;
  private publishedRevision = -1;
  private result: EvaluationResult | null = null;
  private timer: NodeJS.Timeout | null = null;
  private running = false;
  private readonly window: DebounceWindow;
  private stamp = 0;
  private closed = false;
  /** Set while another server holds the lease: evaluate here if its result has not come by then. */
  private fallback: NodeJS.Timeout | null = null;

  constructor(
    private inputs: EvaluationInputs,
    private readonly draft: () => Mapping,
    private readonly publish: (result: EvaluationResult, revision: number) => void,
    private readonly onFailure: (err: unknown) => void,
    private readonly service: EvaluationService,
    delayMs: number,
    maxWaitMs: number,
    /** Several servers (evaluation-lease.ts): evaluate edits only while holding the mapping's lease. */
    private readonly lease?: { ttlMs: number; acquire(): Promise<boolean> },
  ) {
    this.window = new DebounceWindow(delayMs, maxWaitMs);
  }

  /** The draft or (with `inputs`) the molecule, coordinates, library, resolution or lock changed. */
  changed(inputs?: EvaluationInputs): void {
    if (this.closed) return;
    if (inputs) {
      this.inputs = inputs;
      this.stamp++;
    }
    this.revision++;
    this.noteChange();
  }

  /** Evaluates the draft once now that the room opened; published to everyone in it. */
  start(): void {
    this.noteChange();
  }

  /** The newest result, possibly of an older draft (a newer one is then on its way), or null before the first. */
  latest(): EvaluationResult | null {
    return this.result;
  }

  /** The result for the draft as it is at the moment of the call. */
  async current(): Promise<EvaluationResult> {
    if (this.result && this.resultRevision >= this.revision) return this.result;
    const revision = this.revision;
    const result = await this.evaluate(this.draft());
    this.keep(result, revision);
    return result;
  }

  /**
   * A result another server (the lease holder) computed and relayed: the newest for peers (latest()),
   * not taken as current() for this server's revision, which may hold updates the holder has not had yet.
   */
  adopt(result: EvaluationResult): void {
    if (this.closed) return;
    this.result = result;
    if (this.fallback) clearTimeout(this.fallback);
    this.fallback = null;
  }

  close(): void {
    this.closed = true;
    if (this.timer) clearTimeout(this.timer);
    if (this.fallback) clearTimeout(this.fallback);
    this.timer = null;
    this.service.forget(this.inputs.mappingId);
  }

  private noteChange(): void {
    if (this.closed) return;
    this.window.note();
    if (this.running) return; // the running loop takes it up
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.run(), this.window.untilDue());
  }

  /** A result computed by current() meanwhile may be newer than the one arriving: keep the newest. */
  private keep(result: EvaluationResult, revision: number): void {
    if (revision >= this.resultRevision) {
      this.result = result;
      this.resultRevision = revision;
    }
  }

  /** In the thread; a failed thread restarts on the next job, so one failure is retried once. */
  private async evaluate(draft: Mapping): Promise<EvaluationResult> {
    try {
      return await this.service.evaluate(this.inputs, this.stamp, draft);
    } catch (err) {
      if (this.closed) throw err;
      this.onFailure(err);
      return this.service.evaluate(this.inputs, this.stamp, draft);
    }
  }

  /** Another server evaluates; if no result of its arrives within its lease, ask again (it may be gone). */
  private awaitHolder(): void {
    if (this.fallback || !this.lease) return;
    this.fallback = setTimeout(() => {
      this.fallback = null;
      if (this.closed) return;
      this.revision++;
      this.noteChange();
    }, this.lease.ttlMs * 1.5);
    this.fallback.unref();
  }

  private async run(): Promise<void> {
    this.timer = null;
    this.running = true;
    try {
      while (!this.closed && this.publishedRevision < this.revision) {
        // Changes made while the last job ran: wait for their debounce (it moves while edits go on).
        for (let wait = this.window.untilDue(); wait > 0 && !this.closed; wait = this.window.untilDue()) await sleep(wait);
        if (this.closed) return;
        this.window.take();
        const revision = this.revision;
        // The room's first evaluation is its own (its peers need numbers at once); edits are
        // evaluated by the lease holder only.
        if (this.lease && revision > 0 && !(await this.lease.acquire())) {
          this.publishedRevision = revision;
          this.awaitHolder();
          continue;
        }
        this.keep(await this.evaluate(this.draft()), revision);
        if (this.closed) return;
        if (this.publishedRevision < this.resultRevision) {
          this.publishedRevision = this.resultRevision;
          this.publish(this.result!, this.resultRevision);
        }
      }
    } catch (err) {
      // Failed twice: say so to the room rather than leave old numbers standing as if current.
      if (!this.closed) {
        this.onFailure(err);
        this.publish(unavailable(), this.revision);
        this.publishedRevision = this.revision;
      }
    } finally {
      this.running = false;
    }
  }
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

function unavailable(): EvaluationResult {
  return {
    evaluation: null,
    error: { code: 'evaluation_unavailable', message: 'The server could not evaluate this draft just now; the next change tries again.' },
    evaluatedAt: new Date().toISOString(),
  };
}
