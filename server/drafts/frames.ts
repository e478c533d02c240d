/**
 * Every frame of the collab socket, both ways (the protocol is described once, in
 * src/shared/collab-protocol.ts): a varuint message type, then its body. The sync bodies are
 * y-protocols' (step 1 carries a state vector, step 2 and update a Yjs update); awareness carries a
 * y-protocols awareness update; our own messages carry JSON as a varstring, the restore a Yjs update.
 */
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';
import type * as Y from 'yjs';
import { messageYjsSyncStep1, messageYjsSyncStep2, messageYjsUpdate, writeSyncStep1, writeSyncStep2 } from 'y-protocols/sync';
import {
  MESSAGE_AWARENESS,
  MESSAGE_ERROR,
  MESSAGE_EVALUATION,
  MESSAGE_QUERY_AWARENESS,
  MESSAGE_RESTORE,
  MESSAGE_SESSION,
  MESSAGE_SYNC,
  type CollabErrorMessage,
  type EvaluationMessage,
  type SessionMessage,
} from '../../src/shared/collab-protocol';

/** A frame from a client, decoded. */
export type IncomingFrame =
  | { kind: 'sync-step-1'; stateVector: Uint8Array }
  /** Sync step 2 or update: both carry a Yjs update the server applies. */
  | { kind: 'update'; update: Uint8Array }
  | { kind: 'awareness'; update: Uint8Array }
  | { kind: 'query-awareness' };

export class MalformedFrame extends Error {}

/** Decodes a client's frame; throws MalformedFrame (or lib0's error for a truncated one) when it is not one. */
export function decodeFrame(data: Uint8Array): IncomingFrame {
  const d = decoding.createDecoder(data);
  const type = decoding.readVarUint(d);
  if (type === MESSAGE_SYNC) {
    const sub = decoding.readVarUint(d);
    const payload = decoding.readVarUint8Array(d);
    if (sub === messageYjsSyncStep1) return { kind: 'sync-step-1', stateVector: payload };
    if (sub === messageYjsSyncStep2 || sub === messageYjsUpdate) return { kind: 'update', update: payload };
    throw new MalformedFrame(`unknown sync message ${sub}`);
  }
  if (type === MESSAGE_AWARENESS) return { kind: 'awareness', update: decoding.readVarUint8Array(d) };
  if (type === MESSAGE_QUERY_AWARENESS) return { kind: 'query-awareness' };
  throw new MalformedFrame(`unknown message type ${type}`);
}

function frame(type: number, write: (e: encoding.Encoder) => void): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, type);
  write(e);
  return encoding.toUint8Array(e);
}

/** Sync step 1: the server's state vector, so the client sends what the server lacks. */
export const syncStep1Frame = (doc: Y.Doc) => frame(MESSAGE_SYNC, (e) => writeSyncStep1(e, doc));

/** Sync step 2: what `doc` has beyond the client's state vector. */
export const syncStep2Frame = (doc: Y.Doc, stateVector: Uint8Array) => frame(MESSAGE_SYNC, (e) => writeSyncStep2(e, doc, stateVector));

export const syncUpdateFrame = (update: Uint8Array) =>
  frame(MESSAGE_SYNC, (e) => {
    encoding.writeVarUint(e, messageYjsUpdate);
    encoding.writeVarUint8Array(e, update);
  });

export const restoreFrame = (update: Uint8Array) => frame(MESSAGE_RESTORE, (e) => encoding.writeVarUint8Array(e, update));

export const awarenessFrame = (update: Uint8Array) => frame(MESSAGE_AWARENESS, (e) => encoding.writeVarUint8Array(e, update));

const jsonFrame = (type: number, body: unknown) => frame(type, (e) => encoding.writeVarString(e, JSON.stringify(body)));

export const evaluationFrame = (message: EvaluationMessage) => jsonFrame(MESSAGE_EVALUATION, message);
export const errorFrame = (error: CollabErrorMessage) => jsonFrame(MESSAGE_ERROR, error);
export const sessionFrame = (session: SessionMessage) => jsonFrame(MESSAGE_SESSION, session);
