/**
 * Random grant: K grants among N devices, each holding data with probability q. Source: every granted
 * device holds data with probability q, so E[used] = K·q and E[wasted] = K·(1−q) — exact (linearity
 * of expectation; the used count is hypergeometric given the number of active devices).
 */
import { describe, expect, it } from 'vitest';
import { expectWithinSE, metricOf, runYaml } from '../sim/run-yaml.js';

describe('random grant', () => {
  it('K = 10 grants among N = 100 devices with q = 0.3: used K·q = 3, wasted K·(1−q) = 7', () => {
    // Devices with data arrive in [0, 1 ms); the grant occasion at 1 ms is the only one counted
    // (warm-up 1 ms, horizon 1.5 ms).
    const yaml = `experiment: random-grant
seed: 919
replications: 2000
horizon: 1500us
warmup: 1ms
cell:
  uplink: { capacity: 20 }
groups:
  sensors:
    count: 100
    traffic: { model: uniform-window, window: 1ms, active_share: 0.3 }
    access: { policy: random-grant, grants_per_occasion: 10 }
`;
    const r = runYaml(yaml);
    expect(metricOf(r, 'grants_issued').mean).toBe(10);
    expectWithinSE(metricOf(r, 'grants_used'), 3);
    expectWithinSE(metricOf(r, 'grants_wasted'), 7);
  });

  it('the pool caps the grants: capacity 4 gives 4 grants per occasion whatever the budget', () => {
    const yaml = `experiment: random-grant-cap
seed: 920
replications: 3
horizon: 100ms
cell:
  uplink: { capacity: 4 }
groups:
  sensors:
    count: 1000
    traffic: { model: poisson, mean_interval: 10s }
    access: { policy: random-grant }
`;
    const r = runYaml(yaml);
    // Occasions at 0, 1, …, 100 ms: 101 occasions × 4 grants (common practice: capacity is per subframe).
    expect(metricOf(r, 'grants_issued').mean).toBe(404);
  });
});
