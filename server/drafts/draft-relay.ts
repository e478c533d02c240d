/**
 * How accepted updates and presence reach every connection of a mapping, on this server and (with a
 * relay shared between servers) on the others. The room publishes an update only after storage
 * accepted it, with the sequence number storage gave it; every room of that mapping — the publishing
 * one included — gets each message through its subscription and sends it to its own connections.
 *
 * Several servers: a message names the `instance` whose room published it (that room already applied
 * the update to its document; the others apply it) and the sequence number of the update stored just
 * before it in this mapping (`prevSeq`), so a subscriber whose last seen number differs knows it
 * missed something and must read the draft again from storage. The in-process relay
 * (in-process-relay.ts) delivers synchronously, in publish order, and never loses a message.
 *
 * The Redis relay (redis-relay.ts) delivers a message to this server's rooms synchronously too, then
 * to the other servers through the mapping's Redis channel; where it knows messages may have been
 * lost (a subscription just made, or made again after Redis came back) it says so with a `gap`
 * message, and the room catches up from storage. With a lease (RoomDeps.lease) one server evaluates a
 * mapping at a time and relays its results as `evaluation` messages.
 */
import type { EvaluationResult } from '../mappings/draft-access';

export interface RelayedUpdate {
  kind: 'update';
  mappingId: number;
  /** The update's sequence number in storage. */
  seq: number;
  /** The sequence number of this mapping's update stored just before it (0: none). */
  prevSeq: number;
  update: Uint8Array;
  instance: string;
  /** The connection that sent it (it is not sent back there); null for an update the server made. */
  sender: string | null;
  /** A restore asked for by the connection that announced this awareness client: it gets a restore frame. */
  restoreFor?: { userId: number; clientId: number };
}

export interface RelayedAwareness {
  kind: 'awareness';
  mappingId: number;
  /** A y-protocols awareness update, already checked and stamped (awareness-stamp.ts). */
  update: Uint8Array;
  instance: string;
}

/** Messages of this mapping may have been lost here: read the stored draft and take what is missing. */
export interface RelayedGap {
  kind: 'gap';
  mappingId: number;
}

/** The result of the server holding the mapping's evaluation lease, for every server's connections. */
export interface RelayedEvaluation {
  kind: 'evaluation';
  mappingId: number;
  result: EvaluationResult;
  instance: string;
}

export type RelayedMessage = RelayedUpdate | RelayedAwareness | RelayedGap | RelayedEvaluation;

export interface DraftRelay {
  publish(message: RelayedMessage): void;
  /** Returns the unsubscribe function. */
  subscribe(mappingId: number, listener: (message: RelayedMessage) => void): () => void;
  close(): Promise<void>;
}
