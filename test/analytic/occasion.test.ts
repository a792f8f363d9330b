import { describe, it, expect } from 'vitest';
import {
  expectedCollided,
  expectedIdle,
  expectedSuccesses,
  expectedSuccessesPoisson,
  probabilityAlone,
  successDistribution,
  varianceSuccesses,
} from '../../src/analytic/index.js';

const M = 54;

describe('one occasion, N devices, M = 54 preambles (exact)', () => {
  // exact: preamble contention table, M = 54 — N, P(alone), E[S], Var[S], E[idle], E[collided]
  it.each([
    [10, 0.84516, 8.451601, 2.33529, 44.793486, 0.754913],
    [54, 0.371323, 20.051441, 12.675698, 19.680118, 14.268442],
    [100, 0.157155, 15.715524, 9.316164, 8.329228, 29.955248],
    [200, 0.02424, 4.848081, 3.549808, 1.284741, 47.867178],
  ])('N = %i → P(alone) %f, E[S] %f, Var[S] %f, E[idle] %f, E[collided] %f (exact)', (N, alone, s, v, idle, collided) => {
    expect(probabilityAlone(N, M)).toBeCloseTo(alone, 6);
    expect(expectedSuccesses(N, M)).toBeCloseTo(s, 6);
    expect(varianceSuccesses(N, M)).toBeCloseTo(v, 6);
    expect(expectedIdle(N, M)).toBeCloseTo(idle, 6);
    expect(expectedCollided(N, M)).toBeCloseTo(collided, 6);
  });

  it('N = 10: P(S = 9) = 0 exactly; P(S = 8) = P(S = 10) = 0.411890 (exact: inclusion–exclusion, Feller vol. 1 ch. IV)', () => {
    const d = successDistribution(10, M);
    expect(d).toHaveLength(11);
    expect(Math.abs(d[9] as number)).toBeLessThan(1e-12);
    expect(d[8]).toBeCloseTo(0.41189, 6);
    expect(d[10]).toBeCloseTo(0.41189, 6);
  });

  it.each([10, 54, 100, 200])(
    'N = %i: the distribution sums to 1 and its mean/variance equal E[S] and Var[S] (exact: Feller vol. 1 ch. IV)',
    (N) => {
      const d = successDistribution(N, M);
      expect(d).toHaveLength(Math.min(N, M) + 1);
      let total = 0;
      let mean = 0;
      let second = 0;
      d.forEach((p, k) => {
        expect(p).toBeGreaterThanOrEqual(0);
        total += p;
        mean += k * p;
        second += k * k * p;
      });
      expect(total).toBeCloseTo(1, 12);
      expect(mean).toBeCloseTo(expectedSuccesses(N, M), 9);
      expect(second - mean * mean).toBeCloseTo(varianceSuccesses(N, M), 9);
    },
  );

  it('matches brute-force enumeration of all M^N choices for small cases (exact: enumeration)', () => {
    for (const [n, m] of [
      [1, 1],
      [3, 2],
      [4, 3],
      [5, 4],
      [6, 3],
    ] as const) {
      const counts = new Array<number>(Math.min(n, m) + 1).fill(0);
      const choice = new Array<number>(n).fill(0);
      for (let code = 0; code < m ** n; code++) {
        let c = code;
        for (let i = 0; i < n; i++) {
          choice[i] = c % m;
          c = Math.floor(c / m);
        }
        const load = new Array<number>(m).fill(0);
        for (const x of choice) load[x] = (load[x] as number) + 1;
        const singles = load.filter((l) => l === 1).length;
        counts[singles] = (counts[singles] as number) + 1;
      }
      const d = successDistribution(n, m);
      counts.forEach((c, k) => expect(d[k]).toBeCloseTo(c / m ** n, 14));
    }
  });

  it('edge cases: N = 0 gives S = 0 surely; M = 1 has no success for N ≥ 2 (exact)', () => {
    expect(successDistribution(0, 5)).toEqual([1]);
    expect(successDistribution(3, 1)).toEqual([1, 0]);
    expect(expectedSuccesses(0, 5)).toBe(0);
    expect(varianceSuccesses(1, 2)).toBeCloseTo(0, 15);
    expect(() => successDistribution(2.5, 4)).toThrow(RangeError);
  });

  it('Poisson number of contenders: maximum M/e = 19.865490 at λ = M (exact)', () => {
    expect(expectedSuccessesPoisson(M, M)).toBeCloseTo(19.86549, 6);
    expect(expectedSuccessesPoisson(0.9 * M, M)).toBeLessThan(expectedSuccessesPoisson(M, M));
    expect(expectedSuccessesPoisson(1.1 * M, M)).toBeLessThan(expectedSuccessesPoisson(M, M));
  });
});
