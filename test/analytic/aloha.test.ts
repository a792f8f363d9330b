import { describe, it, expect } from 'vitest';
import { pureAlohaThroughput, saturatedSlottedThroughput, slottedAlohaThroughput } from '../../src/analytic/index.js';

describe('ALOHA throughput (Abramson 1970; Roberts 1975; Bertsekas & Gallager, Data Networks, 2nd ed., ch. 4)', () => {
  it.each([
    [0.1, 0.090484],
    [0.25, 0.1947],
    [0.5, 0.303265],
    [1, 0.367879],
    [2, 0.270671],
  ])('slotted, G = %f → S = G·e^(−G) = %f (exact)', (G, S) => {
    expect(slottedAlohaThroughput(G)).toBeCloseTo(S, 6);
  });

  it('slotted maximum 1/e = 0.367879 at G = 1; pure maximum 1/(2e) = 0.183940 at G = 0.5 (exact)', () => {
    expect(slottedAlohaThroughput(1)).toBeCloseTo(0.367879, 6);
    expect(pureAlohaThroughput(0.5)).toBeCloseTo(0.18394, 6);
    for (const G of [0.4, 0.49, 0.51, 0.6]) expect(pureAlohaThroughput(G)).toBeLessThan(pureAlohaThroughput(0.5));
    for (const G of [0.9, 0.99, 1.01, 1.1]) expect(slottedAlohaThroughput(G)).toBeLessThan(slottedAlohaThroughput(1));
  });

  it.each([
    [2, 0.5],
    [5, 0.4096],
    [10, 0.38742],
    [54, 0.371323],
    [100, 0.36973],
  ])('N = %i saturated nodes at p = 1/N → S = N·p·(1−p)^(N−1) = %f (exact)', (N, S) => {
    expect(saturatedSlottedThroughput(N, 1 / N)).toBeCloseTo(S, 6);
  });

  it('rejects negative loads and probabilities outside [0, 1]', () => {
    expect(() => slottedAlohaThroughput(-1)).toThrow(RangeError);
    expect(() => saturatedSlottedThroughput(3, 1.5)).toThrow(RangeError);
  });
});
