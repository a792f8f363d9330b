/**
 * The energy model's accounting, against hand calculation for a lone, error-free contention access
 * (exact given the model and the reference timing): the device waits awake for the occasion (uniform
 * over 5 ms: mean 2.5 ms idle), transmits the preamble (1 ms) and Msg3 (1 ms), and listens from the
 * preamble to the response (3 ms) and from Msg3 to Msg4 (5 ms) minus its Msg3 millisecond: 7 ms.
 * Energy = 2·500 + 7·80 + 2.5·3 µJ = 1.5675 mJ with the default (TR 45.820, from memory) powers.
 */
import { describe, it } from 'vitest';
import { expectWithinSE, idealCell, metricOf, runYaml } from '../sim/run-yaml.js';

describe('energy per delivered packet', () => {
  it('lone ideal contention access: 1.5675 mJ', () => {
    const yaml = `experiment: energy
seed: 969
replications: 5
${idealCell(4096)}groups:
  meters:
    count: 500
    traffic: { model: uniform-window, window: 100s }
`;
    expectWithinSE(metricOf(runYaml(yaml), 'energy_per_delivered_packet_mj'), (2 * 500 + 7 * 80 + 2.5 * 3) / 1000);
  });

  it('configured grant, no errors: wait for the slot (mean 0.5 ms, monitoring), 1 ms transmit, 1 ms feedback', () => {
    // Energy = 0.5·80 (monitoring the wait) + 1·500 + 1·80 µJ = 0.62 mJ.
    const yaml = `experiment: energy-grant
seed: 970
replications: 5
horizon: 20s
cell:
  uplink: { capacity: 1, harq: { error_probability: 0 } }
groups:
  meters:
    count: 1
    traffic: { model: poisson, mean_interval: 50ms }
    access: { policy: configured-grant, period: 1ms }
`;
    expectWithinSE(metricOf(runYaml(yaml), 'energy_per_delivered_packet_mj'), (0.5 * 80 + 500 + 80) / 1000);
  });
});
