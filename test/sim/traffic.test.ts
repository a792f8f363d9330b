/**
 * Traffic models, observed through the simulator's arrival metrics. Sources: Beta(3,4) over 10 s —
 * mean 4.285714 s, sd 1.749636 s (3GPP TR 37.868 model 2; reference-values.md §5, exact Beta moments);
 * uniform over a window W — mean W/2, sd W/√12 (exact); Poisson counts — mean N·H/τ (exact);
 * periodic — every device reports H/period times (exact).
 */
import { describe, expect, it } from 'vitest';
import { betaMoments } from '../../src/analytic/index.js';
import { orderByTime } from '../../src/traffic/once-each.js';
import fc from 'fast-check';
import { expectWithinSE, metricOf, runYaml, valuesOf } from './run-yaml.js';

const once = (model: string, count: number, reps = 8): string => `experiment: traffic
seed: 404
replications: ${reps}
groups:
  mtc:
    count: ${count}
    traffic: ${model}
`;

describe('traffic models', () => {
  it('beta-burst: Beta(3,4) over 10 s has mean 4.285714 s and sd 1.749636 s (TR 37.868 model 2; reference-values §5)', () => {
    const m = betaMoments(3, 4, 10_000);
    expect(m.mean).toBeCloseTo(4285.714, 2);
    expect(m.sd).toBeCloseTo(1749.636, 2);
    const result = runYaml(once('{ model: beta-burst }', 30_000));
    expectWithinSE(metricOf(result, 'arrival_time_mean_ms'), m.mean);
    expectWithinSE(metricOf(result, 'arrival_time_sd_ms'), m.sd);
  });

  it('uniform-window: mean W/2 and sd W/√12 over 60 s (TR 37.868 model 1; exact)', () => {
    const result = runYaml(once('{ model: uniform-window, window: 60s }', 10_000));
    expectWithinSE(metricOf(result, 'arrival_time_mean_ms'), 30_000);
    expectWithinSE(metricOf(result, 'arrival_time_sd_ms'), 60_000 / Math.sqrt(12));
  });

  it('poisson: N·H/τ packets in a horizon H (superposition of N Poisson processes; exact)', () => {
    const yaml = `experiment: poisson
seed: 405
replications: 10
horizon: 10min
groups:
  sensors:
    count: 5000
    traffic: { model: poisson, mean_interval: 1h }
`;
    const started = valuesOf(runYaml(yaml), 'accesses_started');
    const mean = (5000 * 10) / 60;
    // Each replication's count is Poisson(mean): check every one within 4 standard deviations.
    for (const n of started) expect(Math.abs(n - mean)).toBeLessThan(4 * Math.sqrt(mean));
  });

  it('periodic: each device reports exactly H/period times when H is a multiple of the period (exact)', () => {
    const yaml = `experiment: periodic
seed: 406
replications: 2
horizon: 1h
groups:
  meters:
    count: 3000
    traffic: { model: periodic, period: 15min, jitter: 30s }
`;
    // Phases are uniform in [0, 15 min) and jitter delays by < 30 s, so a report can slip past the
    // horizon only in the last 30 s of the last period: between 3 and 4 reports per device.
    for (const n of valuesOf(runYaml(yaml), 'accesses_started')) {
      expect(n).toBeGreaterThanOrEqual(3000 * 4 - 3000 * (30 / 900) * 1.5);
      expect(n).toBeLessThanOrEqual(3000 * 4);
    }
  });

  it('periodic rejects jitter ≥ period with the key path', () => {
    expect(() => runYaml(once('{ model: periodic, period: 1s, jitter: 2s }', 10).replace('groups:', 'horizon: 1min\ngroups:'))).toThrow(
      /groups\.mtc\.traffic\.jitter/,
    );
  });

  it('orderByTime puts any set of times in non-decreasing order, ties by index (common practice: stable sort)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 100, noNaN: true }), { maxLength: 300 }), (values) => {
        const times = Float64Array.from(values);
        const order = Array.from(orderByTime(times, 0, 100));
        const expected = values.map((t, i) => ({ t, i })).sort((a, b) => a.t - b.t || a.i - b.i).map((x) => x.i);
        expect(order).toEqual(expected);
      }),
      { seed: 4242, numRuns: 200 },
    );
  });
});
