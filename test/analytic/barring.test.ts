import { describe, it, expect } from 'vitest';
import {
  expectedSuccesses,
  expectedSuccessesWithBarring,
  meanBarringDelay,
  optimalBarringFactor,
} from '../../src/analytic/index.js';

// 3GPP TS 36.331 5.3.3.11; analysis: Duan, Shah-Mansouri, Wong, GLOBECOM 2013
describe('access class barring (3GPP TS 36.331 5.3.3.11; Duan, Shah-Mansouri, Wong, GLOBECOM 2013)', () => {
  it.each([
    [100, 0.54, 19.9654, 15.715524],
    [200, 0.27, 19.915299, 4.848081],
    [1000, 0.054, 19.875428, 0.000008],
  ])('M = 54, N = %i → p* %f, E[S] %f; without barring %f (exact for this model)', (N, pStar, withBarring, without) => {
    expect(optimalBarringFactor(N, 54)).toBeCloseTo(pStar, 12);
    expect(expectedSuccessesWithBarring(N, pStar, 54)).toBeCloseTo(withBarring, 6);
    expect(expectedSuccessesWithBarring(N, 1, 54)).toBeCloseTo(without, 6);
    expect(expectedSuccesses(N, 54)).toBeCloseTo(without, 6);
  });

  it('p* maximises E[S] and is 1 when N ≤ M (exact for this model)', () => {
    expect(optimalBarringFactor(30, 54)).toBe(1);
    for (const N of [100, 200, 1000]) {
      const best = expectedSuccessesWithBarring(N, optimalBarringFactor(N, 54), 54);
      for (const f of [0.9, 0.99, 1.01, 1.1]) {
        expect(expectedSuccessesWithBarring(N, Math.min(1, f * optimalBarringFactor(N, 54)), 54)).toBeLessThan(best);
      }
    }
  });

  it('mean barring delay ((1 − p)/p)·T_barring (exact given the rule)', () => {
    expect(meanBarringDelay(0.5, 4000)).toBe(4000);
    expect(meanBarringDelay(0.2, 1000)).toBeCloseTo(4000, 9);
    expect(meanBarringDelay(1, 1000)).toBe(0);
    expect(() => meanBarringDelay(0, 1000)).toThrow(RangeError);
  });
});
