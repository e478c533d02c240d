import * as decoding from 'lib0/decoding';
import { WebsocketProvider } from 'y-websocket';
import * as Y from 'yjs';
import {
  CLOSE_NOT_FOUND,
  CLOSE_UNAUTHENTICATED,
  MESSAGE_ERROR,
  MESSAGE_EVALUATION,
  MESSAGE_RESTORE,
  MESSAGE_SESSION,
  type CollabErrorMessage,
  type EvaluationMessage,
  type SessionMessage,
} from '../../../shared/collab-protocol';
import { ATOMS, BEADS, SETTINGS } from '../../../shared/mapping-doc';
import { PROPOSAL } from '../../../shared/proposal-doc';
import { presenceColour } from '../../../shared/presence-colour';
import type { PresenceState } from '../model/presence';

/**
 * One live mapping draft: the Yjs document, its socket (y-websocket's provider on /collab/:id),
 * presence, and a per-user undo manager that tracks only this session's own edits. The
 * evaluation, session and error messages of our collab protocol arrive as extra message types.
 * React reads `snapshot` through subscribe/getSnapshot (useSyncExternalStore).
 */
export type ConnectionState = 'connecting' | 'live' | 'reconnecting' | 'read-only' | 'closed';

export interface SessionSnapshot {
  connection: ConnectionState;
  synced: boolean;
  session: SessionMessage | null;
  evaluation: EvaluationMessage | null;
  /** The last refused update; the editor reloads the draft when `refusals` grows. */
  refused: CollabErrorMessage | null;
  refusals: number;
  /** Why the socket closed for good (4401, 4404), when it did. */
  closedReason: string | null;
}

const BROADCAST_CHANNEL_OFF = { disableBc: true } as const;

export class MappingSession {
  readonly doc = new Y.Doc();
  /** Origin of every local edit: the undo manager tracks this and nothing else. */
  readonly origin = { local: true };
  readonly undo: Y.UndoManager;
  readonly provider: WebsocketProvider;
  private snapshot: SessionSnapshot = { connection: 'connecting', synced: false, session: null, evaluation: null, refused: null, refusals: 0, closedReason: null };
  private readonly listeners = new Set<() => void>();
  private everConnected = false;

  constructor(mappingId: number) {
    // The open proposal is in scope so that undoing an accept brings its ghosts back; proposing and
    // dismissing use no tracked origin, so they are not undo steps.
    this.undo = new Y.UndoManager([this.doc.getMap(BEADS), this.doc.getMap(ATOMS), this.doc.getMap(SETTINGS), this.doc.getMap(PROPOSAL)], { trackedOrigins: new Set([this.origin]), captureTimeout: 0 });
    const scheme = window.location.protocol === 'https:' ? 'wss' : 'ws';
    this.provider = new WebsocketProvider(`${scheme}://${window.location.host}/collab`, String(mappingId), this.doc, BROADCAST_CHANNEL_OFF);
    this.provider.messageHandlers[MESSAGE_EVALUATION] = (_enc, dec) => this.set({ evaluation: readJson<EvaluationMessage>(dec) });
    this.provider.messageHandlers[MESSAGE_SESSION] = (_enc, dec) => this.onSession(readJson<SessionMessage>(dec));
    this.provider.messageHandlers[MESSAGE_ERROR] = (_enc, dec) => {
      // 'read_only' only confirms what the session message said (a viewer's sync reply is dropped);
      // any other refusal means our document now differs from the server's.
      const refused = readJson<CollabErrorMessage>(dec);
      this.set({ refused, refusals: this.snapshot.refusals + (refused.code === 'read_only' ? 0 : 1) });
    };
    // A restore this session asked for arrives instead of the plain sync update: applied as the
    // provider would (so it is not sent back), but tracked by the undo manager, as one step.
    this.provider.messageHandlers[MESSAGE_RESTORE] = (_enc, dec) => {
      const update = decoding.readVarUint8Array(dec);
      this.undo.stopCapturing();
      this.undo.trackedOrigins.add(this.provider);
      try {
        Y.applyUpdate(this.doc, update, this.provider);
      } finally {
        this.undo.trackedOrigins.delete(this.provider);
        this.undo.stopCapturing();
      }
    };
    this.provider.on('status', ({ status }) => {
      if (status === 'connected') this.everConnected = true;
      this.set({ connection: this.connectionFor(status) });
    });
    this.provider.on('sync', (synced: boolean) => this.set({ synced }));
    this.provider.on('closed', ({ code }) => {
      const reason = code === CLOSE_UNAUTHENTICATED ? 'You are signed out.' : code === CLOSE_NOT_FOUND ? 'This mapping is not available to you.' : 'The connection was closed.';
      this.set({ connection: 'closed', closedReason: reason });
    });
  }

  /** The id the server knows this connection's awareness by (a restore names it to come back undoable). */
  get clientId(): number {
    return this.doc.clientID;
  }

  /** Beads in the live draft now. */
  beadCount(): number {
    return this.doc.getMap(BEADS).size;
  }

  get readOnly(): boolean {
    return this.snapshot.session?.readOnly ?? true;
  }

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getSnapshot = (): SessionSnapshot => this.snapshot;

  /** Presence: what this person has selected and where their pointer is (model coordinates). */
  setPresence(fields: Partial<PresenceState>): void {
    const awareness = this.provider.awareness;
    const current = awareness.getLocalState() ?? {};
    awareness.setLocalState({ ...current, ...fields });
  }

  destroy(): void {
    this.undo.destroy();
    this.provider.destroy();
    this.doc.destroy();
    this.listeners.clear();
  }

  private onSession(session: SessionMessage): void {
    this.set({ session, connection: this.connectionFor('connected', session) });
    this.setPresence({ user: { id: session.userId, name: session.displayName, colour: presenceColour(session.userId) } });
  }

  private connectionFor(status: string, session = this.snapshot.session): ConnectionState {
    if (this.snapshot.connection === 'closed') return 'closed';
    if (status === 'connected') return session?.readOnly ? 'read-only' : 'live';
    return this.everConnected ? 'reconnecting' : 'connecting';
  }

  private set(patch: Partial<SessionSnapshot>): void {
    this.snapshot = { ...this.snapshot, ...patch };
    for (const l of this.listeners) l();
  }
}

function readJson<T>(decoder: decoding.Decoder): T {
  return JSON.parse(decoding.readVarString(decoder)) as T;
}
