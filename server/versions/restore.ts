import type { Db } from '../db/knex';
import type { Rooms } from '../collab/rooms';
import { notFound } from '../http/errors';
import { appendAudit } from '../audit/audit.service';
import { assertUnlocked } from '../lock/lock.service';
import { getVersion } from './versions.service';

// Restore puts a version's beads back into the draft. The server applies it to the live room's
// document as one Yjs transaction (opening the room from MariaDB when nobody is connected), so every
// connected editor sees the whole restore at once and it is stored like any other accepted update.
export async function restoreVersion(db: Db, rooms: Rooms, mappingId: number, number: number, actorId: number): Promise<void> {
  const version = await getVersion(db, mappingId, number);
  await assertUnlocked(db, mappingId);
  const room = await rooms.open(mappingId);
  if (!room) throw notFound('That mapping');
  try {
    await room.replaceDraft(version.draft, actorId, () => assertUnlocked(db, mappingId));
    await appendAudit(db, { mappingId, action: 'restore', actorId, version: number });
  } finally {
    await room.releaseIfIdle();
  }
}
