/**
 * Which stored updates of one mapping a room has: everything up to `floor` (what it loaded, or caught
 * up to) and the sequence numbers it saw after that. A relayed update names the update its publisher
 * had stored just before it (`prevSeq`); when this room does not have that one, a message was lost
 * here. With several servers writing one mapping, sequence numbers arrive out of numeric order (two
 * servers' updates stored at once), so "have I seen it" is asked, not "is it the last one + 1".
 * The set is trimmed to the newest `keep` numbers; older ones count as seen (they are long applied).
 */
export class SeenSequence {
  private readonly seen = new Set<number>();

  constructor(
    private floor: number,
    private readonly keep = 1024,
  ) {}

  has(seq: number): boolean {
    return seq <= this.floor || this.seen.has(seq);
  }

  note(seq: number): void {
    if (seq <= this.floor) return;
    this.seen.add(seq);
    if (this.seen.size <= this.keep) return;
    const sorted = [...this.seen].sort((a, b) => a - b);
    const drop = sorted.slice(0, sorted.length - this.keep / 2);
    this.floor = drop[drop.length - 1];
    for (const s of drop) this.seen.delete(s);
  }

  /** Everything up to `seq` is now in the document (a catch-up from storage). */
  raise(seq: number): void {
    if (seq <= this.floor) return;
    this.floor = seq;
    for (const s of this.seen) if (s <= seq) this.seen.delete(s);
  }
}
