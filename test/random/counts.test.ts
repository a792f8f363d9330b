// Tests of src/random/counts.ts and distributions.ts: bernoulli, poisson, binomial, geometricTrials,
// against exact moments (Z standard errors) and chi-square fits to the exact pmf (alpha = 0.001).
import { describe, expect, it } from 'vitest';
import { bernoulli, binomial, geometricTrials, poisson } from '../../src/random/index.js';
import { chiSquare, draw, expectMoments, jStat, testStream, Z } from './helpers.js';

const N = 200_000;
const ALPHA = 0.001;

/** exact: Poisson pmf e^-m m^k / k!, in log space (ln Γ from jstat). */
const poissonPmf = (m: number) => (k: number) => Math.exp(-m + k * Math.log(m) - jStat.gammaln(k + 1));

/** exact: binomial pmf C(n,k) p^k (1-p)^(n-k), in log space. */
const binomialPmf = (n: number, p: number) => (k: number) =>
  Math.exp(jStat.gammaln(n + 1) - jStat.gammaln(k + 1) - jStat.gammaln(n - k + 1) + k * Math.log(p) + (n - k) * Math.log1p(-p));

function expectFit(x: Float64Array, pmf: (k: number) => number, lo: number, hi: number): void {
  const { stat, dof } = chiSquare(x, pmf, lo, hi);
  expect(dof).toBeGreaterThan(0);
  expect(stat).toBeLessThan(jStat.chisquare.inv(1 - ALPHA, dof));
}

describe('bernoulli', () => {
  it('p = 0.3: success frequency within Z·sqrt(p(1-p)/n) (exact)', () => {
    const s = testStream('bernoulli');
    let hits = 0;
    for (let i = 0; i < N; i++) if (bernoulli(s, 0.3)) hits++;
    expect(Math.abs(hits / N - 0.3)).toBeLessThan(Z * Math.sqrt((0.3 * 0.7) / N));
  });

  it('p = 0 never and p = 1 always succeeds', () => {
    const s = testStream('bernoulli-edges');
    for (let i = 0; i < 1000; i++) {
      expect(bernoulli(s, 0)).toBe(false);
      expect(bernoulli(s, 1)).toBe(true);
    }
  });
});

describe('poisson', () => {
  // exact: mean m, variance m, central 4th moment m(1 + 3m).
  const cases: [mean: number, lo: number, hi: number][] = [[0.5, 0, 8], [4, 0, 20], [50, 20, 85], [1000, 850, 1150]];
  for (const [m, lo, hi] of cases) {
    it(`mean ${m}: exact moments and chi-square fit`, () => {
      const s = testStream(`poisson/${m}`);
      const x = draw(N, () => poisson(s, m));
      expectMoments(x, m, m, m * (1 + 3 * m));
      expectFit(x, poissonPmf(m), lo, hi);
    });
  }

  it('mean 0 gives 0; negative or non-finite means throw', () => {
    const s = testStream('poisson-edges');
    expect(poisson(s, 0)).toBe(0);
    expect(() => poisson(s, -1)).toThrow(RangeError);
    expect(() => poisson(s, Infinity)).toThrow(RangeError);
  });
});

describe('binomial', () => {
  // exact: mean np, variance npq, central 4th moment npq(1 + 3pq(n-2)).
  const cases: [n: number, p: number, lo: number, hi: number][] = [
    [10, 0.3, 0, 10], [1_000_000, 1e-4, 55, 150], [1000, 0.5, 430, 570], [40, 0.85, 20, 40],
  ];
  for (const [n, p, lo, hi] of cases) {
    it(`n = ${n}, p = ${p}: exact moments and chi-square fit`, () => {
      const s = testStream(`binomial/${n}/${p}`);
      const x = draw(N, () => binomial(s, n, p));
      const v = n * p * (1 - p);
      expectMoments(x, n * p, v, v * (1 + 3 * p * (1 - p) * (n - 2)));
      expectFit(x, binomialPmf(n, p), lo, hi);
      expect(x.every((k) => Number.isInteger(k) && k >= 0 && k <= n)).toBe(true);
    });
  }

  it('edge cases and domain', () => {
    const s = testStream('binomial-edges');
    expect(binomial(s, 0, 0.5)).toBe(0);
    expect(binomial(s, 17, 0)).toBe(0);
    expect(binomial(s, 17, 1)).toBe(17);
    expect(() => binomial(s, -1, 0.5)).toThrow(RangeError);
    expect(() => binomial(s, 2.5, 0.5)).toThrow(RangeError);
    expect(() => binomial(s, 10, 1.2)).toThrow(RangeError);
  });
});

describe('geometricTrials', () => {
  it('p = 0.2, no practical cap: mean 1/p = 5, variance (1-p)/p^2 = 20 (exact)', () => {
    // exact: central 4th moment sigma^4 (9 + p^2/(1-p)) (excess kurtosis 6 + p^2/(1-p)).
    const p = 0.2;
    const s = testStream('geometric');
    const x = draw(N, () => geometricTrials(s, p, 1000));
    const v = (1 - p) / (p * p);
    expectMoments(x, 1 / p, v, v * v * (9 + (p * p) / (1 - p)));
  });

  it('p = 0.1, max = 10: P(k) = 0.9^(k-1)·0.1 for k <= 10 and P(11) = 0.9^10 (exact), chi-square fit', () => {
    const s = testStream('geometric-capped');
    const x = draw(N, () => geometricTrials(s, 0.1, 10));
    expect(x.every((k) => Number.isInteger(k) && k >= 1 && k <= 11)).toBe(true);
    const pmf = (k: number) => (k === 0 ? 0 : k <= 10 ? 0.9 ** (k - 1) * 0.1 : k === 11 ? 0.9 ** 10 : 0);
    expectFit(x, pmf, 1, 11);
  });

  it('p = 1 gives 1, p = 0 gives max + 1, bad arguments throw', () => {
    const s = testStream('geometric-edges');
    expect(geometricTrials(s, 1, 5)).toBe(1);
    expect(geometricTrials(s, 0, 5)).toBe(6);
    expect(() => geometricTrials(s, 1.5, 5)).toThrow(RangeError);
    expect(() => geometricTrials(s, 0.5, -1)).toThrow(RangeError);
  });
});
