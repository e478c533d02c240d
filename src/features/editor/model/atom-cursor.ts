import type { Point } from '../../../shared/drawing/hull';

/**
 * Keyboard travel over the drawing: an arrow key moves the atom cursor to the bonded neighbour
 * that lies most nearly in the arrow's direction; with no bonded atom that way (within 60°), to
 * the nearest atom of the whole drawing that way. So every atom is reachable without a mouse.
 */
export type Direction = 'left' | 'right' | 'up' | 'down';

const VECTORS: Record<Direction, Point> = { left: { x: -1, y: 0 }, right: { x: 1, y: 0 }, up: { x: 0, y: -1 }, down: { x: 0, y: 1 } };
const COS_60 = 0.5;

export function nextAtom(points: readonly Point[], neighbours: readonly (readonly number[])[], from: number, direction: Direction): number {
  const v = VECTORS[direction];
  const score = (to: number) => {
    const dx = points[to].x - points[from].x;
    const dy = points[to].y - points[from].y;
    const len = Math.hypot(dx, dy);
    if (len === 0) return null;
    const cos = (dx * v.x + dy * v.y) / len;
    return cos >= COS_60 ? { cos, len } : null;
  };
  let best: number | null = null;
  let bestCos = -1;
  for (const n of neighbours[from] ?? []) {
    const s = score(n);
    if (s && s.cos > bestCos) {
      best = n;
      bestCos = s.cos;
    }
  }
  if (best !== null) return best;
  let bestDistance = Infinity;
  for (let i = 0; i < points.length; i++) {
    if (i === from) continue;
    const s = score(i);
    // Prefer atoms close to the arrow's line: distance grows as the angle widens.
    if (s && s.len / s.cos < bestDistance) {
      bestDistance = s.len / s.cos;
      best = i;
    }
  }
  return best ?? from;
}
