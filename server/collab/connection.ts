/**
 * One WebSocket on /collab/:mappingId: decodes frames (see src/shared/collab-protocol.ts) and hands
 * them to the room. Frames are handled one at a time, in arrival order, and only after the room has
 * loaded the draft from MariaDB, so the first sync step 1 is answered with the stored state.
 * Read-only connections (students, locked mappings) may ask (sync step 1) but their step 2 and update
 * messages are dropped; awareness flows for everyone. A frame that cannot be decoded closes this
 * connection only. Keep-alive: a ping every `pingIntervalMs`; no pong by the next one ends the socket.
 */
import type { WebSocket } from 'ws';
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';
import { applyAwarenessUpdate, encodeAwarenessUpdate } from 'y-protocols/awareness';
import { messageYjsSyncStep1, messageYjsSyncStep2, messageYjsUpdate, writeSyncStep1, writeSyncStep2 } from 'y-protocols/sync';
import {
  CLOSE_MALFORMED,
  CLOSE_NOT_FOUND,
  CLOSE_TRY_AGAIN,
  MESSAGE_AWARENESS,
  MESSAGE_ERROR,
  MESSAGE_QUERY_AWARENESS,
  MESSAGE_SESSION,
  MESSAGE_SYNC,
  type CollabErrorMessage,
  type SessionMessage,
} from '../../src/shared/collab-protocol';
import type { Peer, Room } from './room';

export interface ConnectionInfo {
  userId: number;
  displayName: string;
  session: Omit<SessionMessage, 'readOnly' | 'readOnlyReason'>;
  /** True when the role may not edit (the lock is checked per message, it may change). */
  roleReadOnly: boolean;
}

class Malformed extends Error {}

export function serveConnection(ws: WebSocket, info: ConnectionInfo, openRoom: () => Promise<Room | null>, pingIntervalMs: number): void {
  let room: Room | null = null;
  let alive = true;
  let warnedReadOnly = false;
  const peer: Peer = {
    userId: info.userId,
    controlled: new Set(),
    send(frame) {
      if (ws.readyState === ws.OPEN) ws.send(frame);
    },
    sendError(error: CollabErrorMessage) {
      peer.send(stringFrame(MESSAGE_ERROR, JSON.stringify(error)));
    },
    fail(reason) {
      ws.close(CLOSE_MALFORMED, reason.slice(0, 120));
    },
    retry(reason) {
      ws.close(CLOSE_TRY_AGAIN, reason.slice(0, 120));
    },
  };
  const readOnly = () => info.roleReadOnly || !!room?.locked;
  const sendSession = (r: Room) =>
    peer.send(stringFrame(MESSAGE_SESSION, JSON.stringify({ ...info.session, readOnly: readOnly(), readOnlyReason: info.roleReadOnly ? 'role' : r.locked ? 'locked' : null } satisfies SessionMessage)));
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
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, MESSAGE_SYNC);
    writeSyncStep1(e, room.doc);
    peer.send(encoding.toUint8Array(e));
    const states = [...room.awareness.getStates().keys()];
    if (states.length) peer.send(awarenessFrame(encodeAwarenessUpdate(room.awareness, states)));
    const latest = room.latestResult();
    if (latest) peer.send(room.evaluationFrame(latest));
  })();
  let chain: Promise<void> = ready;

  const handle = (data: Uint8Array) => {
    if (!room) return;
    const d = decoding.createDecoder(data);
    const type = decoding.readVarUint(d);
    if (type === MESSAGE_SYNC) {
      const sub = decoding.readVarUint(d);
      const payload = decoding.readVarUint8Array(d);
      if (sub === messageYjsSyncStep1) {
        const e = encoding.createEncoder();
        encoding.writeVarUint(e, MESSAGE_SYNC);
        writeSyncStep2(e, room.doc, payload);
        peer.send(encoding.toUint8Array(e));
      } else if (sub === messageYjsSyncStep2 || sub === messageYjsUpdate) {
        if (!readOnly()) room.receiveUpdate(peer, payload);
        else if (!warnedReadOnly) {
          warnedReadOnly = true;
          peer.sendError({ code: 'read_only', message: room.locked ? 'This mapping is locked for production; the draft is read-only.' : 'Your role in this project cannot edit drafts; your changes are not kept.' });
        }
      } else throw new Malformed(`unknown sync message ${sub}`);
    } else if (type === MESSAGE_AWARENESS) {
      applyAwarenessUpdate(room.awareness, decoding.readVarUint8Array(d), peer);
    } else if (type === MESSAGE_QUERY_AWARENESS) {
      peer.send(awarenessFrame(encodeAwarenessUpdate(room.awareness, [...room.awareness.getStates().keys()])));
    } else throw new Malformed(`unknown message type ${type}`);
  };

  ws.on('message', (data, isBinary) => {
    chain = chain.then(() => {
      if (!isBinary) throw new Malformed('text frame');
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
}

function toBytes(data: unknown): Uint8Array {
  if (Array.isArray(data)) return new Uint8Array(Buffer.concat(data));
  if (data instanceof ArrayBuffer) return new Uint8Array(data);
  return new Uint8Array(data as Buffer);
}

function stringFrame(type: number, text: string): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, type);
  encoding.writeVarString(e, text);
  return encoding.toUint8Array(e);
}

function awarenessFrame(update: Uint8Array): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MESSAGE_AWARENESS);
  encoding.writeVarUint8Array(e, update);
  return encoding.toUint8Array(e);
}
