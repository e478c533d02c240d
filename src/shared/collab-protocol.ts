/**
 * The collab socket at /collab/:mappingId. Every frame is binary: a varuint message type, then its body.
 *
 *   0  sync        y-protocols/sync (step 1, step 2, update). Read-only connections may send step 1 only;
 *                  the server drops their step 2 and update messages.
 *   1  awareness   y-protocols/awareness update; relayed to everyone in the mapping, the sender included,
 *                  each state's `user` set by the server to the connection's account { id, name, colour }
 *                  (a state claiming another account's id, or another connection's client id, is dropped).
 *   3  query awareness (y-websocket): the server answers with all known awareness states.
 *   100 evaluation the server's latest evaluation of the draft: a varstring of JSON `EvaluationMessage`.
 *   101 error      an update of this connection was refused: a varstring of JSON `CollabErrorMessage`.
 *                  The server's document is unchanged; the client should drop its local change
 *                  (the editor reloads the draft).
 *   102 session    sent after connecting, and again when it changes (the mapping is locked or unlocked,
 *                  the role changes, the account is renamed): a varstring of JSON `SessionMessage` (who
 *                  you are, whether you may edit).
 *   103 restore    a restore this connection asked for (its awareness client id was in the request): a
 *                  varUint8Array Yjs update, sent INSTEAD of the sync update the other peers get, so the
 *                  client can apply it as an undoable step of its own (the editor's UndoManager tracks it).
 *
 * Close codes (4400–4499 tell y-websocket not to reconnect). Access is decided at the upgrade and again
 * whenever it changes while the socket is open (docs/collaboration.md, "Access while connected"):
 *   4401 CLOSE_UNAUTHENTICATED  not signed in any more: signed out, account disabled, sessions ended
 *   4404 CLOSE_NOT_FOUND        no such mapping, or no longer visible (removed from the project)
 *   4400 CLOSE_MALFORMED        a frame that cannot be decoded
 *   1009 CLOSE_TOO_LARGE        a frame over the server's limit (COLLAB_MAX_FRAME_BYTES, 1 MiB)
 *   1013 CLOSE_TRY_AGAIN        the server could not store the changes, or not check access: reconnect
 * An update that is decoded but refused (bad content, missing dependencies) does not close the socket:
 * the sender gets message 101 `update_refused`.
 */
import type { Evaluation } from './chem';
import type { ProjectRole } from './roles';

export const MESSAGE_SYNC = 0;
export const MESSAGE_AWARENESS = 1;
export const MESSAGE_QUERY_AWARENESS = 3;
export const MESSAGE_EVALUATION = 100;
export const MESSAGE_ERROR = 101;
export const MESSAGE_SESSION = 102;
export const MESSAGE_RESTORE = 103;

export const CLOSE_MALFORMED = 4400;
export const CLOSE_UNAUTHENTICATED = 4401;
export const CLOSE_NOT_FOUND = 4404;
/** WebSocket's own "message too big" (RFC 6455 §7.4.1), sent by the server's socket for a frame over the limit. */
export const CLOSE_TOO_LARGE = 1009;
/**
 * The server could not store the client's changes, or could not check its access; reconnecting
 * (automatic) sends them again, and the upgrade decides access anew. WebSocket's own "try again later".
 */
export const CLOSE_TRY_AGAIN = 1013;

export const collabPath = (mappingId: number | string) => `/collab/${mappingId}`;

export interface EvaluationMessage {
  mappingId: number;
  /** Null when the chemistry core could not evaluate the draft; `error` then says why. */
  evaluation: Evaluation | null;
  error: { code: string; message: string } | null;
  evaluatedAt: string;
}

export interface CollabErrorMessage {
  code: 'update_refused' | 'read_only' | (string & {});
  message: string;
  details?: unknown;
}

export interface SessionMessage {
  mappingId: number;
  userId: number;
  displayName: string;
  role: ProjectRole | null;
  readOnly: boolean;
  /** Why the session is read-only, when it is. */
  readOnlyReason: 'role' | 'locked' | null;
}
