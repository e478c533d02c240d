import type { Mapping } from '../../src/shared/chem';
import { evaluateDraft, type EvaluationInputs, type EvaluationResult } from '../mappings/evaluate-draft';
import { evaluateInThread, forgetInputs } from '../mappings/evaluation-thread';

/**
 * Keeps one room's evaluation current without holding up its sockets.
 *
 * Every change to the draft or its inputs bumps `revision` through `changed()`. At most
 * `delayMs` later the draft is evaluated in the evaluation thread (one job in flight per room;
 * changes meanwhile are folded into the next job) and `publish` sends each result to the room, so
 * numbers keep arriving during a long burst of edits.
 * A caller that needs the result now (a page load, a new peer) gets the last result when it is
 * current, else one computed on the spot.
 */
export class RoomEvaluator {
  private revision = 0;
  private resultRevision = -1;
  private publishedRevision = -1;
  private result: EvaluationResult | null = null;
  private timer: NodeJS.Timeout | null = null;
  private running = false;
  private stamp = 0;
  private closed = false;

  constructor(
    private inputs: EvaluationInputs,
    private readonly draft: () => Mapping,
    private readonly publish: (result: EvaluationResult) => void,
    private readonly onFailure: (err: unknown) => void,
    private readonly delayMs: number,
  ) {}

  /** The draft or (with `inputs`) the molecule, coordinates, library, resolution or lock changed. */
  changed(inputs?: EvaluationInputs): void {
    if (this.closed) return;
    if (inputs) {
      this.inputs = inputs;
      this.stamp++;
    }
    this.revision++;
    if (!this.timer && !this.running) this.timer = setTimeout(() => void this.run(), this.delayMs);
  }

  current(): EvaluationResult {
    if (!this.result || this.resultRevision < this.revision) {
      this.result = evaluateDraft(this.inputs, this.draft());
      this.resultRevision = this.revision;
    }
    return this.result;
  }

  close(): void {
    this.closed = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    forgetInputs(this.inputs.mappingId);
  }

  private async run(): Promise<void> {
    this.timer = null;
    this.running = true;
    try {
      while (!this.closed && this.publishedRevision < this.revision) {
        const revision = this.revision;
        const result = await evaluateInThread(this.inputs, this.stamp, this.draft());
        if (this.closed) return;
        // A result computed on the spot meanwhile (current()) may be newer: keep and send the newest.
        if (revision >= this.resultRevision) {
          this.result = result;
          this.resultRevision = revision;
        }
        if (this.publishedRevision < this.resultRevision) {
          this.publishedRevision = this.resultRevision;
          this.publish(this.result!);
        }
      }
    } catch (err) {
      // The thread failed (it restarts on the next job): evaluate here so the room still gets numbers.
      this.onFailure(err);
      if (!this.closed) {
        this.publish(this.current());
        this.publishedRevision = this.resultRevision;
      }
    } finally {
      this.running = false;
    }
  }
}
