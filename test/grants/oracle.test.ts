/**
 * Predicted grants with the oracle predictor. Sources: with recall 1, no false alarms and enough
 * capacity every grant finds data (no waste) and the delay is the wait for the next grant occasion
 * (uniform over the 1 ms period: mean 0.5 ms) + grant_delay + tti — exact for the model. With recall
 * r every packet is foreseen with probability r, so the measured recall is r (binomial).
 */
import { describe, expect, it } from 'vitest';
import { expectWithinSE, metricOf, runYaml } from '../sim/run-yaml.js';

const oracle = (recall: number, falseAlarm: number, extra = ''): string => `experiment: oracle
seed: 929
replications: 5
horizon: 30s
warmup: 1s
cell:
  uplink: { capacity: 20, harq: { error_probability: 0 } }
groups:
  alarms:
    count: 2000
    traffic: { model: poisson, mean_interval: 20s }
    access:
      policy: predicted-grant
      predictor: { model: oracle, recall: ${recall}, false_alarm: ${falseAlarm} }
${extra}`;

describe('oracle predictor', () => {
  it('recall 1, false alarm 0: no waste, delay = 0.5 + grant_delay (4) + tti (1) ms', () => {
    const r = runYaml(oracle(1, 0));
    expect(metricOf(r, 'grants_wasted').mean).toBe(0);
    expect(metricOf(r, 'grant_efficiency').mean).toBe(1);
    expect(metricOf(r, 'predictor_precision').mean).toBe(1);
    expect(metricOf(r, 'predictor_recall').mean).toBe(1);
    expectWithinSE(metricOf(r, 'delay_mean_ms'), 5.5);
    expect(metricOf(r, 'access_success_probability').mean).toBeGreaterThan(0.999);
  });

  it('recall 0.7: measured recall ≈ 0.7; missed packets fall back to contention', () => {
    const r = runYaml(oracle(0.7, 0, '      fallback_after: 20ms\n'));
    expectWithinSE(metricOf(r, 'predictor_recall'), 0.7);
    expectWithinSE(metricOf(r, 'fallback_share'), 0.3);
    expect(metricOf(r, 'access_success_probability').mean).toBeGreaterThan(0.99);
  });

  it('false alarms waste grants: N_idle·f flagged idle devices per occasion', () => {
    // 2000 devices, almost all idle, f = 0.001 → ≈ 2 false flags per occasion; with 20 grants per
    // occasion nearly all of them get a grant, so precision ≈ (waiting)/(waiting + 2).
    const r = runYaml(oracle(1, 0.001));
    const wasted = metricOf(r, 'grants_wasted').mean;
    const occasions = 29_000; // counted occasions: 1 s … 30 s, one per ms
    expect(wasted / occasions).toBeGreaterThan(1.9);
    expect(wasted / occasions).toBeLessThan(2.1);
    expect(metricOf(r, 'predictor_precision').mean).toBeLessThan(0.1);
  });

  it('without fallback and with max_wait, unforeseen packets are dropped after max_wait', () => {
    const r = runYaml(oracle(0, 0, '      max_wait: 10ms\n'));
    expect(metricOf(r, 'access_success_probability').mean).toBe(0);
    expect(metricOf(r, 'grants_issued').mean).toBe(0);
  });
});
