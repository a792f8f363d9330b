import { describe, it, expect } from 'vitest';
import { batchArrivalSojourn, md1Sojourn, md1WaitingTime } from '../../src/analytic/index.js';

describe('queues for the granted uplink (exact)', () => {
  it.each([
    [0.5, 1.5],
    [0.8, 3.0],
    [0.9, 5.5],
  ])('one grant per slot, Poisson batches λ = %f → W = %f slots, equal to the M/D/1 sojourn (exact)', (lambda, W) => {
    expect(batchArrivalSojourn(lambda, lambda + lambda * lambda)).toBeCloseTo(W, 12);
    expect(md1Sojourn(lambda)).toBeCloseTo(W, 12);
  });

  it('Bernoulli batches (E[A²] = λ) never wait: W = 1 slot (exact)', () => {
    expect(batchArrivalSojourn(0.7, 0.7)).toBeCloseTo(1, 12);
  });

  it('M/D/1 (Pollaczek–Khinchine): λ = 0.8, D = 1 → W_q = 2.0; scales with D (exact)', () => {
    expect(md1WaitingTime(0.8, 1)).toBeCloseTo(2, 12);
    expect(md1WaitingTime(0.08, 10)).toBeCloseTo(20, 10);
  });

  it('unstable queues give Infinity; impossible moments are rejected (exact)', () => {
    expect(md1Sojourn(1)).toBe(Infinity);
    expect(batchArrivalSojourn(1.2, 3)).toBe(Infinity);
    expect(() => batchArrivalSojourn(0.5, 0.4)).toThrow(RangeError);
  });
});
