/**
 * A uniform grid of 2D points with cells `clear` wide, so that the points within `clear` of a point
 * are found in the 3 × 3 cells around it (constant time per point instead of a pass over all atoms).
 */

export interface XY {
  x: number;
  y: number;
}

export class PointGrid {
  private readonly cells = new Map<number, number[]>();
  private readonly points: XY[] = [];

  constructor(readonly clear: number) {}

  private key(cx: number, cy: number): number {
    // Cells are numbered on a 2^20-wide square; drawings are a few thousand bond lengths at most.
    return (cx + 524_288) * 1_048_576 + (cy + 524_288);
  }

  add(p: XY, id = this.points.length): void {
    this.points[id] = p;
    const k = this.key(Math.floor(p.x / this.clear), Math.floor(p.y / this.clear));
    const list = this.cells.get(k);
    if (list) list.push(id);
    else this.cells.set(k, [id]);
  }

  /** Ids of the stored points closer than `clear` to p. */
  near(p: XY, out: number[] = []): number[] {
    const cx = Math.floor(p.x / this.clear);
    const cy = Math.floor(p.y / this.clear);
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++) {
        const list = this.cells.get(this.key(cx + dx, cy + dy));
        if (list) for (const id of list) if (Math.hypot(this.points[id].x - p.x, this.points[id].y - p.y) < this.clear) out.push(id);
      }
    return out;
  }

  /** Σ (clear − d)² over every stored point closer than `clear` to one of `at`. */
  crowding(at: readonly XY[]): number {
    let total = 0;
    for (const p of at) {
      const cx = Math.floor(p.x / this.clear);
      const cy = Math.floor(p.y / this.clear);
      for (let dx = -1; dx <= 1; dx++)
        for (let dy = -1; dy <= 1; dy++) {
          const list = this.cells.get(this.key(cx + dx, cy + dy));
          if (!list) continue;
          for (const id of list) {
            const d = Math.hypot(this.points[id].x - p.x, this.points[id].y - p.y);
            if (d < this.clear) total += (this.clear - d) ** 2;
          }
        }
    }
    return total;
  }
}
