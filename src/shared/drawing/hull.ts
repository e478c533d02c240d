/**
 * Bead hulls: the soft outline drawn around a bead's atoms.
 *
 * The outline is the Minkowski sum of the atoms' convex hull with a disc of radius r: straight
 * edges offset outward by r, joined by arcs of radius r around each hull vertex. That shape is
 * convex, has no corners, contains every atom with at least r to spare, and reduces to a circle
 * for one atom and a capsule for two — so a bead always reads as one smooth blob.
 */

export interface Point {
  x: number;
  y: number;
}

const cross = (o: Point, a: Point, b: Point) => (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);

/** Convex hull (Andrew's monotone chain), counter-clockwise in a y-up frame; collinear points dropped. */
export function convexHull(points: readonly Point[]): Point[] {
  const unique = dedupe(points);
  if (unique.length < 3) return unique;
  const sorted = [...unique].sort((p, q) => p.x - q.x || p.y - q.y);
  const lower: Point[] = [];
  for (const p of sorted) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: Point[] = [];
  for (const p of [...sorted].reverse()) {
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  const hull = lower.slice(0, -1).concat(upper.slice(0, -1));
  return hull.length >= 3 ? hull : [sorted[0], sorted[sorted.length - 1]];
}

function dedupe(points: readonly Point[]): Point[] {
  const seen = new Set<string>();
  const out: Point[] = [];
  for (const p of points) {
    const key = `${p.x.toFixed(6)},${p.y.toFixed(6)}`;
    if (!seen.has(key)) {
      seen.add(key);
      out.push(p);
    }
  }
  return out;
}

const f = (n: number) => Number(n.toFixed(2));

/** An SVG path for the rounded hull of `points` with margin `r`; '' for no points. */
export function hullPath(points: readonly Point[], r: number): string {
  const hull = convexHull(points);
  if (hull.length === 0) return '';
  if (hull.length === 1) {
    const { x, y } = hull[0];
    return `M${f(x - r)},${f(y)}A${r},${r} 0 1 0 ${f(x + r)},${f(y)}A${r},${r} 0 1 0 ${f(x - r)},${f(y)}Z`;
  }
  // For each edge i → i+1, the outward normal; the path runs along offset edges and arcs around vertices.
  const n = hull.length;
  const normals = hull.map((p, i) => {
    const q = hull[(i + 1) % n];
    const len = Math.hypot(q.x - p.x, q.y - p.y) || 1;
    // Hull is counter-clockwise in y-up terms (cross > 0), so the outward normal is (dy, -dx).
    return { x: (q.y - p.y) / len, y: -(q.x - p.x) / len };
  });
  let d = '';
  for (let i = 0; i < n; i++) {
    const p = hull[i];
    const q = hull[(i + 1) % n];
    const nm = normals[i];
    const start = { x: p.x + nm.x * r, y: p.y + nm.y * r };
    const end = { x: q.x + nm.x * r, y: q.y + nm.y * r };
    d += i === 0 ? `M${f(start.x)},${f(start.y)}` : '';
    d += `L${f(end.x)},${f(end.y)}`;
    const next = normals[(i + 1) % n];
    const arcEnd = { x: q.x + next.x * r, y: q.y + next.y * r };
    // The hull winds toward increasing angle in raw coordinates, and so does the arc round each
    // vertex: SVG's sweep flag 1 ("positive-angle direction"), whichever way the y axis points.
    d += `A${r},${r} 0 0 1 ${f(arcEnd.x)},${f(arcEnd.y)}`;
  }
  return `${d}Z`;
}

/** The mean of the points: where a bead's name and its graph node go. */
export function centroid(points: readonly Point[]): Point {
  if (points.length === 0) return { x: 0, y: 0 };
  const s = points.reduce((acc, p) => ({ x: acc.x + p.x, y: acc.y + p.y }), { x: 0, y: 0 });
  return { x: s.x / points.length, y: s.y / points.length };
}

/** Whether a point lies within distance r of the convex hull of `points` (hit-testing a hull). */
export function withinHull(point: Point, points: readonly Point[], r: number): boolean {
  const hull = convexHull(points);
  if (hull.length === 0) return false;
  if (hull.length >= 3 && hull.every((p, i) => cross(p, hull[(i + 1) % hull.length], point) >= 0)) return true;
  return hull.some((p, i) => segmentDistance(point, p, hull[(i + 1) % hull.length]) <= r);
}

function segmentDistance(p: Point, a: Point, b: Point): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
  return Math.hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy));
}
