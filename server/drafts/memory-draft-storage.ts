import * as Y from 'yjs';
import { applyChecked } from '../../src/shared/mapping-doc-check';
import type { DraftStorage, NewUpdate, StoredDraft } from './draft-storage';

/**
 * Drafts kept in memory, for unit tests of the room without a database. Same contract as MariaDB's
 * (draft-storage.ts). Loading applies the stored updates with the live checks; a refused one is an
 * error here (only the room stores, and it stores nothing it refused), where MariaDB's loader skips
 * rows written before the checks existed.
 * `beforeAppend` runs at the start of every append (a test slows it down or makes it fail there).
 */
export class MemoryDraftStorage implements DraftStorage {
  readonly updates: { seq: number; mappingId: number; userId: number | null; data: Uint8Array }[] = [];
  readonly snapshots = new Map<number, { state: Uint8Array; upTo: number }>();
  readonly touched: { mappingId: number; beadCount: number }[] = [];
  beforeAppend: ((mappingId: number, updates: NewUpdate[]) => Promise<void> | void) | null = null;
  private seq = 0;

  async load(mappingId: number, atomCount: number): Promise<StoredDraft> {
    const snap = this.snapshots.get(mappingId);
    const doc = new Y.Doc();
    if (snap) Y.applyUpdate(doc, snap.state);
    const rows = this.updates.filter((u) => u.mappingId === mappingId && u.seq > (snap?.upTo ?? 0));
    for (const row of rows) if (applyChecked(doc, row.data, atomCount) !== null) throw new Error(`stored update ${row.seq} is refused`);
    return { doc, lastUpdateId: rows.at(-1)?.seq ?? snap?.upTo ?? 0, pending: rows.length };
  }

  async append(mappingId: number, updates: NewUpdate[]): Promise<number> {
    await this.beforeAppend?.(mappingId, updates);
    for (const u of updates) this.updates.push({ seq: ++this.seq, mappingId, userId: u.userId, data: u.data });
    return this.seq;
  }

  async compact(mappingId: number, state: Uint8Array, upTo: number): Promise<void> {
    this.snapshots.set(mappingId, { state, upTo });
    this.updates.splice(0, this.updates.length, ...this.updates.filter((u) => u.mappingId !== mappingId || u.seq > upTo));
  }

  async touch(mappingId: number, beadCount: number): Promise<void> {
    this.touched.push({ mappingId, beadCount });
  }

  async close(): Promise<void> {}
}
