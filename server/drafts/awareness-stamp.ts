/**
 * Presence comes from the signed-in account, not from what a client claims. A y-protocols awareness
 * update is a list of (awareness client id, clock, state as JSON). Before the room applies and
 * relays one, every entry is checked and rewritten:
 *   - an entry for a client id that another connection (or the server) announced is dropped: no one
 *     speaks for, or removes, someone else's presence;
 *   - a connection announces at most MAX_CLIENT_IDS ids (one browser tab uses one);
 *   - a state whose `user.id` is another account's is dropped (it claims another identity);
 *   - every other state gets `user` = { id, name, colour } of the connection's account, whatever it said.
 * A state that is not a JSON object is dropped; null (the client leaving) passes for its own ids.
 */
import * as decoding from 'lib0/decoding';
import * as encoding from 'lib0/encoding';
import { presenceColour } from '../../src/shared/presence-colour';

export const MAX_CLIENT_IDS = 4;

export interface AwarenessIdentity {
  userId: number;
  displayName: string;
}

/**
 * The update with every entry checked and stamped, or null when nothing is left. `ownerOf` tells who
 * announced a client id: 'self', 'other', or 'none' (not seen yet).
 */
export function stampAwareness(update: Uint8Array, who: AwarenessIdentity, ownerOf: (clientId: number) => 'self' | 'other' | 'none', ownCount: number): Uint8Array | null {
  const d = decoding.createDecoder(update);
  const kept: { clientId: number; clock: number; state: string }[] = [];
  let owned = ownCount;
  const user = { id: who.userId, name: who.displayName, colour: presenceColour(who.userId) };
  for (let n = decoding.readVarUint(d); n > 0; n--) {
    const clientId = decoding.readVarUint(d);
    const clock = decoding.readVarUint(d);
    const state: unknown = JSON.parse(decoding.readVarString(d));
    const owner = ownerOf(clientId);
    if (owner === 'other') continue;
    if (state === null) {
      if (owner === 'self') kept.push({ clientId, clock, state: 'null' });
      continue;
    }
    if (typeof state !== 'object' || Array.isArray(state)) continue;
    const claimed = (state as { user?: { id?: unknown } }).user;
    if (claimed && typeof claimed === 'object' && claimed.id !== undefined && claimed.id !== who.userId) continue;
    if (owner === 'none') {
      if (owned >= MAX_CLIENT_IDS) continue;
      owned++;
    }
    kept.push({ clientId, clock, state: JSON.stringify({ ...state, user }) });
  }
  if (kept.length === 0) return null;
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, kept.length);
  for (const k of kept) {
    encoding.writeVarUint(e, k.clientId);
    encoding.writeVarUint(e, k.clock);
    encoding.writeVarString(e, k.state);
  }
  return encoding.toUint8Array(e);
}
