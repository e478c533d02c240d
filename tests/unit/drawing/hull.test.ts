import { describe, expect, it } from 'vitest';
import { centroid, convexHull, hullPath, withinHull, type Point } from '../../../src/shared/drawing/hull';

// Hand-worked shapes: a unit square, a line of three atoms, a single atom.

const square: Point[] = [
  { x: 0, y: 0 },
  { x: 1, y: 0 },
  { x: 1, y: 1 },
  { x: 0, y: 1 },
  { x: 0.5, y: 0.5 },
];

/** Parses "M x,y L x,y A r,r 0 0 s x,y …" into commands with their numbers. */
function commands(path: string): { cmd: string; nums: number[] }[] {
  return [...path.matchAll(/([MLAZ])([^MLAZ]*)/g)].map((m) => ({
    cmd: m[1],
    nums: m[2].split(/[ ,]+/).filter(Boolean).map(Number),
  }));
}

describe('convexHull', () => {
  it('drops interior and duplicate points', () => {
    const hull = convexHull([...square, { x: 1, y: 1 }]);
    expect(hull).toHaveLength(4);
    expect(hull).not.toContainEqual({ x: 0.5, y: 0.5 });
  });

  it('keeps only the ends of collinear points', () => {
    const hull = convexHull([{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0 }]);
    expect(hull).toEqual([{ x: 0, y: 0 }, { x: 2, y: 0 }]);
  });
});

describe('hullPath', () => {
  it('is empty without points and a circle for one atom', () => {
    expect(hullPath([], 1)).toBe('');
    const parts = commands(hullPath([{ x: 3, y: 4 }], 2));
    expect(parts[0]).toEqual({ cmd: 'M', nums: [1, 4] });
    expect(parts.filter((p) => p.cmd === 'A')).toHaveLength(2);
  });

  it('offsets every edge outward by r and rounds each corner outward', () => {
    const r = 0.25;
    const parts = commands(hullPath(square, r));
    const c = centroid(square.slice(0, 4));
    let current = { x: parts[0].nums[0], y: parts[0].nums[1] };
    let arcs = 0;
    for (const { cmd, nums } of parts.slice(1)) {
      if (cmd === 'L') {
        // Every line end sits r outside the square, on one of its sides.
        const [x, y] = nums;
        const outside = Math.max(-x, x - 1, -y, y - 1);
        expect(outside).toBeCloseTo(r, 6);
        current = { x, y };
      }
      if (cmd === 'A') {
        arcs++;
        const [rx, , , large, sweep, x, y] = nums;
        expect(rx).toBe(r);
        expect(large).toBe(0);
        // The arc's centre is the square's corner nearest both ends; its midpoint, taken in the
        // direction the sweep flag says, must lie farther out than the corner itself.
        const corner = { x: Math.round((current.x + x) / 2), y: Math.round((current.y + y) / 2) };
        const a0 = Math.atan2(current.y - corner.y, current.x - corner.x);
        const a1 = Math.atan2(y - corner.y, x - corner.x);
        let delta = a1 - a0;
        if (sweep === 1) delta = ((delta % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
        else delta = -((((-delta) % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI));
        const mid = { x: corner.x + r * Math.cos(a0 + delta / 2), y: corner.y + r * Math.sin(a0 + delta / 2) };
        expect(Math.abs(delta)).toBeCloseTo(Math.PI / 2, 6);
        expect(Math.hypot(mid.x - c.x, mid.y - c.y)).toBeGreaterThan(Math.hypot(corner.x - c.x, corner.y - c.y));
        current = { x, y };
      }
    }
    expect(arcs).toBe(4);
  });
});

describe('withinHull', () => {
  it('hits inside the hull and within the margin, not beyond it', () => {
    expect(withinHull({ x: 0.5, y: 0.5 }, square, 0.2)).toBe(true);
    expect(withinHull({ x: 1.15, y: 0.5 }, square, 0.2)).toBe(true);
    expect(withinHull({ x: 1.3, y: 0.5 }, square, 0.2)).toBe(false);
    expect(withinHull({ x: 1.1, y: 0 }, [{ x: 0, y: 0 }, { x: 1, y: 0 }], 0.2)).toBe(true);
    expect(withinHull({ x: 0.5, y: 0.3 }, [{ x: 0, y: 0 }, { x: 1, y: 0 }], 0.2)).toBe(false);
  });
});
