/** Retries with a constant per-attempt success probability p_s and at most K attempts. Exact. */
import { requireInteger, requireProbability } from './validate.js';

/** P(success within K attempts) = 1 − (1 − p_s)^K. */
export function successWithinAttempts(ps: number, K: number): number {
  requireProbability('ps', ps);
  requireInteger('K', K, 1);
  return 1 - Math.pow(1 - ps, K);
}

/**
 * E[attempts | success within K] = Σ_{k=1..K} k·p_s(1−p_s)^(k−1) / (1 − (1−p_s)^K)
 * = Σ k·q^(k−1) / Σ q^(k−1) with q = 1 − p_s (p_s cancels, so the sum is stable for small p_s and
 * gives the limit (K + 1)/2 at p_s = 0). O(K).
 */
export function meanAttemptsGivenSuccess(ps: number, K: number): number {
  requireProbability('ps', ps);
  requireInteger('K', K, 1);
  const q = 1 - ps;
  let weight = 1; // q^(k−1)
  let numerator = 0;
  let denominator = 0;
  for (let k = 1; k <= K; k++) {
    numerator += k * weight;
    denominator += weight;
    weight *= q;
  }
  return numerator / denominator;
}
