// Tests of src/random/distributions.ts: beta.
import { describe, expect, it } from 'vitest';
import { beta } from '../../src/random/index.js';
import { draw, expectMoments, jStat, ksCritical, ksStatistic, testStream } from './helpers.js';

const N = 200_000;

/** Exact central 4th moment of Beta(a, b) from its variance and excess kurtosis. */
function betaMu4(a: number, b: number): number {
  const s = a + b;
  const v = (a * b) / (s * s * (s + 1));
  const excess = (6 * ((a - b) ** 2 * (s + 1) - a * b * (s + 2))) / (a * b * (s + 2) * (s + 3));
  return v * v * (3 + excess);
}

describe('beta', () => {
  it('Beta(3,4) over a 10 s window: mean 4.285714 s, sd 1.749636 s', () => {
    // Source: reference-values.md §5 / 3GPP TR 37.868 model 2 (exact Beta moments):
    // "Beta(3,4) over 10 s (exact): mean 4.285714 s, sd 1.749636 s".
    const s = testStream('beta-3-4-window');
    const seconds = draw(N, () => 10 * beta(s, 3, 4));
    const sd = 1.749636;
    expectMoments(seconds, 4.285714, sd * sd, 1e4 * betaMu4(3, 4));
  });

  it('Beta(3,4): mean 3/7, sd 0.174964, and KS against jstat.beta.cdf at alpha = 0.001', () => {
    // exact: mean a/(a+b) = 0.428571, variance ab/((a+b)^2 (a+b+1)) = 0.0306122.
    const s = testStream('beta-3-4');
    const x = draw(N, () => beta(s, 3, 4));
    expectMoments(x, 3 / 7, 12 / (49 * 8), betaMu4(3, 4));
    expect(Math.abs(Math.sqrt(12 / (49 * 8)) - 0.174964)).toBeLessThan(1e-6);
    expect(ksStatistic(x, (v) => jStat.beta.cdf(v, 3, 4))).toBeLessThan(ksCritical(N, 0.001));
  });

  it('small shapes Beta(0.5, 0.2) stay in [0, 1] with exact moments and KS', () => {
    const s = testStream('beta-small');
    const x = draw(N, () => beta(s, 0.5, 0.2));
    expect(x.every((v) => v >= 0 && v <= 1)).toBe(true);
    const sum = 0.7;
    expectMoments(x, 0.5 / sum, (0.5 * 0.2) / (sum * sum * (sum + 1)), betaMu4(0.5, 0.2));
    expect(ksStatistic(x, (v) => jStat.beta.cdf(v, 0.5, 0.2))).toBeLessThan(ksCritical(N, 0.001));
  });

  it('very small shapes give no NaN', () => {
    const s = testStream('beta-tiny');
    const x = draw(10_000, () => beta(s, 0.01, 0.02));
    expect(x.every((v) => v >= 0 && v <= 1)).toBe(true);
  });

  it('rejects non-positive parameters', () => {
    const s = testStream('beta-bad');
    expect(() => beta(s, 0, 1)).toThrow(RangeError);
    expect(() => beta(s, 1, -2)).toThrow(RangeError);
  });
});
