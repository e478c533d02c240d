/** How often at most a room rewrites its mapping row's "updated" time while the bead count stays the same. */
export const TOUCH_EVERY_MS = 2_000;

/**
 * Keeps the mapping row's bead count and "updated" time current for lists: written at once when the
 * bead count changed, else at most every TOUCH_EVERY_MS (a trailing write records the last edit).
 */
export class RowTouch {
  private beads = -1;
  private writtenBeads = -1;
  private writtenAt = 0;
  private timer: NodeJS.Timeout | null = null;

  constructor(private readonly write: (beads: number) => Promise<void>, private readonly onError: (err: unknown) => void) {}

  edited(beads: number): void {
    this.beads = beads;
    const wait = beads !== this.writtenBeads ? 0 : Math.max(0, this.writtenAt + TOUCH_EVERY_MS - Date.now());
    if (this.timer && wait > 0) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => this.flush(), wait);
  }

  /** Writes a waiting change now (the room is closing). */
  close(): void {
    if (this.timer) this.flush();
  }

  private flush(): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    this.writtenBeads = this.beads;
    this.writtenAt = Date.now();
    void this.write(this.beads).catch(this.onError);
  }
}
