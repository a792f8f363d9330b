import { describe, it, expect } from 'vitest';
import { summarize, tHalfWidth, tQuantile } from '../../src/stats/index.js';

describe('tQuantile', () => {
  // Law & Kelton, Simulation Modeling and Analysis, 3rd ed. — Student t, 95 % two-sided
  it.each([
    [4, 2.776445],
    [9, 2.262157],
    [19, 2.093024],
    [29, 2.04523],
  ])('df %i → %f (Law & Kelton, 3rd ed., Student t 95 % two-sided)', (df, expected) => {
    expect(Math.abs(tQuantile(0.975, df) - expected)).toBeLessThan(1e-6);
  });

  it('is symmetric and tends to the normal quantile 1.959964 (exact: t → N(0,1) as df → ∞)', () => {
    expect(tQuantile(0.025, 9)).toBeCloseTo(-2.262157, 6); // Law & Kelton, 3rd ed. (symmetry)
    expect(tQuantile(0.975, Infinity)).toBeCloseTo(1.959964, 6); // exact: normal quantile
    // from memory: t_{0.975, 1000} = 1.962339 (expansion branch) and t_{0.975, 999} just above it.
    expect(tQuantile(0.975, 1000)).toBeCloseTo(1.962339, 6);
    expect(tQuantile(0.975, 999) - tQuantile(0.975, 1000)).toBeGreaterThan(0);
    expect(tQuantile(0.975, 999) - tQuantile(0.975, 1000)).toBeLessThan(1e-5);
    expect(tQuantile(0.975, 1e9)).toBeGreaterThan(tQuantile(0.975, Infinity));
    expect(tQuantile(0.975, 1e9) - tQuantile(0.975, Infinity)).toBeLessThan(1e-8);
  });

  it('rejects p outside (0, 1) and df ≤ 0', () => {
    expect(() => tQuantile(1, 5)).toThrow(RangeError);
    expect(() => tQuantile(0.5, 0)).toThrow(RangeError);
  });
});

describe('summarize', () => {
  const replications = [0.351, 0.367, 0.372, 0.36, 0.358];

  it('matches the worked example: mean 0.361600, s 0.008142, half-width 0.010110 (Law & Kelton, 3rd ed.)', () => {
    const s = summarize(replications);
    expect(s.n).toBe(5);
    expect(s.mean).toBeCloseTo(0.3616, 6);
    expect(s.std).toBeCloseTo(0.008142, 6);
    expect(s.half_width).toBeCloseTo(0.01011, 6);
    expect(tHalfWidth(s.std, s.n, 0.95)).toBeCloseTo(0.01011, 6);
  });

  it('skips NaN samples and does not count them (same worked example, Law & Kelton, 3rd ed.)', () => {
    const s = summarize([NaN, ...replications, NaN]);
    expect(s.n).toBe(5);
    expect(s.half_width).toBeCloseTo(0.01011, 6);
  });

  it('n = 0 → all NaN; n = 1 → std and half-width NaN (exact: undefined sample variance)', () => {
    const empty = summarize([]);
    expect([empty.mean, empty.std, empty.half_width].every(Number.isNaN)).toBe(true);
    expect(empty.n).toBe(0);
    const one = summarize(Float64Array.of(7));
    expect(one.mean).toBe(7);
    expect(Number.isNaN(one.std) && Number.isNaN(one.half_width)).toBe(true);
  });

  it('a higher level widens the interval by the ratio of t quantiles (exact)', () => {
    const s95 = summarize(replications, 0.95);
    const s99 = summarize(replications, 0.99);
    expect(s99.half_width / s95.half_width).toBeCloseTo(tQuantile(0.995, 4) / tQuantile(0.975, 4), 12);
  });
});
