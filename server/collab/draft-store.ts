import * as Y from 'yjs';
import type { Db } from '../db/knex';

// Storage of mapping drafts in MariaDB: an append-only table of accepted Yjs updates
// (mapping_updates, written by update-log.ts) and one compacted snapshot per mapping (mapping_snapshots). The draft is the
// snapshot with every later update applied, in id order. Compaction writes the merged state and
// deletes the updates it contains, in one transaction, so a crash at any point loses nothing.

export interface StoredDraft {
  doc: Y.Doc;
  /** Id of the last update contained in `doc` (0 when none). */
  lastUpdateId: number;
  /** Updates stored after the snapshot. */
  pending: number;
}

export interface NewUpdate {
  userId: number | null;
  data: Uint8Array;
}

export async function loadDraft(db: Db, mappingId: number): Promise<StoredDraft> {
  const doc = new Y.Doc({ gc: true });
  const snap = await db('mapping_snapshots').where({ mapping_id: mappingId }).first('state', 'last_update_id');
  let lastUpdateId = snap ? Number(snap.last_update_id) : 0;
  const updates: Uint8Array[] = snap ? [snap.state] : [];
  const rows = await db('mapping_updates').where('mapping_id', mappingId).andWhere('id', '>', lastUpdateId).orderBy('id').select('id', 'data');
  for (const r of rows) updates.push(r.data);
  if (rows.length) lastUpdateId = Number(rows[rows.length - 1].id);
  if (updates.length) Y.applyUpdate(doc, Y.mergeUpdates(updates));
  return { doc, lastUpdateId, pending: rows.length };
}

/**
 * Stores `state` as the snapshot holding every update up to `lastUpdateId`, and drops those updates.
 * READ COMMITTED: the DELETE then locks only the rows it removes, not the gap after them, so a live
 * room's appends of newer updates (update-log.ts) never wait for a compaction.
 */
export async function writeSnapshot(db: Db, mappingId: number, state: Uint8Array, lastUpdateId: number): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('mapping_snapshots')
      .insert({ mapping_id: mappingId, state: Buffer.from(state), last_update_id: lastUpdateId, updated_at: trx.fn.now() })
      .onConflict('mapping_id')
      .merge();
    await trx('mapping_updates').where('mapping_id', mappingId).andWhere('id', '<=', lastUpdateId).delete();
  }, { isolationLevel: 'read committed' });
}

export async function compactDoc(db: Db, mappingId: number, doc: Y.Doc, lastUpdateId: number): Promise<void> {
  await writeSnapshot(db, mappingId, Y.encodeStateAsUpdate(doc), lastUpdateId);
}
