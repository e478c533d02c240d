import type * as Y from 'yjs';

/**
 * Where a live draft is kept: an append-only log of accepted Yjs updates and one compacted snapshot
 * per mapping. The room asks nothing else of storage, so its ordering can be tested with the in-memory
 * implementation (memory-draft-storage.ts) and served with MariaDB (mariadb-draft-storage.ts).
 *
 * Contract of `append`: the updates are stored, in the order given, before the promise resolves, and
 * it resolves with the sequence number of the last one; the others have the numbers just before it.
 * Sequence numbers only grow (they are shared by all mappings, so one mapping's may skip). A rejected
 * append stored nothing of the batch.
 */
export interface DraftStorage {
  /** The stored draft; `atomCount` (the molecule's atoms) is needed for the checks made while loading. */
  load(mappingId: number, atomCount: number): Promise<StoredDraft>;
  append(mappingId: number, updates: NewUpdate[]): Promise<number>;
  /** Stores `state` as the snapshot holding every update up to `upTo`, and drops those updates. */
  compact(mappingId: number, state: Uint8Array, upTo: number): Promise<void>;
  /** Keeps the mapping's listed bead count and "updated" time current. */
  touch(mappingId: number, beadCount: number): Promise<void>;
  close(): Promise<void>;
}

export interface StoredDraft {
  doc: Y.Doc;
  /** Sequence number of the last update contained in `doc` (0 when none). */
  lastUpdateId: number;
  /** Updates stored after the snapshot. */
  pending: number;
}

export interface NewUpdate {
  userId: number | null;
  data: Uint8Array;
}
