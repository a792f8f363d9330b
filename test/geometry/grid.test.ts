/**
 * PointGrid queries against brute force (common practice: a spatial index must return exactly what
 * a scan of all points returns).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { PointGrid } from '../../src/geometry/grid.js';

const pointsArb = fc.array(fc.tuple(fc.double({ min: -500, max: 500, noNaN: true }), fc.double({ min: -500, max: 500, noNaN: true })), {
  minLength: 1,
  maxLength: 200,
});

describe('PointGrid', () => {
  it('forEachWithin visits exactly the points within the radius', () => {
    fc.assert(
      fc.property(pointsArb, fc.double({ min: 1, max: 300, noNaN: true }), fc.double({ min: 0, max: 400, noNaN: true }), (pts, cell, r) => {
        const positions = { x: Float64Array.from(pts.map((p) => p[0])), y: Float64Array.from(pts.map((p) => p[1])) };
        const grid = new PointGrid(positions, cell);
        const [qx, qy] = pts[0]!;
        const seen: number[] = [];
        grid.forEachWithin(qx, qy, r, (i) => seen.push(i));
        const expected = pts.flatMap(([x, y], i) => ((x - qx) ** 2 + (y - qy) ** 2 <= r * r ? [i] : []));
        expect(seen.sort((a, b) => a - b)).toEqual(expected);
      }),
      { seed: 31, numRuns: 200 },
    );
  });

  it('nearestWithin returns the m nearest within the radius, nearest first (ties by index)', () => {
    fc.assert(
      fc.property(pointsArb, fc.integer({ min: 1, max: 40 }), fc.double({ min: 1, max: 1500, noNaN: true }), (pts, m, maxR) => {
        const positions = { x: Float64Array.from(pts.map((p) => p[0])), y: Float64Array.from(pts.map((p) => p[1])) };
        const grid = new PointGrid(positions, 50);
        const index = new Int32Array(m);
        const d2 = new Float64Array(m);
        const n = grid.nearestWithin(10, -20, m, maxR, index, d2);
        const expected = pts
          .map(([x, y], i) => ({ i, d: (x - 10) ** 2 + (y + 20) ** 2 }))
          .filter((p) => p.d <= maxR * maxR)
          .sort((a, b) => a.d - b.d || a.i - b.i)
          .slice(0, m);
        expect(Array.from(index.slice(0, n))).toEqual(expected.map((p) => p.i));
      }),
      { seed: 32, numRuns: 200 },
    );
  });
});
