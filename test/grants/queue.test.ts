/**
 * Configured grants as a discrete-time queue. One device owns a configured grant every 1 ms slot and
 * receives Poisson arrivals of λ per slot; every slot serves one packet (early departure). Source:
 * mean sojourn W = E[Q]/λ = 1 + λ/(2(1−λ)) slots, own service slot included (reference-values.md §7,
 * exact; equals the M/D/1 sojourn). jostle measures delay from the arrival instant, uniform inside its
 * slot, to the end of the transmission: delay = W + 1/2 slot on average (exact: the sojourn counts
 * whole slots from the slot of arrival).
 * Little's law L = λW (Little 1961) holds for the same queue: packets_in_system_mean = λ · delay.
 */
import { describe, expect, it } from 'vitest';
import { md1Sojourn } from '../../src/analytic/index.js';
import { expectWithinSE, metricOf, runYaml } from '../sim/run-yaml.js';

const queue = (lambda: number, horizon: string, reps: number): string => `experiment: configured-queue
seed: 909
replications: ${reps}
horizon: ${horizon}
warmup: 2s
cell:
  uplink: { capacity: 1, harq: { error_probability: 0 } }
groups:
  meter:
    count: 1
    traffic: { model: poisson, mean_interval: ${1 / lambda}ms }
    access: { policy: configured-grant, period: 1ms }
`;

describe('configured grant, one grant per slot, Poisson arrivals', () => {
  for (const [lambda, W, horizon, reps] of [
    [0.5, 1.5, '60s', 6],
    [0.8, 3.0, '100s', 8],
    [0.9, 5.5, '200s', 10],
  ] as const) {
    it(`λ = ${lambda}: mean sojourn ${W} slots (reference-values §7), delay = W + 0.5 ms`, () => {
      expect(md1Sojourn(lambda)).toBeCloseTo(W, 10);
      const r = runYaml(queue(lambda, horizon, reps));
      const delay = metricOf(r, 'delay_mean_ms');
      expectWithinSE(delay, W + 0.5);
      // Little's law, replication by replication through the means: L = λ·W.
      const L = metricOf(r, 'packets_in_system_mean');
      const throughput = metricOf(r, 'throughput_per_s').mean / 1000;
      expect(Math.abs(L.mean - throughput * delay.mean) / L.mean).toBeLessThan(0.01);
      // Every slot offers one opportunity: used + wasted = slots in the window.
      expect(metricOf(r, 'grant_efficiency').mean).toBeCloseTo(lambda, 1);
    });
  }
});
