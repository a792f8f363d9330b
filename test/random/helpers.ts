/** Shared statistics helpers for the random-layer tests (not a test file itself). */
import { createRequire } from 'node:module';
import { expect } from 'vitest';
import { replicationSeed, StreamSet } from '../../src/random/index.js';
import type { Stream } from '../../src/random/index.js';

/** The part of jstat these tests use: CDFs and quantiles only, never its samplers. */
interface JStatLite {
  beta: { cdf(x: number, a: number, b: number): number };
  gamma: { cdf(x: number, shape: number, scale: number): number };
  normal: { cdf(x: number, mean: number, sd: number): number };
  exponential: { cdf(x: number, rate: number): number };
  chisquare: { inv(p: number, dof: number): number };
  gammaln(x: number): number;
}

const require = createRequire(import.meta.url);
export const jStat = require('jstat') as JStatLite;

/** A fixed-seed stream for statistical checks, derived through the public API. */
export function testStream(name: string): Stream {
  return new StreamSet(replicationSeed('jostle-random-tests', null, 0)).stream(name);
}

export function draw(n: number, f: () => number): Float64Array {
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = f();
  return x;
}

export function mean(x: Float64Array): number {
  let s = 0;
  for (const v of x) s += v;
  return s / x.length;
}

/** Unbiased sample variance. */
export function variance(x: Float64Array): number {
  const m = mean(x);
  let s = 0;
  for (const v of x) s += (v - m) * (v - m);
  return s / (x.length - 1);
}

/** Number of standard errors allowed in moment checks (two-sided p ≈ 6e-5 each). */
export const Z = 4;

/**
 * Sample mean within Z standard errors of `mu` and sample variance within Z standard
 * errors of `sigma2`; SE(variance) = sqrt((mu4 - sigma2^2) / n), mu4 the exact
 * central fourth moment (large-sample standard error, common practice).
 */
export function expectMoments(x: Float64Array, mu: number, sigma2: number, mu4: number): void {
  const n = x.length;
  expect(Math.abs(mean(x) - mu)).toBeLessThan(Z * Math.sqrt(sigma2 / n));
  expect(Math.abs(variance(x) - sigma2)).toBeLessThan(Z * Math.sqrt((mu4 - sigma2 * sigma2) / n));
}

/** Kolmogorov-Smirnov statistic sup |F_n - F| of a sample against a continuous CDF. */
export function ksStatistic(x: Float64Array, cdf: (v: number) => number): number {
  const sorted = Float64Array.from(x).sort();
  const n = sorted.length;
  let d = 0;
  for (let i = 0; i < n; i++) {
    const f = cdf(sorted[i] as number);
    d = Math.max(d, (i + 1) / n - f, f - i / n);
  }
  return d;
}

/**
 * KS critical value at level alpha for large n: sqrt(-ln(alpha/2)/2)/sqrt(n)
 * (Kolmogorov's limiting distribution; 1.9495/sqrt(n) at alpha = 0.001).
 */
export function ksCritical(n: number, alpha: number): number {
  return Math.sqrt(-Math.log(alpha / 2) / 2) / Math.sqrt(n);
}

/**
 * Pearson chi-square goodness of fit of integer samples to a pmf with support in
 * [0, ∞): values below lo are counted in cell lo and values above hi in cell hi (their
 * expected counts include the tail masses), then neighbouring cells are merged left to
 * right until each expects at least 5. Returns the statistic and dof = cells - 1.
 */
export function chiSquare(x: Float64Array, pmf: (k: number) => number, lo: number, hi: number): { stat: number; dof: number } {
  const n = x.length;
  const observed = new Float64Array(hi - lo + 1);
  for (const v of x) observed[Math.min(Math.max(v, lo), hi) - lo]! += 1;
  const expected = new Float64Array(hi - lo + 1);
  let cdfBelowHi = 0;
  for (let k = 0; k < hi; k++) {
    const pk = pmf(k);
    cdfBelowHi += pk;
    expected[Math.max(k, lo) - lo]! += n * pk;
  }
  expected[hi - lo] = n * (1 - cdfBelowHi);
  return pearson(mergeCells(observed, expected));
}

function mergeCells(observed: Float64Array, expected: Float64Array): { o: number[]; e: number[] } {
  const o: number[] = [];
  const e: number[] = [];
  let oi = 0;
  let ei = 0;
  for (let i = 0; i < observed.length; i++) {
    oi += observed[i] as number;
    ei += expected[i] as number;
    if (ei >= 5) {
      o.push(oi);
      e.push(ei);
      oi = 0;
      ei = 0;
    }
  }
  if (e.length > 0 && ei > 0) {
    o[o.length - 1]! += oi;
    e[e.length - 1]! += ei;
  }
  return { o, e };
}

function pearson(cells: { o: number[]; e: number[] }): { stat: number; dof: number } {
  let stat = 0;
  cells.e.forEach((ei, i) => {
    const d = (cells.o[i] as number) - ei;
    stat += (d * d) / ei;
  });
  return { stat, dof: cells.e.length - 1 };
}
