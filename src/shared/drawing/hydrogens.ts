import type { Point } from './hull';

/**
 * Where to draw a heavy atom's hydrogens when they are shown: spread through the gaps between
 * its bonds, each gap taking hydrogens in proportion to its width, so none sits on a bond.
 * Returns unit directions.
 */
export function hydrogenDirections(centre: Point, neighbours: readonly Point[], count: number): Point[] {
  if (count <= 0) return [];
  if (neighbours.length === 0) {
    return Array.from({ length: count }, (_, i) => unit(Math.PI + (2 * Math.PI * i) / count));
  }
  const angles = neighbours.map((n) => Math.atan2(n.y - centre.y, n.x - centre.x)).sort((a, b) => a - b);
  const gaps = angles.map((a, k) => ({ start: a, width: (k + 1 < angles.length ? angles[k + 1] : angles[0] + 2 * Math.PI) - a, take: 0 }));
  for (let i = 0; i < count; i++) {
    const roomiest = gaps.reduce((best, g) => (g.width / (g.take + 1) > best.width / (best.take + 1) ? g : best));
    roomiest.take++;
  }
  return gaps.flatMap((g) => Array.from({ length: g.take }, (_, j) => unit(g.start + (g.width * (j + 1)) / (g.take + 1))));
}

const unit = (angle: number): Point => ({ x: Math.cos(angle), y: Math.sin(angle) });
