/**
 * Presence over the Yjs awareness protocol. Each client publishes one state:
 *   { user: { id, name, colour }, selection: atom indices, pointer: model point | null, activeBead }
 * Remote states are untrusted input (any member can publish anything), so they are read
 * defensively: wrong fields are dropped, never thrown on.
 */
import type { Point } from '../../../shared/drawing/hull';

export interface PresenceState {
  user: { id: number; name: string; colour: string };
  selection: number[];
  pointer: Point | null;
  activeBead: string | null;
}

export interface Peer extends PresenceState {
  clientId: number;
  isLocal: boolean;
}

const isNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

export function readPeers(states: ReadonlyMap<number, Record<string, unknown>>, localClientId: number, atomCount: number): Peer[] {
  const peers: Peer[] = [];
  for (const [clientId, state] of states) {
    const user = state.user as Partial<PresenceState['user']> | undefined;
    if (!user || !isNumber(user.id) || typeof user.name !== 'string' || typeof user.colour !== 'string') continue;
    const selection = Array.isArray(state.selection) ? state.selection.filter((a): a is number => Number.isInteger(a) && a >= 0 && a < atomCount) : [];
    const p = state.pointer as Partial<Point> | null | undefined;
    const pointer = p && isNumber(p.x) && isNumber(p.y) ? { x: p.x, y: p.y } : null;
    const activeBead = typeof state.activeBead === 'string' ? state.activeBead : null;
    peers.push({
      clientId,
      isLocal: clientId === localClientId,
      user: { id: user.id, name: user.name.slice(0, 80), colour: /^#[0-9a-f]{6}$/i.test(user.colour) ? user.colour : '#555555' },
      selection,
      pointer,
      activeBead,
    });
  }
  // The local person first, then everyone else by name, so the list does not jump around.
  return peers.sort((a, b) => Number(b.isLocal) - Number(a.isLocal) || a.user.name.localeCompare(b.user.name) || a.clientId - b.clientId);
}

export function initials(name: string): string {
  const words = name.replace(/\(.*?\)/g, ' ').trim().split(/\s+/).filter(Boolean);
  return ((words[0]?.[0] ?? '?') + (words.length > 1 ? (words.at(-1)?.[0] ?? '') : '')).toUpperCase();
}
