import { describe, it, expect } from 'vitest';
import { relativePrecisionReached, replicationsNeeded, tQuantile } from '../../src/stats/index.js';

/** t_{n−1} · s/√n / |mean| — the left side of the rule, written out independently. */
function relative(n: number, mean: number, s: number): number {
  return (tQuantile(0.975, n - 1) * s) / Math.sqrt(n) / Math.abs(mean);
}

describe('replicationsNeeded', () => {
  it('pilot mean 0.36, s 0.05, γ = 0.05 at 95 % → 36 replications (Law & Kelton, 3rd ed., relative precision)', () => {
    expect(replicationsNeeded(0.36, 0.05, 0.05, 0.95)).toBe(36);
    // 35 fails the rule t·s/√n / |mean| ≤ γ/(1+γ), 36 meets it.
    expect(relative(35, 0.36, 0.05)).toBeGreaterThan(0.05 / 1.05);
    expect(relative(36, 0.36, 0.05)).toBeLessThanOrEqual(0.05 / 1.05);
  });

  it('respects nMin and degenerate pilots (exact)', () => {
    expect(replicationsNeeded(0.36, 0.05, 0.05, 0.95, 50)).toBe(50);
    expect(replicationsNeeded(1, 0, 0.05, 0.95)).toBe(2);
    expect(replicationsNeeded(0, 1, 0.05, 0.95)).toBe(Infinity);
  });

  it('finds the smallest n for a demanding target (Law & Kelton, 3rd ed., relative precision)', () => {
    const n = replicationsNeeded(1, 1, 0.01, 0.95);
    expect(relative(n, 1, 1)).toBeLessThanOrEqual(0.01 / 1.01);
    expect(relative(n - 1, 1, 1)).toBeGreaterThan(0.01 / 1.01);
  });
});

describe('relativePrecisionReached', () => {
  // Worked example (Law & Kelton, 3rd ed.): mean 0.361600, half-width 0.010110 → relative 0.027959.
  const replications = [0.351, 0.367, 0.372, 0.36, 0.358];

  it('accepts γ = 0.05 (limit 0.047619 > 0.027959) and rejects γ = 0.02 (limit 0.019608) (Law & Kelton, 3rd ed.)', () => {
    expect(relativePrecisionReached(replications, 0.05, 0.95)).toBe(true);
    expect(relativePrecisionReached(replications, 0.02, 0.95)).toBe(false);
    // Boundary: γ with γ/(1+γ) just above / below 0.010110/0.361600.
    const r = 0.01011 / 0.3616;
    expect(relativePrecisionReached(replications, (r * 1.001) / (1 - r * 1.001), 0.95)).toBe(true);
    expect(relativePrecisionReached(replications, (r * 0.999) / (1 - r * 0.999), 0.95)).toBe(false);
  });

  it('needs at least two finite samples (exact: no variance estimate otherwise)', () => {
    expect(relativePrecisionReached([1], 0.5, 0.95)).toBe(false);
    expect(relativePrecisionReached([1, NaN], 0.5, 0.95)).toBe(false);
    expect(relativePrecisionReached([2, 2, 2], 0.01, 0.95)).toBe(true);
  });
});
