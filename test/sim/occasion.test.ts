/**
 * One random-access occasion: N devices, M = 54 preambles, uniform choice. Every device arrives in
 * [0, 1 ms), so all send their first (and, with one attempt, only) preamble at the occasion at 1 ms.
 * Sources: E[S] = N(1−1/M)^(N−1), Var[S], E[idle] = M(1−1/M)^N, E[collided] = M − E[S] − E[idle], and the
 * exact distribution by inclusion–exclusion (Feller vol. 1 ch. IV) — reference-values.md §2, exact.
 */
import { describe, expect, it } from 'vitest';
import { expectedCollided, expectedIdle, expectedSuccesses, successDistribution, varianceSuccesses } from '../../src/analytic/index.js';
import { expectWithinSE, idealCell, metricOf, runYaml, valuesOf } from './run-yaml.js';

const M = 54;

function oneOccasion(N: number, reps: number, extra = ''): string {
  return `experiment: one-occasion
seed: 202
replications: ${reps}
${idealCell(M)}${extra}
groups:
  burst:
    count: ${N}
    traffic: { model: uniform-window, window: 1ms }
`;
}

describe('one occasion, M = 54 (reference-values §2 table)', () => {
  const table = [
    { N: 10, S: 8.451601, varS: 2.33529, idle: 44.793486, collided: 0.754913 },
    { N: 54, S: 20.051441, varS: 12.675698, idle: 19.680118, collided: 14.268442 },
    { N: 100, S: 15.715524, varS: 9.316164, idle: 8.329228, collided: 29.955248 },
    { N: 200, S: 4.848081, varS: 3.549808, idle: 1.284741, collided: 47.867178 },
  ];
  for (const row of table) {
    it(`N = ${row.N}: E[S] ${row.S}, Var[S] ${row.varS}, E[idle] ${row.idle}, E[collided] ${row.collided}`, () => {
      // The closed forms reproduce the published table.
      expect(expectedSuccesses(row.N, M)).toBeCloseTo(row.S, 5);
      expect(varianceSuccesses(row.N, M)).toBeCloseTo(row.varS, 5);
      expect(expectedIdle(row.N, M)).toBeCloseTo(row.idle, 5);
      expect(expectedCollided(row.N, M)).toBeCloseTo(row.collided, 5);

      const reps = 1500;
      const result = runYaml(oneOccasion(row.N, reps));
      expect(metricOf(result, 'occasions_counted').mean).toBe(1);
      const S = metricOf(result, 'accesses_completed');
      expectWithinSE(S, row.S);
      expectWithinSE(metricOf(result, 'singleton_preamble_probability'), row.S / M);
      expectWithinSE(metricOf(result, 'idle_preamble_probability'), row.idle / M);
      expectWithinSE(metricOf(result, 'collision_probability_per_rao'), row.collided / M);
      // Sample variance against Var[S]: for n = 1500 the relative standard error of s² is about
      // sqrt(2/(n−1)) ≈ 3.7 % (plus excess kurtosis); allow 15 %.
      expect(S.std ** 2 / row.varS).toBeGreaterThan(0.85);
      expect(S.std ** 2 / row.varS).toBeLessThan(1.15);
    });
  }

  it('exact distribution, N = 10: P(S = 9) = 0 exactly; P(S = 8) = P(S = 10) = 0.411890', () => {
    const pmf = successDistribution(10, M);
    expect(pmf[9]).toBe(0);
    expect(pmf[8]).toBeCloseTo(0.41189, 5);
    expect(pmf[10]).toBeCloseTo(0.41189, 5);
    const reps = 3000;
    const successes = valuesOf(runYaml(oneOccasion(10, reps)), 'accesses_completed');
    const count = (k: number): number => successes.filter((s) => s === k).length;
    // Nine alone would leave the tenth device on a preamble of its own: impossible.
    expect(count(9)).toBe(0);
    for (const k of [8, 10]) {
      const p = pmf[k] as number;
      const se = Math.sqrt((p * (1 - p)) / reps);
      expect(Math.abs(count(k) / reps - p)).toBeLessThan(3.3 * se);
    }
  });

  it('response capacity: 3 answers per subframe × 5 subframes caps successes at 15 (TR 37.868; E[min(S,15)] from the exact pmf)', () => {
    const N = 54;
    const pmf = successDistribution(N, M);
    const expected = pmf.reduce((sum, p, k) => sum + p * Math.min(k, 15), 0);
    const limited = `experiment: capped
seed: 203
replications: 1500
cell:
  random_access:
    preambles: ${M}
    detection: perfect
    answers_per_subframe: 3
    response_window: 5ms
    msg3: { error_probability: 0 }
    msg4: { error_probability: 0 }
    preamble_trans_max: 1
groups:
  burst:
    count: ${N}
    traffic: { model: uniform-window, window: 1ms }
`;
    const result = runYaml(limited);
    const successes = valuesOf(result, 'accesses_completed');
    expect(Math.max(...successes)).toBe(15);
    expectWithinSE(metricOf(result, 'accesses_completed'), expected);
  });
});
