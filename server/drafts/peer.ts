import type { CollabErrorMessage } from '../../src/shared/collab-protocol';
import type { AccessChange } from '../auth/access-changes';

/** What a room needs of a connection (connection.ts makes one per socket). */
export interface Peer {
  /** Unique among all connections (relayed messages name their sender by it). */
  readonly id: string;
  readonly userId: number;
  /** The session the socket was opened with (a sign-out of it closes the socket). */
  readonly sessionId: string | null;
  /** Awareness client ids this connection has announced. */
  readonly controlled: Set<number>;
  send(frame: Uint8Array): void;
  sendError(error: CollabErrorMessage): void;
  /** Ends this connection only (malformed input). */
  fail(reason: string): void;
  /** Ends this connection so that the client reconnects and sends its changes again (they were not stored). */
  retry(reason: string): void;
  /** The mapping was locked or unlocked: tell the client whether it may edit now. */
  sessionChanged?(): void;
  /** Whether this connection may still change the draft (its role, its access, the lock). */
  mayWrite(): boolean;
  /** Access of this connection's account may have changed (collab-access.ts): decide again. */
  reconsider(change: AccessChange): void;
}
