/**
 * One WebSocket on /collab/:mappingId: decodes frames (see src/shared/collab-protocol.ts) and hands
 * them to the room. Frames are handled one at a time, in arrival order, and only after the room has
 * loaded the draft from MariaDB, so the first sync step 1 is answered with the stored state.
 * Read-only connections (students, locked mappings) may ask (sync step 1) but their step 2 and update
 * messages are dropped; awareness flows for everyone, stamped with the account's identity
 * (awareness-stamp.ts). A frame that cannot be decoded closes this connection only. Keep-alive: a ping
 * every `pingIntervalMs`; no pong by the next one ends the socket.
 * When access changes (collab-access.ts) the connection decides again: it turns read-only or back,
 * or closes with 4401 (signed out, account disabled) or 4404 (no longer a member); from the moment
 * it decided to close, nothing it sends is used.
 */
import { randomUUID } from 'node:crypto';
import type { WebSocket } from 'ws';
import { applyAwarenessUpdate, encodeAwarenessUpdate } from 'y-protocols/awareness';
import { CLOSE_MALFORMED, CLOSE_NOT_FOUND, CLOSE_TRY_AGAIN, CLOSE_UNAUTHENTICATED, type CollabErrorMessage, type SessionMessage } from '../../src/shared/collab-protocol';
import type { DraftRoom } from './draft-room';
import type { Peer } from './peer';
import type { CollabDecision } from './collab-access';
import { stampAwareness } from './awareness-stamp';
import { MalformedFrame, awarenessFrame, decodeFrame, errorFrame, sessionFrame, syncStep1Frame, syncStep2Frame } from './frames';

export interface ConnectionInfo {
  userId: number;
  displayName: string;
  /** The session the socket was opened with. */
  sessionId: string | null;
  session: Omit<SessionMessage, 'readOnly' | 'readOnlyReason'>;
  /** True when the role may not edit (the lock is checked per message, it may change). */
  roleReadOnly: boolean;
  /** Decides again whether and how this connection may go on (collab-access.ts `redecide`). */
  redecide(signedOut: boolean): Promise<CollabDecision>;
}

export function serveConnection(ws: WebSocket, info: ConnectionInfo, openRoom: () => Promise<DraftRoom | null>, pingIntervalMs: number): Peer {
  let room: DraftRoom | null = null;
  let alive = true;
  let warnedReadOnly = false;
  /** Set once the connection is being closed for lost access: every later frame is ignored. */
  let revoked = false;
  let signedOut = false;
  let decisions = 0;
  const revoke = (code: number, reason: string) => {
    revoked = true;
    ws.close(code, reason);
  };
  const peer: Peer = {
    id: randomUUID(),
    userId: info.userId,
    sessionId: info.sessionId,
    controlled: new Set(),
    send(frame) {
      if (ws.readyState === ws.OPEN) ws.send(frame);
    },
    sendError(error: CollabErrorMessage) {
      peer.send(errorFrame(error));
    },
    fail(reason) {
      ws.close(CLOSE_MALFORMED, reason.slice(0, 120));
    },
    retry(reason) {
      ws.close(CLOSE_TRY_AGAIN, reason.slice(0, 120));
    },
    mayWrite: () => !readOnly(),
    reconsider(change) {
      if (change.kind === 'signed_out') signedOut = true;
      const mine = ++decisions;
      const decided = info.redecide(signedOut).then(
        (d) => {
          if (mine !== decisions || revoked) return; // a newer decision is on its way
          if (d.status === 401) return revoke(CLOSE_UNAUTHENTICATED, 'You are signed out.');
          if (d.status === 404) return revoke(CLOSE_NOT_FOUND, 'This mapping is no longer available to you.');
          const before = JSON.stringify([info.roleReadOnly, info.session]);
          info.roleReadOnly = d.roleReadOnly;
          info.displayName = d.user.displayName;
          info.session = { ...info.session, role: d.role, displayName: d.user.displayName };
          if (JSON.stringify([info.roleReadOnly, info.session]) !== before) peer.sessionChanged?.();
        },
        // Access could not be checked (MariaDB away): fail closed; the reconnect's upgrade decides anew.
        () => void (revoked || revoke(CLOSE_TRY_AGAIN, 'Your access could not be checked; reconnecting checks it again.')),
      );
      // Frames that arrive from now on wait for the decision: nothing sent after the change was
      // published is used under the old access. (Updates already queued in the room are dropped
      // there when this connection may no longer write.)
      chain = chain.then(() => decided);
    },
  };
  const readOnly = () => revoked || info.roleReadOnly || !!room?.locked;
  const sendSession = (r: DraftRoom) =>
    peer.send(sessionFrame({ ...info.session, readOnly: readOnly(), readOnlyReason: info.roleReadOnly ? 'role' : r.locked ? 'locked' : null } satisfies SessionMessage));
  peer.sessionChanged = () => {
    warnedReadOnly = false;
    if (room) sendSession(room);
  };

  const ready = (async () => {
    for (let attempt = 0; attempt < 3 && !room; attempt++) {
      const r = await openRoom();
      if (!r) return ws.close(CLOSE_NOT_FOUND, 'No such mapping.');
      if (r.join(peer)) room = r;
    }
    if (!room) throw new Error('room kept closing');
    sendSession(room);
    peer.send(syncStep1Frame(room.doc));
    const states = [...room.awareness.getStates().keys()];
    if (states.length) peer.send(awarenessFrame(encodeAwarenessUpdate(room.awareness, states)));
    const latest = room.latestResult();
    if (latest) peer.send(room.evaluationFrame(latest));
  })();
  let chain: Promise<void> = ready;

  const ownerOf = (r: DraftRoom, clientId: number) =>
    peer.controlled.has(clientId) ? 'self' : clientId === r.awareness.clientID || [...r.peers].some((p) => p !== peer && p.controlled.has(clientId)) ? 'other' : 'none';

  const handle = (data: Uint8Array) => {
    if (!room || revoked) return;
    const frame = decodeFrame(data);
    if (frame.kind === 'sync-step-1') peer.send(syncStep2Frame(room.doc, frame.stateVector));
    else if (frame.kind === 'update') {
      if (!readOnly()) room.receiveUpdate(peer, frame.update);
      else if (!warnedReadOnly) {
        warnedReadOnly = true;
        peer.sendError({ code: 'read_only', message: room.locked ? 'This mapping is locked for production; the draft is read-only.' : 'Your role in this project cannot edit drafts; your changes are not kept.' });
      }
    } else if (frame.kind === 'awareness') {
      const r = room;
      const stamped = stampAwareness(frame.update, info, (id) => ownerOf(r, id), peer.controlled.size);
      if (stamped) applyAwarenessUpdate(r.awareness, stamped, peer);
    } else peer.send(awarenessFrame(encodeAwarenessUpdate(room.awareness, [...room.awareness.getStates().keys()])));
  };

  ws.on('message', (data, isBinary) => {
    chain = chain.then(() => {
      if (!isBinary) throw new MalformedFrame('text frame');
      handle(toBytes(data));
    });
    chain = chain.catch(() => {
      // Whatever went wrong with this frame, only this connection ends.
      peer.fail('Malformed message.');
    });
  });

  const pinger = setInterval(() => {
    if (!alive) return void ws.terminate();
    alive = false;
    ws.ping();
  }, pingIntervalMs);
  ws.on('pong', () => (alive = true));
  ws.on('error', () => ws.terminate());
  ws.on('close', () => {
    clearInterval(pinger);
    void ready.finally(() => room?.leave(peer));
  });
  return peer;
}

function toBytes(data: unknown): Uint8Array {
  if (Array.isArray(data)) return new Uint8Array(Buffer.concat(data));
  if (data instanceof ArrayBuffer) return new Uint8Array(data);
  return new Uint8Array(data as Buffer);
}
