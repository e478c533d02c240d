import { centroid, type Point } from './hull';
import { BOND } from './layout';

/**
 * Where each bead's name tag goes: off the atom symbols and off other tags. Candidates are around
 * the bead's hull (above, below, left, right, and the four diagonals, just outside the hull's
 * margin); each is scored by its tag box's clearance from every atom (labelled atoms count as
 * wider) and from tags already placed, and the clearest wins (ties: the earlier candidate, so
 * "above" is the default look). Beads are placed in their stable order, so every renderer agrees.
 */

export const TAG_HEIGHT = BOND * 0.4;
export const tagWidth = (name: string) => Math.max(BOND * 0.7, name.length * BOND * 0.2 + BOND * 0.3);

export interface TagPlacement {
  x: number;
  y: number;
  width: number;
}

interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

const distanceToBox = (p: Point, b: Box) => Math.hypot(Math.max(Math.abs(p.x - b.x) - b.w / 2, 0), Math.max(Math.abs(p.y - b.y) - b.h / 2, 0));
const boxGap = (a: Box, b: Box) => Math.hypot(Math.max(Math.abs(a.x - b.x) - (a.w + b.w) / 2, 0), Math.max(Math.abs(a.y - b.y) - (a.h + b.h) / 2, 0));

/**
 * @param beads each bead's name and atom indices
 * @param points every atom's drawing position
 * @param labelled whether an atom carries a symbol (its box is wider)
 * @param margin the hull's margin round its atoms
 */
export function placeBeadTags(beads: readonly { name: string; atoms: readonly { index: number }[] }[], points: readonly Point[], labelled: (i: number) => boolean, margin: number): (TagPlacement | null)[] {
  const placed: Box[] = [];
  // Atoms bucketed in one-bond cells, so a candidate is scored against its neighbourhood only.
  const cell = (v: number) => Math.floor(v / BOND);
  const grid = new Map<string, number[]>();
  points.forEach((p, i) => {
    const key = `${cell(p.x)},${cell(p.y)}`;
    grid.set(key, [...(grid.get(key) ?? []), i]);
  });
  const near = (box: Box): number[] => {
    const out: number[] = [];
    for (let gx = cell(box.x - box.w / 2) - 1; gx <= cell(box.x + box.w / 2) + 1; gx++) for (let gy = cell(box.y - box.h / 2) - 1; gy <= cell(box.y + box.h / 2) + 1; gy++) out.push(...(grid.get(`${gx},${gy}`) ?? []));
    return out;
  };
  return beads.map((bead) => {
    const pts = bead.atoms.map((a) => points[a.index]).filter(Boolean);
    if (pts.length === 0) return null;
    const c = centroid(pts);
    const xs = pts.map((p) => p.x);
    const ys = pts.map((p) => p.y);
    const [minX, maxX, minY, maxY] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
    const w = tagWidth(bead.name);
    const gap = margin + BOND * 0.12;
    const candidates: Point[] = [
      { x: c.x, y: minY - gap },
      { x: c.x, y: maxY + gap },
      { x: minX - gap - w / 2, y: c.y },
      { x: maxX + gap + w / 2, y: c.y },
      { x: minX - gap - w / 2 + BOND * 0.2, y: minY - gap },
      { x: maxX + gap + w / 2 - BOND * 0.2, y: minY - gap },
      { x: minX - gap - w / 2 + BOND * 0.2, y: maxY + gap },
      { x: maxX + gap + w / 2 - BOND * 0.2, y: maxY + gap },
    ];
    let best = candidates[0];
    let bestScore = -Infinity;
    for (const p of candidates) {
      const box = { x: p.x, y: p.y, w, h: TAG_HEIGHT };
      let clear = BOND;
      for (const i of near(box)) clear = Math.min(clear, distanceToBox(points[i], box) - (labelled(i) ? BOND * 0.3 : BOND * 0.08));
      for (const other of placed) clear = Math.min(clear, boxGap(box, other) - BOND * 0.05);
      // Enough room is enough: beyond a third of a bond, prefer the earlier (nearer, "above") spot.
      const score = Math.min(clear, BOND * 0.33);
      if (score > bestScore + 1e-9) {
        best = p;
        bestScore = score;
      }
    }
    placed.push({ x: best.x, y: best.y, w, h: TAG_HEIGHT });
    return { x: best.x, y: best.y, width: w };
  });
}
