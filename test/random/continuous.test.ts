// Tests of src/random/distributions.ts: uniform, exponential, normal, gamma against exact
// moments (tolerance Z standard errors) and against jstat CDFs by Kolmogorov-Smirnov.
import { describe, expect, it } from 'vitest';
import { exponential, gamma, normal, uniform } from '../../src/random/index.js';
import { draw, expectMoments, jStat, ksCritical, ksStatistic, testStream } from './helpers.js';

const N = 200_000;
const ALPHA = 0.001;

describe('uniform', () => {
  it('U(2, 5): mean 3.5, variance 0.75 (exact: (b-a)^2/12, mu4 = (b-a)^4/80), all in [2, 5)', () => {
    const s = testStream('uniform');
    const x = draw(N, () => uniform(s, 2, 5));
    expectMoments(x, 3.5, 9 / 12, 81 / 80);
    expect(x.every((v) => v >= 2 && v < 5)).toBe(true);
  });
});

describe('exponential', () => {
  it('mean 7: variance 49, mu4 = 9·mean^4 (exact), KS against the exponential CDF', () => {
    const s = testStream('exponential');
    const x = draw(N, () => exponential(s, 7));
    expectMoments(x, 7, 49, 9 * 7 ** 4);
    expect(ksStatistic(x, (v) => jStat.exponential.cdf(v, 1 / 7))).toBeLessThan(ksCritical(N, ALPHA));
  });
});

describe('normal', () => {
  it('N(10, 3^2): mu4 = 3·sd^4 (exact), KS against the normal CDF', () => {
    const s = testStream('normal');
    const x = draw(N, () => normal(s, 10, 3));
    expectMoments(x, 10, 9, 3 * 81);
    expect(ksStatistic(x, (v) => jStat.normal.cdf(v, 10, 3))).toBeLessThan(ksCritical(N, ALPHA));
  });

  it('defaults to the standard normal', () => {
    const s = testStream('normal-std');
    const x = draw(N, () => normal(s));
    expectMoments(x, 0, 1, 3);
  });
});

describe('gamma', () => {
  // exact: mean k·θ, variance k·θ^2, central 4th moment 3k^2θ^4 + 6kθ^4 (excess kurtosis 6/k).
  const cases: [shape: number, scale: number][] = [[0.5, 1], [3, 1], [3, 2.5]];
  for (const [k, theta] of cases) {
    it(`shape ${k}, scale ${theta}: exact moments and KS against the gamma CDF`, () => {
      const s = testStream(`gamma/${k}/${theta}`);
      const x = draw(N, () => gamma(s, k, theta));
      expectMoments(x, k * theta, k * theta * theta, (3 * k * k + 6 * k) * theta ** 4);
      expect(ksStatistic(x, (v) => jStat.gamma.cdf(v, k, theta))).toBeLessThan(ksCritical(N, ALPHA));
      expect(x.every((v) => v >= 0)).toBe(true);
    });
  }

  it('rejects non-positive shape or scale', () => {
    const s = testStream('gamma-bad');
    expect(() => gamma(s, 0)).toThrow(RangeError);
    expect(() => gamma(s, -1)).toThrow(RangeError);
    expect(() => gamma(s, 2, 0)).toThrow(RangeError);
    expect(() => gamma(s, Number.NaN)).toThrow(RangeError);
  });
});
