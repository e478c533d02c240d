import { THEME_COLOURS } from './drawing/theme-colours';

// Presence colours: from the bead palette (drawing/theme-colours.ts), skipping yellow and black, which are
// hard to read as thin pointer outlines on paper. Shared: the server stamps each connection's
// awareness with its account's colour (server/drafts/awareness-stamp.ts), the client draws it.

const bead = THEME_COLOURS.bead;
const PRESENCE: readonly string[] = [bead.blue, bead.vermillion, bead.green, bead.purple, bead.orange, bead.sky];

/** A stable colour for a collaborator, from their user id. */
export function presenceColour(userId: number): string {
  return PRESENCE[Math.abs(userId) % PRESENCE.length];
}
