/**
 * One random-access occasion: N devices each pick one of M preambles uniformly and independently;
 * a preamble chosen by exactly one device is a success, by none is idle, by two or more collided.
 * All results are exact (occupancy problem; Feller, An Introduction to Probability Theory and Its
 * Applications, vol. 1, ch. IV).
 */
import { ratioToNumber } from './exact-ratio.js';
import { requireInteger, requireNonNegative } from './validate.js';

function check(N: number, M: number): void {
  requireInteger('N', N, 0);
  requireInteger('M', M, 1);
}

/** P(a given device is alone on its preamble) = (1 − 1/M)^(N−1), for N ≥ 1. */
export function probabilityAlone(N: number, M: number): number {
  check(N, M);
  requireInteger('N', N, 1);
  return Math.pow(1 - 1 / M, N - 1);
}

/** E[S], successes (singleton preambles): N·(1 − 1/M)^(N−1). */
export function expectedSuccesses(N: number, M: number): number {
  check(N, M);
  return N === 0 ? 0 : N * Math.pow(1 - 1 / M, N - 1);
}

/**
 * Var[S]. With S = Σ_i X_i (X_i = device i alone), P(X_i = X_j = 1) = (1 − 1/M)(1 − 2/M)^(N−2) for
 * i ≠ j (j avoids i's preamble, the other N − 2 avoid both), so
 * E[S(S−1)] = N(N−1)(1 − 1/M)(1 − 2/M)^(N−2) and Var[S] = E[S(S−1)] + E[S] − E[S]².
 */
export function varianceSuccesses(N: number, M: number): number {
  const mean = expectedSuccesses(N, M);
  const factorial2 = N < 2 ? 0 : N * (N - 1) * (1 - 1 / M) * Math.pow(1 - 2 / M, N - 2);
  return factorial2 + mean - mean * mean;
}

/** E[idle preambles] = M·(1 − 1/M)^N. */
export function expectedIdle(N: number, M: number): number {
  check(N, M);
  return M * Math.pow(1 - 1 / M, N);
}

/** E[collided preambles] = M − E[S] − E[idle]. */
export function expectedCollided(N: number, M: number): number {
  return M - expectedSuccesses(N, M) - expectedIdle(N, M);
}

/**
 * Numerators of the inclusion–exclusion terms: T_j = C(M,j)·C(N,j)·j!·(M−j)^(N−j)
 * = M(M−1)…(M−j+1) · C(N,j) · (M−j)^(N−j), j = 0 … min(N, M), as exact integers.
 */
function inclusionExclusionTerms(N: number, M: number, kMax: number): bigint[] {
  const terms: bigint[] = [];
  let falling = 1n; // M!/(M−j)!
  let binomN = 1n; // C(N, j)
  for (let j = 0; j <= kMax; j++) {
    if (j > 0) {
      falling *= BigInt(M - j + 1);
      binomN = (binomN * BigInt(N - j + 1)) / BigInt(j);
    }
    terms.push(falling * binomN * BigInt(M - j) ** BigInt(N - j));
  }
  return terms;
}

/**
 * P(S = k) for k = 0 … min(N, M), by inclusion–exclusion in exact integer arithmetic:
 * P(S = k) = Σ_{j=k}^{min(M,N)} (−1)^(j−k)·C(j,k)·C(M,j)·C(N,j)·j!·(M−j)^(N−j) / M^N.
 * Each probability is the nearest double to the exact rational (no cancellation error).
 * Cost grows with min(N,M)² big-integer additions of N·log2(M)-bit numbers.
 */
export function successDistribution(N: number, M: number): number[] {
  check(N, M);
  const kMax = Math.min(N, M);
  const terms = inclusionExclusionTerms(N, M, kMax);
  const total = BigInt(M) ** BigInt(N);
  const result: number[] = [];
  for (let k = 0; k <= kMax; k++) {
    let acc = 0n;
    let binomJK = 1n; // C(j, k), starting at j = k
    for (let j = k; j <= kMax; j++) {
      if (j > k) binomJK = (binomJK * BigInt(j)) / BigInt(j - k);
      const term = binomJK * (terms[j] as bigint);
      acc += (j - k) % 2 === 0 ? term : -term;
    }
    result.push(ratioToNumber(acc, total));
  }
  return result;
}

/**
 * E[S] when the number of contenders is Poisson with mean λ: each preamble sees Poisson(λ/M)
 * devices, so E[S] = λ·e^(−λ/M); maximum M/e at λ = M. Exact.
 */
export function expectedSuccessesPoisson(lambda: number, M: number): number {
  requireNonNegative('lambda', lambda);
  requireInteger('M', M, 1);
  return lambda * Math.exp(-lambda / M);
}
