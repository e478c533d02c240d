/**
 * Who may use a collaboration socket, decided by the permission module (through mapping-access.ts)
 * at the upgrade and again whenever access changes while the socket is open:
 *   no signed-in account          → 401 at the upgrade; close 4401 (CLOSE_UNAUTHENTICATED) later
 *   mapping unknown or invisible  → 404 at the upgrade; close 4404 (CLOSE_NOT_FOUND) later
 *   no 'mapping:edit' (students)  → read-only (the lock, the mapping's own state, is checked per message)
 * `followAccessChanges` routes each published change (auth/access-changes.ts) to the connections it
 * concerns, which then ask `redecide`.
 */
import type { Db } from '../db/knex';
import type { ProjectRole } from '../../src/shared/roles';
import type { AccessChange, AccessChanges } from '../auth/access-changes';
import { sessionUser } from '../auth/passport';
import { mappingAccess } from '../mappings/mapping-access';
import type { DraftRoom } from './draft-room';
import type { Peer } from './peer';

export type CollabDecision = { status: 401 } | { status: 404 } | { status: 200; user: Express.User; projectId: number; role: ProjectRole | null; roleReadOnly: boolean };

export async function decide(db: Db, user: Express.User | null | undefined, mappingId: number): Promise<CollabDecision> {
  if (!user) return { status: 401 };
  const access = await mappingAccess(db, user, mappingId);
  if (!access) return { status: 404 };
  return { status: 200, user, projectId: access.projectId, role: access.role, roleReadOnly: !access.canEdit };
}

/** The session a socket was opened with, as the socket knows it. */
export interface SocketSession {
  userId: number;
  sessionVersion: number;
  signedOut: boolean;
}

/** Decides again for an open socket: the session's account as it is now (the rule of every request), then the mapping. */
export async function redecide(db: Db, session: SocketSession, mappingId: number): Promise<CollabDecision> {
  const user = session.signedOut ? null : await sessionUser(db, { id: session.userId, v: session.sessionVersion });
  return decide(db, user, mappingId);
}

/** An open connection, from its upgrade on (before its room has even loaded). */
export interface OpenConnection {
  peer: Peer;
  projectId: number;
}

function concerns(change: AccessChange, { peer, projectId }: OpenConnection): boolean {
  switch (change.kind) {
    case 'membership':
      return projectId === change.projectId && peer.userId === change.userId;
    case 'account':
      return peer.userId === change.userId;
    case 'signed_out':
      return peer.sessionId === change.sessionId;
    case 'lock':
      return false; // the room re-reads its lock; connections follow it per message
    case 'resync':
      return true;
  }
}

/** Routes access changes to the open connections and rooms they concern; returns the unsubscribe function. */
export function followAccessChanges(changes: AccessChanges, connections: () => Iterable<OpenConnection>, rooms: () => Promise<DraftRoom[]>, onError: (err: unknown) => void): () => void {
  return changes.subscribe((change) => {
    if (change.kind === 'lock' || change.kind === 'resync') {
      rooms().then((open) => {
        for (const room of open) if (change.kind === 'resync' || room.id === change.mappingId) room.serial(() => room.recheckLock()).catch(onError);
      }, onError);
      if (change.kind === 'lock') return;
    }
    for (const c of connections()) if (concerns(change, c)) c.peer.reconsider(change);
  });
}
