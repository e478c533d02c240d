import type { Point } from './hull';

/**
 * Where to draw a heavy atom's hydrogens when they are shown: in the widest gaps between its
 * bonds, one at a time, so they never sit on a bond. Returns unit directions.
 */
export function hydrogenDirections(centre: Point, neighbours: readonly Point[], count: number): Point[] {
  if (count <= 0) return [];
  const taken = neighbours.map((n) => Math.atan2(n.y - centre.y, n.x - centre.x));
  if (taken.length === 0) taken.push(Math.PI); // a lone atom: start from the left
  const placed: number[] = [];
  const start = neighbours.length === 0 ? 1 : 0;
  if (neighbours.length === 0) placed.push(Math.PI);
  for (let i = start; i < count; i++) {
    const angles = [...taken, ...placed].sort((a, b) => a - b);
    let best = 0;
    let bestGap = -1;
    for (let k = 0; k < angles.length; k++) {
      const a = angles[k];
      const b = k + 1 < angles.length ? angles[k + 1] : angles[0] + 2 * Math.PI;
      if (b - a > bestGap + 1e-9) {
        bestGap = b - a;
        best = a + (b - a) / 2;
      }
    }
    placed.push(best);
  }
  return placed.map((a) => ({ x: Math.cos(a), y: Math.sin(a) }));
}
