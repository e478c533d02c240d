import { THEME_COLOURS } from './theme-colours';

// Colours of drawings, from the theme (theme-colours.ts, the same as src/index.css's @theme), shared by the editor, the molecule pages
// and the server's SVG/PNG exports so a bead is the same colour on screen and in a file.
// Bead colours: the colour-blind-safe categorical palette; black is kept last and used only after
// the seven chromatic colours are taken; hulls are drawn translucent.

const { bead, ink, paper } = THEME_COLOURS;

export const BEAD_COLOURS: readonly string[] = [bead.orange, bead.sky, bead.green, bead.yellow, bead.blue, bead.vermillion, bead.purple, bead.black];

/** Ink and paper of drawings (the editor's stroke-ink-900, fill-ink-400, paper-50 …). */
export const DRAWING_COLOURS = { ink: ink[900], inkSoft: ink[400], paper: paper[50], attachment: bead.vermillion, highlight: bead.vermillion } as const;

/** The colour of the n-th bead when neighbours do not matter (legends, lists). */
export function beadColour(n: number): string {
  const k = BEAD_COLOURS.length;
  return BEAD_COLOURS[((n % k) + k) % k];
}

/**
 * Colours of beads in their stable order: bead n prefers palette colour n (mod 7, black kept for
 * overflow) but skips any colour already taken by a bead it is linked to (`links`: bead-id pairs
 * joined by a bond or a shared atom), so neighbouring hulls are always told apart. Every peer and
 * the server compute the same colours from the same beads.
 */
export function assignBeadColours(beadIds: readonly string[], links: readonly (readonly [string, string])[]): Map<string, string> {
  const neighbours = new Map<string, Set<string>>();
  for (const [p, q] of links) {
    if (!neighbours.has(p)) neighbours.set(p, new Set());
    if (!neighbours.has(q)) neighbours.set(q, new Set());
    neighbours.get(p)!.add(q);
    neighbours.get(q)!.add(p);
  }
  const colourOf = new Map<string, string>();
  const chromatic = BEAD_COLOURS.length - 1;
  beadIds.forEach((id, n) => {
    const taken = new Set([...(neighbours.get(id) ?? [])].map((other) => colourOf.get(other)).filter(Boolean));
    let colour = BEAD_COLOURS[BEAD_COLOURS.length - 1];
    for (let k = 0; k < chromatic; k++) {
      const candidate = BEAD_COLOURS[(n + k) % chromatic];
      if (!taken.has(candidate)) {
        colour = candidate;
        break;
      }
    }
    colourOf.set(id, colour);
  });
  return colourOf;
}

/**
 * Bead–bead links: an atomistic bond across two beads, or an atom shared by both, each pair once,
 * ids in ascending order. `atomBeads`: atom index → ids of the beads holding it.
 */
export function beadLinks(atomBeads: ReadonlyMap<number, readonly string[]>, bonds: readonly { a: number; b: number }[]): [string, string][] {
  const seen = new Set<string>();
  const out: [string, string][] = [];
  const add = (p: string, q: string) => {
    if (p === q) return;
    const [x, y] = p < q ? [p, q] : [q, p];
    const key = `${x}|${y}`;
    if (seen.has(key)) return;
    seen.add(key);
    out.push([x, y]);
  };
  for (const ids of atomBeads.values()) for (let i = 0; i < ids.length; i++) for (let j = i + 1; j < ids.length; j++) add(ids[i], ids[j]);
  for (const bond of bonds) {
    for (const p of atomBeads.get(bond.a) ?? []) for (const q of atomBeads.get(bond.b) ?? []) add(p, q);
  }
  return out;
}

/** Which beads hold each atom. */
export function atomBeadsOf(beads: readonly { id: string; atoms: readonly { index: number }[] }[]): Map<number, string[]> {
  const atomBeads = new Map<number, string[]>();
  for (const b of beads) for (const a of b.atoms) atomBeads.set(a.index, [...(atomBeads.get(a.index) ?? []), b.id]);
  return atomBeads;
}
