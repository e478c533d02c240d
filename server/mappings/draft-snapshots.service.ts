import * as Y from 'yjs';
import type { Db } from '../db/knex';

// Writes the mapping_snapshots table: here rather than in server/drafts because creating a mapping
// writes its first snapshot, and the live-draft module builds on mappings (folders depend one way).

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

/**
 * Compaction when several servers hold the mapping (REDIS_URL set): a server's document may lack
 * updates another server stored a moment ago, and another server may have compacted further already.
 * So the new snapshot is the union of the stored snapshot, this server's state and every stored update
 * it folds (Yjs merges are idempotent), under a lock on the snapshot row so two servers' compactions of
 * one mapping run one after the other. Nothing stored is dropped without being in the snapshot.
 */
export async function foldSnapshot(db: Db, mappingId: number, state: Uint8Array, lastUpdateId: number): Promise<void> {
  await db.transaction(async (trx) => {
    const old = await trx('mapping_snapshots').where({ mapping_id: mappingId }).forUpdate().first('state', 'last_update_id');
    const upTo = Math.max(lastUpdateId, old ? Number(old.last_update_id) : 0);
    const rows: { data: Uint8Array }[] = await trx('mapping_updates').where('mapping_id', mappingId).andWhere('id', '<=', upTo).select('data');
    const merged = Y.mergeUpdates([...(old ? [old.state as Uint8Array] : []), state, ...rows.map((r) => r.data)]);
    await trx('mapping_snapshots')
      .insert({ mapping_id: mappingId, state: Buffer.from(merged), last_update_id: upTo, updated_at: trx.fn.now() })
      .onConflict('mapping_id')
      .merge();
    await trx('mapping_updates').where('mapping_id', mappingId).andWhere('id', '<=', upTo).delete();
  }, { isolationLevel: 'read committed' });
}
