import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { formatTick, linearScale, logScale, logTicks, niceTicks } from '../../src/report/svg/scale.js';

const SEED = 20_260_101;
const HECKBERT = 'Heckbert 1990, Graphics Gems, Nice numbers for graph labels';

/** Mantissa of a positive step, rounded to 9 significant digits. */
function mantissa(step: number): number {
  return Number((step / 10 ** Math.floor(Math.log10(step))).toPrecision(9));
}

describe('niceTicks', () => {
  // Worked by hand with the paper's loose labelling (ntick = 5): range = nicenum(max − min, false),
  // d = nicenum(range / 4, true), ticks from floor(min / d)·d to ceil(max / d)·d.
  it(`[0, 1] → 0, 0.2, …, 1: range 1, d = nicenum(0.25) = 0.2 (${HECKBERT})`, () => {
    expect(niceTicks(0, 1)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
  });

  it(`[0, 30000] → steps of 10000: range nicenum(30000) = 50000, d = nicenum(12500) = 10000 (${HECKBERT})`, () => {
    expect(niceTicks(0, 30000)).toEqual([0, 10000, 20000, 30000]);
  });

  it(`[1.3, 9.7] → 0, 2, …, 10: range nicenum(8.4) = 10, d = nicenum(2.5) = 2 (${HECKBERT})`, () => {
    expect(niceTicks(1.3, 9.7)).toEqual([0, 2, 4, 6, 8, 10]);
  });

  it(`[105, 543] → 100, 200, …, 600: range nicenum(438) = 500, d = nicenum(125) = 100 (${HECKBERT})`, () => {
    expect(niceTicks(105, 543)).toEqual([100, 200, 300, 400, 500, 600]);
  });

  it(`[−0.3, 0.7] → −0.4 … 0.8 by 0.2, exact decimals (${HECKBERT})`, () => {
    expect(niceTicks(-0.3, 0.7)).toEqual([-0.4, -0.2, 0, 0.2, 0.4, 0.6, 0.8]);
  });

  it(`count 11 over [0, 100] → steps of 10: d = nicenum(100 / 10) = 10 (${HECKBERT})`, () => {
    expect(niceTicks(0, 100, 11)).toEqual([0, 10, 20, 30, 40, 50, 60, 70, 80, 90, 100]);
  });

  it('a degenerate range is widened by ±10 % (±1 around 0) before labelling (project rule)', () => {
    expect(niceTicks(5, 5)).toEqual([4.4, 4.6, 4.8, 5, 5.2, 5.4, 5.6]);
    expect(niceTicks(0, 0)).toEqual([-1, -0.5, 0, 0.5, 1]);
    expect(() => niceTicks(0, Number.NaN)).toThrow(RangeError);
    expect(() => niceTicks(0, 1e200)).toThrow(RangeError);
  });

  const bound = fc.oneof(
    fc.double({ min: -1e12, max: 1e12, noNaN: true }),
    fc.double({ min: -1e-6, max: 1e-6, noNaN: true }),
    fc.integer({ min: -1000, max: 1000 }),
  );

  it(`property: increasing, cover [min, max] within one step, step 1, 2 or 5 × 10^k, at most 9 ticks (${HECKBERT})`, () => {
    fc.assert(
      fc.property(bound, bound, (a, b) => {
        const [min, max] = [Math.min(a, b), Math.max(a, b)];
        const t = niceTicks(min, max);
        expect(t.length).toBeGreaterThanOrEqual(2);
        // At most 9: nicenum(R, false) ≤ 2.5·R and d ≥ range/6, so at most 6 steps + rounding at both ends.
        expect(t.length).toBeLessThanOrEqual(9);
        const step = t[1]! - t[0]!;
        expect([1, 2, 5]).toContain(mantissa(step));
        for (let i = 1; i < t.length; i++) {
          expect(t[i]!).toBeGreaterThan(t[i - 1]!);
          expect(Math.abs(t[i]! - t[i - 1]! - step)).toBeLessThanOrEqual(1e-9 * Math.max(step, Math.abs(t[i]!)));
        }
        if (max - min > 1e-10 * Math.max(Math.abs(min), Math.abs(max)) && max - min >= 1e-100) {
          expect(t[0]!).toBeLessThanOrEqual(min);
          expect(t[t.length - 1]!).toBeGreaterThanOrEqual(max);
          expect(t[1]!).toBeGreaterThan(min);
          expect(t[t.length - 2]!).toBeLessThan(max);
        }
      }),
      { seed: SEED, numRuns: 500 },
    );
  });
});

describe('logTicks (common practice: log axes labelled at powers of ten, 2 and 5 between over short ranges)', () => {
  it('whole decades over three or more decades', () => {
    expect(logTicks(1, 1000)).toEqual([1, 10, 100, 1000]);
    expect(logTicks(0.5, 30)).toEqual([0.1, 1, 10, 100]);
    expect(logTicks(1e-5, 1e5)).toEqual([1e-5, 1e-4, 1e-3, 0.01, 0.1, 1, 10, 100, 1000, 1e4, 1e5]);
  });

  it('1, 2, 5 steps over at most two decades, one tick beyond each end', () => {
    expect(logTicks(3, 40)).toEqual([2, 5, 10, 20, 50]);
    expect(logTicks(2, 8)).toEqual([2, 5, 10]);
    expect(logTicks(100, 100)).toEqual([100, 200]);
  });

  it('every 25th power over 200 decades (s = ⌈200 / 8⌉)', () => {
    expect(logTicks(1e-100, 1e100)).toEqual([1e-100, 1e-75, 1e-50, 1e-25, 1, 1e25, 1e50, 1e75, 1e100]);
  });

  it('rejects non-positive bounds', () => {
    expect(() => logTicks(0, 10)).toThrow(RangeError);
    expect(() => logTicks(-1, 10)).toThrow(RangeError);
    expect(() => logTicks(1, Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });

  it('property: increasing, each 1, 2 or 5 × 10^k, enclosing [min, max]', () => {
    const positive = fc.double({ min: 1e-30, max: 1e30, noNaN: true });
    fc.assert(
      fc.property(positive, positive, (a, b) => {
        const t = logTicks(a, b);
        expect(t.length).toBeGreaterThanOrEqual(2);
        expect(t[0]!).toBeLessThanOrEqual(Math.min(a, b));
        expect(t[t.length - 1]!).toBeGreaterThanOrEqual(Math.max(a, b));
        t.forEach((v, i) => {
          expect([1, 2, 5]).toContain(mantissa(v));
          if (i > 0) expect(v).toBeGreaterThan(t[i - 1]!);
        });
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});

describe('linearScale and logScale', () => {
  it('maps the domain ends exactly onto the range ends (exact)', () => {
    const finite = fc.double({ min: -1e9, max: 1e9, noNaN: true });
    fc.assert(
      fc.property(finite, finite, finite, finite, (d0, d1, r0, r1) => {
        fc.pre(d0 !== d1);
        const s = linearScale([d0, d1], [r0, r1]);
        expect(s(d0)).toBe(r0);
        expect(s(d1)).toBe(r1);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('is monotonic, also for an inverted (SVG y) range (exact: an affine map with positive or negative slope)', () => {
    const finite = fc.double({ min: -1e6, max: 1e6, noNaN: true });
    fc.assert(
      fc.property(finite, finite, finite, finite, fc.double({ min: 1, max: 1000, noNaN: true }), (d0, span, a, b, r) => {
        const s = linearScale([d0, d0 + Math.abs(span) + 1], [r, 0]);
        const [lo, hi] = [Math.min(a, b), Math.max(a, b)];
        expect(s(lo)).toBeGreaterThanOrEqual(s(hi));
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('maps interior points proportionally (exact: 3 on [0, 10] → [0, 500] is 150)', () => {
    expect(linearScale([0, 10], [0, 500])(3)).toBe(150);
    expect(linearScale([0, 10], [400, 0])(2.5)).toBe(300);
    expect(() => linearScale([1, 1], [0, 1])).toThrow(RangeError);
  });

  it('log scale spaces decades evenly (exact: log10 turns ratios into differences)', () => {
    const s = logScale([1, 1e4], [0, 400]);
    expect([1, 10, 100, 1000, 1e4].map(s)).toEqual([0, 100, 200, 300, 400]);
    const y = logScale([1e-3, 1e3], [600, 0]);
    expect([1e-3, 0.01, 0.1, 1, 10, 100, 1e3].map(y)).toEqual([600, 500, 400, 300, 200, 100, 0]);
  });

  it('log scale: √10 sits half-way in a decade; x ≤ 0 gives NaN; a non-positive domain is rejected (exact)', () => {
    expect(logScale([1, 10], [0, 100])(Math.sqrt(10))).toBeCloseTo(50, 12);
    expect(logScale([1, 10], [0, 100])(0)).toBeNaN();
    expect(logScale([1, 10], [0, 100])(-5)).toBeNaN();
    expect(() => logScale([0, 10], [0, 1])).toThrow(RangeError);
  });
});

describe('formatTick (project convention from the design brief; k, M, G are the SI prefixes, BIPM SI Brochure 9th ed. Table 7)', () => {
  it.each([
    [0, '0'],
    [-0, '0'],
    [1, '1'],
    [0.2, '0.2'],
    [0.001, '0.001'],
    [1e-5, '1e-5'],
    [2.5e-4, '2.5e-4'],
    [500, '500'],
    [1000, '1k'],
    [1250, '1.25k'],
    [30000, '30k'],
    [-1500, '\u22121.5k'],
    [2.5e6, '2.5M'],
    [1e9, '1G'],
    [1e12, '1e12'],
    [0.1 + 0.2, '0.3'],
  ])('%s → %s', (x, label) => {
    expect(formatTick(x)).toBe(label);
  });

  it('property: distinct ticks get distinct labels (a label is never repeated on one axis)', () => {
    const bound = fc.double({ min: -1e11, max: 1e11, noNaN: true });
    fc.assert(
      fc.property(bound, bound, (a, b) => {
        const labels = niceTicks(a, b).map(formatTick);
        expect(new Set(labels).size).toBe(labels.length);
        for (const l of labels) expect(l).toMatch(/^\u2212?\d+(\.\d+)?(k|M|G|e-?\d+)?$/);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});
