/**
 * The timing of a debounce with an upper bound: work is due `delayMs` after the last change, but no
 * later than `maxWaitMs` after the first change not yet taken up. Holds no timer — the owner asks
 * `untilDue()` and arms its own — so it can be driven by any clock.
 */
export class DebounceWindow {
  private firstAt: number | null = null;
  private lastAt = 0;

  constructor(
    private readonly delayMs: number,
    private readonly maxWaitMs: number,
    private readonly now: () => number = () => performance.now(),
  ) {}

  /** Something changed. */
  note(): void {
    this.lastAt = this.now();
    this.firstAt ??= this.lastAt;
  }

  /** The work starts now and covers every change noted so far. */
  take(): void {
    this.firstAt = null;
  }

  /** Milliseconds until the work for the waiting changes is due (0: due now, or nothing waits). */
  untilDue(): number {
    if (this.firstAt === null) return 0;
    const due = Math.min(this.lastAt + this.delayMs, this.firstAt + this.maxWaitMs);
    return Math.max(0, due - this.now());
  }
}
