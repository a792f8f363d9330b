/**
 * Sequential stopping: replications are added until the relative half-width of the named metric is
 * at most γ/(1+γ) (Law & Kelton, Simulation Modeling and Analysis, 3rd ed., relative-precision
 * procedure; reference-values.md §9), between the minimum and maximum counts.
 */
import { describe, expect, it } from 'vitest';
import { relativePrecisionReached } from '../../src/stats/index.js';
import { runYaml, valuesOf } from './run-yaml.js';

const yaml = (gamma: number, max: number): string => `experiment: sequential
seed: 707
stopping:
  metric: delay_mean_ms
  relative_precision: ${gamma}
  min_replications: 4
  max_replications: ${max}
groups:
  mtc:
    count: 3000
    traffic: { model: beta-burst }
`;

describe('sequential stopping', () => {
  it('stops at the first count whose interval is precise enough', () => {
    const result = runYaml(yaml(0.01, 200));
    const point = result.points[0];
    expect(point?.stopCause).toBe('precision-reached');
    const values = valuesOf(result, 'delay_mean_ms');
    const n = values.length;
    expect(n).toBeGreaterThanOrEqual(4);
    expect(relativePrecisionReached(values, 0.01, 0.95)).toBe(true);
    for (let k = 4; k < n; k++) expect(relativePrecisionReached(values.slice(0, k), 0.01, 0.95)).toBe(false);
    const s = point?.summary.metrics['delay_mean_ms'];
    expect((s?.half_width ?? Infinity) / Math.abs(s?.mean ?? 0)).toBeLessThanOrEqual(0.01 / 1.01);
  });

  it('gives up at max_replications when the target is out of reach', () => {
    const result = runYaml(yaml(0.00001, 6));
    expect(result.points[0]?.stopCause).toBe('max-replications');
    expect(result.points[0]?.records.length).toBe(6);
  });

  it('--reps replaces the rule with a fixed count', () => {
    const loaded = runYaml(yaml(0.01, 200), [], { replications: 3 });
    expect(loaded.points[0]?.records.length).toBe(3);
    expect(loaded.points[0]?.stopCause).toBe('fixed-count');
  });
});
