import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { LogLinearHistogram, percentileExact } from '../../src/stats/index.js';

const SEED = 20_250_601;
const value = fc.oneof(
  fc.double({ min: 0, max: 1, noNaN: true }),
  fc.double({ min: 0, max: 1e9, noNaN: true }),
  fc.integer({ min: 0, max: 1000 }),
);
const values = fc.array(value, { minLength: 1, maxLength: 300 });
const subBuckets = fc.constantFrom(1, 2, 16, 128, 1024);
const q = fc.double({ min: 0, max: 1, noNaN: true });

function filled(xs: readonly number[], s: number): LogLinearHistogram {
  const h = new LogLinearHistogram({ subBuckets: s });
  for (const x of xs) h.add(x);
  return h;
}

function ascending(xs: readonly number[]): number[] {
  return [...xs].sort((a, b) => a - b);
}

describe('LogLinearHistogram', () => {
  // The midpoint rule gives half the stated bound: relative 1/(2·subBuckets), absolute below 1.
  it('quantile is within relative 1/subBuckets (plus absolute 1/subBuckets below 1) of the exact nearest-rank percentile — in fact within half that (exact: bucket layout bound)', () => {
    fc.assert(
      fc.property(values, subBuckets, q, (xs, s, level) => {
        const exact = percentileExact(ascending(xs), level);
        const estimate = filled(xs, s).quantile(level);
        expect(Math.abs(estimate - exact)).toBeLessThanOrEqual((exact + 1) / (2 * s) + 1e-12 * exact);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('count, sum, min and max are exact (exact: running totals)', () => {
    fc.assert(
      fc.property(values, (xs) => {
        const h = filled(xs, 64);
        expect(h.count).toBe(xs.length);
        expect(h.min).toBe(Math.min(...xs));
        expect(h.max).toBe(Math.max(...xs));
        const plain = xs.reduce((a, b) => a + b, 0);
        expect(Math.abs(h.sum - plain)).toBeLessThanOrEqual(1e-12 * Math.max(1, plain));
        expect(h.mean()).toBeCloseTo(h.sum / xs.length, 9);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('merging equals adding all values to one histogram (exact: counts add)', () => {
    fc.assert(
      fc.property(values, values, subBuckets, (a, b, s) => {
        const merged = filled(a, s);
        merged.merge(filled(b, s));
        const direct = filled([...a, ...b], s);
        expect(merged.count).toBe(direct.count);
        expect(merged.min).toBe(direct.min);
        expect(merged.max).toBe(direct.max);
        expect(Math.abs(merged.sum - direct.sum)).toBeLessThanOrEqual(1e-12 * Math.max(1, direct.sum));
        for (const level of [0, 0.1, 0.5, 0.9, 0.99, 1]) expect(merged.quantile(level)).toBe(direct.quantile(level));
        expect(merged.cdfPoints(1000)).toEqual(direct.cdfPoints(1000));
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('cdfAt is monotone, 0 below min, 1 at max, and brackets the exact fraction at bucket resolution (exact)', () => {
    fc.assert(
      fc.property(values, fc.array(value, { minLength: 2, maxLength: 20 }), subBuckets, (xs, probes, s) => {
        const h = filled(xs, s);
        const fractionAtMost = (x: number): number => xs.filter((v) => v <= x).length / xs.length;
        let previous = 0;
        for (const x of ascending(probes)) {
          const f = h.cdfAt(x);
          expect(f).toBeGreaterThanOrEqual(previous);
          expect(f).toBeGreaterThanOrEqual(fractionAtMost(x));
          expect(f).toBeLessThanOrEqual(fractionAtMost(x * (1 + 1 / s) + 1 / s));
          previous = f;
        }
        expect(h.cdfAt(h.max)).toBe(1);
        if (h.min > 0) expect(h.cdfAt(h.min / 2)).toBe(0);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('cdfPoints rise to [max, 1] and respect maxPoints (exact)', () => {
    fc.assert(
      fc.property(values, fc.integer({ min: 2, max: 40 }), (xs, maxPoints) => {
        const points = filled(xs, 16).cdfPoints(maxPoints);
        expect(points.length).toBeLessThanOrEqual(maxPoints);
        expect(points.at(-1)).toEqual([Math.max(...xs), 1]);
        for (let i = 1; i < points.length; i++) {
          const [x0, f0] = points[i - 1] as [number, number];
          const [x1, f1] = points[i] as [number, number];
          expect(x1).toBeGreaterThanOrEqual(x0);
          expect(f1).toBeGreaterThan(f0);
        }
      }),
      { seed: SEED, numRuns: 100 },
    );
  });

  it('memory is bounded: the bucket array does not grow with the number of values (exact: fixed layout)', () => {
    const h = new LogLinearHistogram();
    for (let i = 0; i < 50_000; i++) h.add((i % 997) * 1.37);
    const allocated = h.allocatedBuckets;
    for (let i = 0; i < 200_000; i++) h.add(((i * 7) % 997) * 1.37);
    expect(h.allocatedBuckets).toBe(allocated);
    expect(h.count).toBe(250_000);
    // Every power of two up to 2^40 touched: still at most (40 + 2) blocks of 1024 counters.
    for (let e = 0; e <= 40; e++) h.add(2 ** e);
    expect(h.allocatedBuckets).toBeLessThanOrEqual(42 * 1024);
    expect(h.allocatedBuckets).toBe(h.bucketCapacity);
  });

  it('rejects negative, NaN and too-large values, reports NaN when empty, and clears (exact)', () => {
    const h = new LogLinearHistogram({ subBuckets: 8, maxValue: 1000 });
    expect(() => h.add(-1)).toThrow(RangeError);
    expect(() => h.add(NaN)).toThrow(RangeError);
    expect(() => h.add(1001)).toThrow(RangeError);
    expect(() => new LogLinearHistogram({ subBuckets: 3 })).toThrow(RangeError);
    expect(Number.isNaN(h.quantile(0.5))).toBe(true);
    expect(Number.isNaN(h.min) && Number.isNaN(h.max) && Number.isNaN(h.mean())).toBe(true);
    h.add(1000);
    expect(h.quantile(0.5)).toBe(1000); // midpoint 992 of [960, 1024), clamped to [min, max]
    h.addMany([3, 0.25]);
    expect(h.quantile(1)).toBe(992); // midpoint of the bucket [960, 1024) (width 512/8)
    expect(h.quantile(0)).toBe(0.3125); // midpoint of the linear bucket [0.25, 0.375)
    h.clear();
    expect(h.count).toBe(0);
    expect(h.sum).toBe(0);
    expect(h.cdfPoints()).toEqual([]);
    expect(() => h.merge(new LogLinearHistogram({ subBuckets: 16, maxValue: 1000 }))).toThrow(RangeError);
  });
});
