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
