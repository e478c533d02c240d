import type { Db } from '../db/knex';
import type { AppContext } from '../context';
import type { LockState } from '../../src/shared/versions';
import { conflict, unprocessable } from '../http/errors';
import { appendAudit } from '../audit/audit.service';
import type { Rooms } from '../drafts/rooms';

// The production lock. `mapping_locks` has one row per locked mapping (its primary key), so when two
// supervisors lock at once exactly one INSERT succeeds and the other answers 409. The lock is taken on
// the live room's queue when the mapping is open, so no edit slips in between the lock and the room
// learning of it; the room then tells every connection that the draft is read-only. The change is also
// published as an access change (auth/access-changes.ts), for rooms this call cannot reach itself
// (on another app server, once there is a relay).

export async function lockState(db: Db, mappingId: number): Promise<LockState> {
  const row = await db('mapping_locks as l')
    .join('mapping_versions as v', 'v.id', 'l.version_id')
    .leftJoin('users as u', 'u.id', 'l.locked_by')
    .where('l.mapping_id', mappingId)
    .first('v.number', 'l.locked_by', 'u.display_name', 'l.locked_at', 'l.note');
  if (!row) return { locked: false, version: null, lockedBy: null, lockedAt: null, note: '' };
  return {
    locked: true,
    version: row.number,
    lockedBy: row.locked_by ? { id: row.locked_by, displayName: row.display_name } : null,
    lockedAt: new Date(row.locked_at).toISOString(),
    note: row.note,
  };
}

async function onRoomQueue<T>(rooms: Rooms, mappingId: number, work: () => Promise<T>): Promise<T> {
  const room = await rooms.live(mappingId);
  if (!room) return work();
  return room.serial(async () => {
    const out = await work();
    await room.refresh();
    return out;
  });
}

export async function lockVersion(ctx: AppContext, rooms: Rooms, mappingId: number, number: number, actorId: number, note: string): Promise<LockState> {
  const { db } = ctx;
  const version = await db('mapping_versions').where({ mapping_id: mappingId, number }).first('id');
  if (!version) throw unprocessable('unknown_version', `This mapping has no version ${number}.`, { version: number });
  await onRoomQueue(rooms, mappingId, () =>
    db.transaction(async (trx) => {
      // The mapping's row lock first: the lock row's foreign key would otherwise take a shared lock on
      // it, and two lockers upgrading to the UPDATE below would deadlock instead of one getting a 409.
      await trx('mappings').where({ id: mappingId }).forUpdate().first('id');
      await trx('mapping_locks')
        .insert({ mapping_id: mappingId, version_id: version.id, locked_by: actorId, note })
        .catch((err: { code?: string }) => {
          if (err.code === 'ER_DUP_ENTRY') throw conflict('already_locked', 'This mapping already has a locked production version; unlock it first.');
          throw err;
        });
      await trx('mappings').where({ id: mappingId }).update({ locked: true });
      await appendAudit(trx, { mappingId, action: 'lock', actorId, version: number, reason: note });
    }),
  );
  ctx.accessChanges.publish({ kind: 'lock', mappingId });
  return lockState(db, mappingId);
}

export async function unlockMapping(ctx: AppContext, rooms: Rooms, mappingId: number, actorId: number, reason: string): Promise<LockState> {
  const { db } = ctx;
  await onRoomQueue(rooms, mappingId, () =>
    db.transaction(async (trx) => {
      await trx('mappings').where({ id: mappingId }).forUpdate().first('id');
      const lock = await trx('mapping_locks as l').join('mapping_versions as v', 'v.id', 'l.version_id').where('l.mapping_id', mappingId).forUpdate().first('v.number');
      if (!lock) throw conflict('not_locked', 'This mapping is not locked.');
      await trx('mapping_locks').where({ mapping_id: mappingId }).delete();
      await trx('mappings').where({ id: mappingId }).update({ locked: false });
      await appendAudit(trx, { mappingId, action: 'unlock', actorId, version: lock.number, reason });
    }),
  );
  ctx.accessChanges.publish({ kind: 'lock', mappingId });
  return lockState(db, mappingId);
}
