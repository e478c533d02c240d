import type * as Y from 'yjs';
import { Awareness, applyAwarenessUpdate, encodeAwarenessUpdate, removeAwarenessStates } from 'y-protocols/awareness';
import { awarenessFrame } from './frames';
import type { Peer } from './peer';

/** The origin of awareness changes that came through the relay from another server (not published again). */
const RELAYED = Symbol('relayed');

/**
 * A room's presence: y-protocols awareness beside the room's document. A change made here (a
 * connection's stamped update, a connection leaving, a state timing out) is published on the relay;
 * what comes back through the relay goes to this room's connections — applied here first when another
 * server published it. Each connection's announced client ids are kept on it (`controlled`), so
 * awareness-stamp.ts can tell whose an id is.
 */
export class RoomPresence {
  readonly awareness: Awareness;

  constructor(
    doc: Y.Doc,
    private readonly peers: Set<Peer>,
    private readonly publish: (update: Uint8Array) => void,
  ) {
    this.awareness = new Awareness(doc);
    this.awareness.setLocalState(null);
    this.awareness.on('update', this.onChange);
  }

  /** An awareness update from the relay; `own` when this server published it (already applied here). */
  relayed(update: Uint8Array, own: boolean): void {
    if (own) this.sendAll(awarenessFrame(update));
    else applyAwarenessUpdate(this.awareness, update, RELAYED);
  }

  /** Removes what a connection that left had announced. */
  forget(peer: Peer): void {
    removeAwarenessStates(this.awareness, [...peer.controlled], null);
  }

  destroy(): void {
    this.awareness.destroy();
  }

  private sendAll(frame: Uint8Array): void {
    for (const p of this.peers) p.send(frame);
  }

  private onChange = ({ added, updated, removed }: { added: number[]; updated: number[]; removed: number[] }, origin: unknown) => {
    const peer = [...this.peers].find((p) => p === origin);
    if (peer) {
      for (const id of added) peer.controlled.add(id);
      for (const id of removed) peer.controlled.delete(id);
    }
    const changed = [...added, ...updated, ...removed];
    if (changed.length === 0) return;
    const update = encodeAwarenessUpdate(this.awareness, changed);
    if (origin === RELAYED) this.sendAll(awarenessFrame(update));
    else this.publish(update);
  };
}
