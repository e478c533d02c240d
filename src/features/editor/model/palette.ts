import theme from '../../../../tailwind.config';

// Bead colours live in src/shared/drawing/palette.ts (the exports use them too); presence colours
// of collaborators are the editor's own.

const bead = theme.theme.extend.colors.bead;

export { BEAD_COLOURS, beadColour } from '../../../shared/drawing/palette';

// Presence colours: taken from the same palette, skipping yellow and black, which
// are hard to read as thin pointer outlines on paper.
const PRESENCE: readonly string[] = [bead.blue, bead.vermillion, bead.green, bead.purple, bead.orange, bead.sky];

/** A stable colour for a collaborator, from their user id. */
export function presenceColour(userId: number): string {
  return PRESENCE[Math.abs(userId) % PRESENCE.length];
}
