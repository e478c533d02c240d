import type { Db } from '../db/knex';
import type { Rooms } from '../drafts/rooms';
import { notFound } from '../http/errors';
import { appendAudit } from '../audit/audit.service';
import { assertUnlocked, mappingsWithMolecule } from '../mappings/mappings.service';
import { contentSha256 } from './content-hash';
import { getVersion, insertVersion, latestVersionHash } from './versions.service';

export interface RestoreResult {
  restored: number;
  /** The version that now keeps the draft as it was before the restore; null when the newest version already did. */
  snapshot: number | null;
}

// Restore puts a version's beads back into the draft. The server applies it to the live room's
// document as one Yjs transaction (opening the room from MariaDB when nobody is connected), so every
// connected editor sees the whole restore at once and it is stored like any other accepted update.
//
// Nothing is lost by it. On the room's queue, so no edit, save-by-lock or other restore comes in
// between: first, in a MariaDB transaction holding the mapping's row lock, the draft as it is then is
// saved as a version "before restore of vN" unless it equals the newest version (same content hash);
// then the restore's update is stored and applied; then the audit entry. The snapshot commits before
// the update is stored because the update log's own connection needs the mapping row (its foreign
// key) that the transaction holds; if storing the restore then fails, the draft is unchanged and the
// snapshot is simply a correct save of it.
export async function restoreVersion(db: Db, rooms: Rooms, mappingId: number, number: number, actorId: number, undoFor?: number): Promise<RestoreResult> {
  const version = await getVersion(db, mappingId, number);
  await assertUnlocked(db, mappingId);
  const room = await rooms.open(mappingId);
  if (!room) throw notFound('That mapping');
  let snapshot: number | null = null;
  try {
    await room.replaceDraft(
      version.draft,
      actorId,
      async (current, replace) => {
        const evaluated = room.snapshot().result;
        snapshot = await db.transaction(async (trx) => {
          const mapping = await mappingsWithMolecule(trx).where('p.id', mappingId).forUpdate().first('m.canonical_smiles');
          if (!mapping) throw notFound('That mapping');
          await assertUnlocked(trx, mappingId);
          if (contentSha256(mapping.canonical_smiles, current) === (await latestVersionHash(trx, mappingId))) return null;
          return insertVersion(trx, mappingId, actorId, `before restore of v${number}`, current, await evaluated);
        });
        await replace();
        await appendAudit(db, { mappingId, action: 'restore', actorId, version: number });
      },
      undoFor,
    );
  } finally {
    await room.releaseIfIdle();
  }
  return { restored: number, snapshot };
}
