import * as Y from 'yjs';
import type { DraftStorage } from './draft-storage';

/**
 * Folds a room's stored updates into the snapshot. It runs beside the room's queue, not on it: it
 * folds the document as it is at that moment, whose updates are exactly those up to `lastUpdateId`,
 * so updates stored meanwhile are simply left for the next compaction. Compactions run one after
 * another, never two at once, and never reject: a failure is reported and loses nothing (the updates
 * stay stored).
 */
export class Compactor {
  private compaction: Promise<void> = Promise.resolve();
  /** Set when the document may lack stored updates (a relay gap): folding it would drop them. */
  blocked = false;

  constructor(
    private readonly mappingId: number,
    private readonly doc: Y.Doc,
    private readonly storage: DraftStorage,
    /** Sequence number of the last stored update the document holds. */
    public lastUpdateId: number,
    /** Stored updates not yet in the snapshot. */
    public uncompacted: number,
    private readonly onError: (err: unknown) => void,
  ) {}

  /** `count` updates up to `lastUpdateId` were stored and applied. */
  stored(lastUpdateId: number, count: number): void {
    this.lastUpdateId = lastUpdateId;
    this.uncompacted += count;
  }

  compact(): Promise<void> {
    const next = this.compaction.then(async () => {
      if (this.uncompacted === 0 || this.blocked) return;
      const upTo = this.lastUpdateId;
      const folded = this.uncompacted;
      await this.storage.compact(this.mappingId, Y.encodeStateAsUpdate(this.doc), upTo);
      this.uncompacted -= folded;
    });
    this.compaction = next.catch(this.onError);
    return this.compaction;
  }
}
