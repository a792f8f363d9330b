/**
 * Access class barring (3GPP TS 36.331 5.3.3.11; analysis: Duan, Shah-Mansouri, Wong,
 * GLOBECOM 2013). A device passes a barring check when u < p; otherwise it waits
 * (0.7 + 0.6·u')·T_barring, whose mean is T_barring, and checks again.
 */
import { requireInteger, requireNonNegative, requireProbability } from './validate.js';

/**
 * Mean time spent barred before passing: the number of failed checks is geometric with mean
 * (1 − p)/p and each wait has mean T_barring, so the mean is ((1 − p)/p)·T_barring, in the unit of
 * `barringTime` (ms in jostle). Exact given the rule.
 */
export function meanBarringDelay(p: number, barringTime: number): number {
  requireProbability('p', p, true);
  requireNonNegative('barringTime', barringTime);
  return ((1 - p) / p) * barringTime;
}

/**
 * E[successes] when each of N contenders passes barring with probability p and those that pass pick
 * one of M preambles uniformly: N·p·(1 − p/M)^(N−1). Exact for this model.
 */
export function expectedSuccessesWithBarring(N: number, p: number, M: number): number {
  requireInteger('N', N, 0);
  requireProbability('p', p);
  requireInteger('M', M, 1);
  return N === 0 ? 0 : N * p * Math.pow(1 - p / M, N - 1);
}

/**
 * Barring factor maximising expectedSuccessesWithBarring: setting the derivative in p to zero gives
 * 1 − p/M = p(N − 1)/M, i.e. p* = M/N, capped at 1. Exact for this model.
 */
export function optimalBarringFactor(N: number, M: number): number {
  requireInteger('N', N, 0);
  requireInteger('M', M, 1);
  return N <= M ? 1 : M / N;
}
