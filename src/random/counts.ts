/**
 * Poisson and binomial samplers, exact for every parameter (no normal approximation):
 * inversion by sequential search when the mean is small, transformed rejection with
 * squeeze (Hörmann 1993: PTRS for Poisson, BTRS for binomial) when it is large.
 */
import { logFactorial } from './log-factorial.js';
import type { Stream } from './stream.js';

/** Means below this use inversion; the rejection methods are valid from 10 upward. */
const INVERSION_MAX_MEAN = 10;

/**
 * Poisson count with the given mean (mean >= 0, finite; RangeError otherwise).
 * mean < 10: inversion, one draw. mean >= 10: PTRS, Hörmann (1993), "The transformed
 * rejection method for generating Poisson random variables", Insurance: Mathematics
 * and Economics 12, 39-45; about 2.3 draws on average.
 */
export function poisson(s: Stream, mean: number): number {
  if (!(mean >= 0 && mean < Infinity)) throw new RangeError(`poisson: mean must be finite and >= 0, got ${mean}`);
  return mean < INVERSION_MAX_MEAN ? poissonInversion(s, mean) : poissonPtrs(s, mean);
}

function poissonInversion(s: Stream, mean: number): number {
  let u = s.next();
  let pk = Math.exp(-mean);
  let k = 0;
  while (u > pk) {
    u -= pk;
    k++;
    pk *= mean / k;
    if (pk === 0) break; // rounding left u > 0 past the representable tail
  }
  return k;
}

function poissonPtrs(s: Stream, mean: number): number {
  const logMean = Math.log(mean);
  const b = 0.931 + 2.53 * Math.sqrt(mean);
  const a = -0.059 + 0.02483 * b;
  const logInvAlpha = Math.log(1.1239 + 1.1328 / (b - 3.4));
  const vr = 0.9277 - 3.6224 / (b - 2);
  for (;;) {
    const u = s.next() - 0.5;
    const v = s.next();
    const us = 0.5 - Math.abs(u);
    const k = Math.floor(((2 * a) / us + b) * u + mean + 0.43);
    if (k < 0) continue;
    if (us >= 0.07 && v <= vr) return k;
    if (us < 0.013 && v > us) continue;
    const lhs = Math.log(v) + logInvAlpha - Math.log(a / (us * us) + b);
    if (lhs <= -mean + k * logMean - logFactorial(k)) return k;
  }
}

/**
 * Binomial(n, p) count: n a non-negative safe integer, 0 <= p <= 1 (RangeError
 * otherwise). Uses p' = min(p, 1-p) and reflects. n p' < 10: inversion, one draw.
 * Otherwise BTRS, Hörmann (1993), "The generation of binomial random variates",
 * J. Statistical Computation and Simulation 46, 101-110.
 */
export function binomial(s: Stream, n: number, p: number): number {
  if (!(Number.isSafeInteger(n) && n >= 0)) throw new RangeError(`binomial: n must be a non-negative integer, got ${n}`);
  if (!(p >= 0 && p <= 1)) throw new RangeError(`binomial: p must be in [0, 1], got ${p}`);
  if (p > 0.5) return n - binomialLow(s, n, 1 - p);
  return binomialLow(s, n, p);
}

/** p <= 0.5. */
function binomialLow(s: Stream, n: number, p: number): number {
  return n * p < INVERSION_MAX_MEAN ? binomialInversion(s, n, p) : binomialBtrs(s, n, p);
}

function binomialInversion(s: Stream, n: number, p: number): number {
  const ratio = p / (1 - p);
  let u = s.next();
  let pk = Math.exp(n * Math.log1p(-p)); // (1-p)^n
  let k = 0;
  while (u > pk && k < n) {
    u -= pk;
    k++;
    pk *= ((n - k + 1) / k) * ratio;
    if (pk === 0) break;
  }
  return k;
}

function binomialBtrs(s: Stream, n: number, p: number): number {
  const q = 1 - p;
  const spq = Math.sqrt(n * p * q);
  const b = 1.15 + 2.53 * spq;
  const a = -0.0873 + 0.0248 * b + 0.01 * p;
  const c = n * p + 0.5;
  const vr = 0.92 - 4.2 / b;
  const logAlpha = Math.log((2.83 + 5.1 / b) * spq);
  const logPq = Math.log(p / q);
  const m = Math.floor((n + 1) * p);
  const h = logFactorial(m) + logFactorial(n - m);
  for (;;) {
    const u = s.next() - 0.5;
    const v = s.next();
    const us = 0.5 - Math.abs(u);
    const k = Math.floor(((2 * a) / us + b) * u + c);
    if (k < 0 || k > n) continue;
    if (us >= 0.07 && v <= vr) return k;
    const lhs = Math.log(v) + logAlpha - Math.log(a / (us * us) + b);
    if (lhs <= h - logFactorial(k) - logFactorial(n - k) + (k - m) * logPq) return k;
  }
}
