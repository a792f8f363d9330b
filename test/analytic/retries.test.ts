import { describe, it, expect } from 'vitest';
import { meanAttemptsGivenSuccess, successWithinAttempts } from '../../src/analytic/index.js';

describe('retries with constant per-attempt success probability (exact)', () => {
  it.each([
    [0.371323, 10, 0.990356, 2.59569],
    [0.5, 3, 0.875, 1.571429],
  ])('p_s = %f, K = %i → P(success) %f, E[attempts | success] %f (exact)', (ps, K, success, attempts) => {
    expect(successWithinAttempts(ps, K)).toBeCloseTo(success, 6);
    expect(meanAttemptsGivenSuccess(ps, K)).toBeCloseTo(attempts, 6);
  });

  it('limits: p_s = 1 → one attempt; p_s → 0 → (K + 1)/2 (exact)', () => {
    expect(meanAttemptsGivenSuccess(1, 7)).toBe(1);
    expect(meanAttemptsGivenSuccess(0, 7)).toBe(4);
    expect(meanAttemptsGivenSuccess(1e-12, 7)).toBeCloseTo(4, 9);
    expect(successWithinAttempts(0, 7)).toBe(0);
    expect(() => successWithinAttempts(0.5, 0)).toThrow(RangeError);
  });
});
