/**
 * A uniform grid over points for "which points lie within r of (x, y)" queries. Built once per
 * replication; queries visit only the cells the disc overlaps, so their cost follows the number of
 * nearby points, not the number of points.
 */
import type { Positions } from './positions.js';

export class PointGrid {
  private readonly cell: number;
  private readonly minX: number;
  private readonly minY: number;
  private readonly columns: number;
  private readonly rows: number;
  /** start[c] … start[c+1]−1 index `members` for grid cell c. */
  private readonly start: Int32Array;
  private readonly members: Int32Array;
  private readonly points: Positions;

  /** `cellSize` in metres (a good choice is the typical query radius). */
  constructor(points: Positions, cellSize: number) {
    if (!(cellSize > 0)) throw new RangeError(`cell size must be positive, got ${cellSize}`);
    this.points = points;
    this.cell = cellSize;
    const n = points.x.length;
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (let i = 0; i < n; i++) {
      const x = points.x[i] as number, y = points.y[i] as number;
      if (x < minX) minX = x;
      if (x > maxX) maxX = x;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
    }
    if (n === 0) minX = minY = maxX = maxY = 0;
    this.minX = minX;
    this.minY = minY;
    // Cap the number of cells so that a tiny cell size over a large area cannot exhaust memory.
    const columns = Math.min(4096, Math.floor((maxX - minX) / cellSize) + 1);
    const rows = Math.min(4096, Math.floor((maxY - minY) / cellSize) + 1);
    this.columns = columns;
    this.rows = rows;
    this.start = new Int32Array(columns * rows + 1);
    this.members = new Int32Array(n);
    const cellOf = new Int32Array(n);
    for (let i = 0; i < n; i++) {
      const c = this.cellIndex(points.x[i] as number, points.y[i] as number);
      cellOf[i] = c;
      this.start[c + 1] = (this.start[c + 1] as number) + 1;
    }
    for (let c = 0; c < columns * rows; c++) this.start[c + 1] = (this.start[c + 1] as number) + (this.start[c] as number);
    const fill = this.start.slice(0, columns * rows);
    for (let i = 0; i < n; i++) {
      const c = cellOf[i] as number;
      this.members[fill[c] as number] = i;
      fill[c] = (fill[c] as number) + 1;
    }
  }

  private column(x: number): number {
    const c = Math.floor((x - this.minX) / this.cell);
    return c < 0 ? 0 : c >= this.columns ? this.columns - 1 : c;
  }

  private row(y: number): number {
    const r = Math.floor((y - this.minY) / this.cell);
    return r < 0 ? 0 : r >= this.rows ? this.rows - 1 : r;
  }

  private cellIndex(x: number, y: number): number {
    return this.row(y) * this.columns + this.column(x);
  }

  /**
   * Calls `visit(index, squaredDistance)` for every point within `radius` of (x, y), in a fixed
   * (deterministic) order: grid rows, then columns, then insertion order.
   */
  forEachWithin(x: number, y: number, radius: number, visit: (index: number, d2: number) => void): void {
    const r2 = radius * radius;
    const c0 = this.column(x - radius), c1 = this.column(x + radius);
    const r0 = this.row(y - radius), r1 = this.row(y + radius);
    const px = this.points.x, py = this.points.y;
    for (let r = r0; r <= r1; r++) {
      for (let c = c0; c <= c1; c++) {
        const cell = r * this.columns + c;
        for (let k = this.start[cell] as number, end = this.start[cell + 1] as number; k < end; k++) {
          const i = this.members[k] as number;
          const dx = (px[i] as number) - x, dy = (py[i] as number) - y;
          const d2 = dx * dx + dy * dy;
          if (d2 <= r2) visit(i, d2);
        }
      }
    }
  }

  private scratchIndex = new Int32Array(64);
  private scratchD2 = new Float64Array(64);
  private scratchCount = 0;
  private readonly collect = (i: number, d2: number): void => {
    if (this.scratchCount === this.scratchIndex.length) {
      const index = new Int32Array(this.scratchCount * 2);
      index.set(this.scratchIndex);
      const dist = new Float64Array(this.scratchCount * 2);
      dist.set(this.scratchD2);
      this.scratchIndex = index;
      this.scratchD2 = dist;
    }
    this.scratchIndex[this.scratchCount] = i;
    this.scratchD2[this.scratchCount] = d2;
    this.scratchCount++;
  };

  /**
   * The (at most) `m` points nearest to (x, y) within `maxRadius`, nearest first (ties by index),
   * written to `outIndex` / `outD2` (squared distances); returns how many. The search radius starts
   * at one grid cell and doubles until m points are inside it, so the cost follows m, not the number
   * of points within maxRadius.
   */
  nearestWithin(x: number, y: number, m: number, maxRadius: number, outIndex: Int32Array, outD2: Float64Array): number {
    let radius = Math.min(this.cell, maxRadius);
    for (;;) {
      this.scratchCount = 0;
      this.forEachWithin(x, y, radius, this.collect);
      if (this.scratchCount >= m || radius >= maxRadius) break;
      radius = Math.min(radius * 2, maxRadius);
    }
    const n = this.scratchCount;
    const order = Array.from({ length: n }, (_, k) => k);
    const d2 = this.scratchD2;
    const index = this.scratchIndex;
    order.sort((a, b) => (d2[a] as number) - (d2[b] as number) || (index[a] as number) - (index[b] as number));
    const count = Math.min(m, n, outIndex.length, outD2.length);
    for (let k = 0; k < count; k++) {
      const j = order[k] as number;
      outIndex[k] = index[j] as number;
      outD2[k] = d2[j] as number;
    }
    return count;
  }
}
