import theme from '../../../../tailwind.config';

// Bead colours come from the theme's colour-blind-safe categorical palette, so the
// canvas, the bead table and the graph always agree. Black is kept last and used
// only after the seven chromatic colours are taken; hulls are drawn translucent.

const bead = theme.theme.extend.colors.bead;

export const BEAD_COLOURS: readonly string[] = [
  bead.orange,
  bead.sky,
  bead.green,
  bead.yellow,
  bead.blue,
  bead.vermillion,
  bead.purple,
  bead.black,
];

/** The colour of the n-th bead (in the document's stable bead order). */
export function beadColour(n: number): string {
  const k = BEAD_COLOURS.length;
  return BEAD_COLOURS[((n % k) + k) % k];
}

// Presence colours: taken from the same palette, skipping yellow and black, which
// are hard to read as thin pointer outlines on paper.
const PRESENCE: readonly string[] = [bead.blue, bead.vermillion, bead.green, bead.purple, bead.orange, bead.sky];

/** A stable colour for a collaborator, from their user id. */
export function presenceColour(userId: number): string {
  return PRESENCE[Math.abs(userId) % PRESENCE.length];
}
