/**
 * Age of Information. Source: round-robin scheduling of n always-fresh sources, one per slot, gives a
 * sawtooth between 1 and n + 1 slots: average age n/2 + 1 slots, peak age n + 1 (Yates & Kaul, ISIT
 * 2017; reference-values.md §8). Here: n devices with generate-at-will traffic, each owning a
 * configured grant every n ms at its own offset; a packet is generated when its transmission starts
 * and received one TTI (1 ms) later.
 */
import { describe, expect, it } from 'vitest';
import { roundRobinAverageAge } from '../../src/analytic/index.js';
import { metricOf, runYaml } from '../sim/run-yaml.js';

describe('Age of Information', () => {
  for (const n of [4, 10]) {
    it(`round robin over n = ${n} always-fresh sources: average age n/2 + 1 = ${n / 2 + 1} slots, peak n + 1`, () => {
      expect(roundRobinAverageAge(n)).toBe(n / 2 + 1);
      const yaml = `experiment: round-robin-age
seed: 939
replications: 2
horizon: 10s
warmup: 100ms
cell:
  uplink: { capacity: 1, harq: { error_probability: 0 } }
groups:
  sources:
    count: ${n}
    traffic: { model: always-fresh }
    access: { policy: configured-grant, period: ${n}ms }
`;
      const r = runYaml(yaml);
      // The window need not end on a cycle boundary: allow the last partial sawtooth (≤ n/T relative).
      expect(metricOf(r, 'aoi_mean_ms').mean).toBeCloseTo(n / 2 + 1, 1);
      expect(metricOf(r, 'aoi_peak_mean_ms').mean).toBeCloseTo(n + 1, 6);
      // Every opportunity finds a fresh packet, including one exactly at the horizon: exact.
      expect(metricOf(r, 'grant_efficiency').mean).toBe(1);
    });
  }

  it('two groups of always-fresh sources (4 and 10): each group is its own round robin, ages 3 and 6 slots', () => {
    const r = runYaml(`experiment: round-robin-age-two-groups
seed: 940
replications: 2
horizon: 10s
warmup: 100ms
cell:
  uplink: { capacity: 2, harq: { error_probability: 0 } }
groups:
  small:
    count: 4
    traffic: { model: always-fresh }
    access: { policy: configured-grant, period: 4ms }
  large:
    count: 10
    traffic: { model: always-fresh }
    access: { policy: configured-grant, period: 10ms }
`);
    for (const [group, n] of [['small', 4], ['large', 10]] as const) {
      expect(metricOf(r, 'aoi_mean_ms', group).mean).toBeCloseTo(n / 2 + 1, 1);
      expect(metricOf(r, 'aoi_peak_mean_ms', group).mean).toBeCloseTo(n + 1, 6);
      expect(metricOf(r, 'grant_efficiency', group).mean).toBe(1);
    }
  });
});
