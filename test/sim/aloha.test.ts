/**
 * Slotted ALOHA through the real contention code path: Poisson arrivals, ideal random access, one
 * attempt per packet. Source: S = G·e^(−G) (Abramson 1970; Roberts 1975; Bertsekas & Gallager, Data
 * Networks, 2nd ed., ch. 4) and, with M preambles and Poisson(λ) contenders, E[S] = λ·e^(−λ/M)
 * (reference-values.md §1 and §2) — exact.
 */
import { describe, expect, it } from 'vitest';
import { expectedSuccessesPoisson, slottedAlohaThroughput } from '../../src/analytic/index.js';
import { expectWithinSE, idealCell, metricOf, runYaml } from './run-yaml.js';

function alohaYaml(preambles: number, perOccasion: number, horizon = '60s'): string {
  const devices = 20_000;
  return `experiment: aloha
seed: 101
replications: 8
horizon: ${horizon}
${idealCell(preambles)}
groups:
  stations:
    count: ${devices}
    traffic: { model: poisson, mean_interval: ${(devices * 5) / perOccasion}ms }
`;
}

describe('slotted ALOHA (one preamble, Poisson load G per occasion)', () => {
  for (const [G, S] of [
    [0.25, 0.1947],
    [0.5, 0.303265],
    [1, 0.367879],
    [2, 0.270671],
  ] as const) {
    it(`G = ${G}: successes per occasion = G·e^(−G) = ${S} (Roberts 1975; reference-values §1)`, () => {
      expect(slottedAlohaThroughput(G)).toBeCloseTo(S, 4);
      const result = runYaml(alohaYaml(1, G));
      expectWithinSE(metricOf(result, 'attempts_per_rao'), G);
      expectWithinSE(metricOf(result, 'throughput_per_rao'), slottedAlohaThroughput(G));
      // With one preamble, the singleton share of preamble slots is the same quantity.
      expectWithinSE(metricOf(result, 'singleton_preamble_probability'), slottedAlohaThroughput(G));
    });
  }
});

describe('multichannel slotted ALOHA (M = 54 preambles)', () => {
  it('Poisson λ = M contenders: E[S] = λ·e^(−λ/M) = M/e = 19.865490 (reference-values §2)', () => {
    expect(expectedSuccessesPoisson(54, 54)).toBeCloseTo(19.86549, 5);
    const result = runYaml(alohaYaml(54, 54, '20s'));
    expectWithinSE(metricOf(result, 'throughput_per_rao'), expectedSuccessesPoisson(54, 54));
    expectWithinSE(metricOf(result, 'normalised_throughput'), 1 / Math.E);
  });
});
