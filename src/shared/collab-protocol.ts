/**
 * The collab socket at /collab/:mappingId. Every frame is binary: a varuint message type, then its body.
 *
 *   0  sync        y-protocols/sync (step 1, step 2, update). Read-only connections may send step 1 only;
 *                  the server drops their step 2 and update messages.
 *   1  awareness   y-protocols/awareness update; relayed to everyone in the mapping, the sender included.
 *   3  query awareness (y-websocket): the server answers with all known awareness states.
 *   100 evaluation the server's latest evaluation of the draft: a varstring of JSON `EvaluationMessage`.
 *   101 error      an update of this connection was refused: a varstring of JSON `CollabErrorMessage`.
 *                  The server's document is unchanged; the client should drop its local change
 *                  (the editor reloads the draft).
 *   102 session    sent after connecting, and again when the mapping is locked or unlocked: a varstring
 *                  of JSON `SessionMessage` (who you are, whether you may edit).
 *   103 restore    a restore this connection asked for (its awareness client id was in the request): a
 *                  varUint8Array Yjs update, sent INSTEAD of the sync update the other peers get, so the
 *                  client can apply it as an undoable step of its own (the editor's UndoManager tracks it).
 *
 * Close codes (4400–4499 tell y-websocket not to reconnect): 4401 not signed in, 4404 no such mapping
 * or not a member, 4400 malformed frame.
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
/** The server could not store the client's changes; reconnecting (automatic) sends them again. WebSocket's own "try again later". */
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
