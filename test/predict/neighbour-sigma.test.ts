/**
 * Automatic σ of the `neighbour` predictor. Model: reporters of one event are 2-D Gaussian around a
 * common epicentre, X = c + σZ; two of them differ by N(0, 2σ²I₂), so E[d²] = 4σ² (exact), and
 * σ̂ = sqrt(mean d²/4) is consistent.
 */
import { describe, it, expect } from 'vitest';
import { createNeighbourPredictor, neighbourSchema } from '../../src/predict/neighbour.js';
import { PairSigmaEstimator } from '../../src/predict/pair-sigma.js';
import { normal, uniform } from '../../src/random/index.js';
import { FakeHost, positionsOf } from './fake-host.js';

describe('automatic σ', () => {
  it('sqrt(mean d²/4) over consecutive pairs closer than the window, different devices only (exact)', () => {
    const pos = positionsOf([0, 3, 3, 50], [0, 4, 10, 50]);
    const e = new PairSigmaEstimator(pos, 1000, 77, 1);
    e.observe(0, 0);
    expect(e.sigma).toBe(77); // no pair yet: the initial value
    e.observe(1, 999); // d² = 25
    e.observe(1, 1000); // same device: no pair
    e.observe(2, 1500); // d² = 36
    e.observe(3, 2500); // exactly one window apart: not a pair
    expect(e.pairs).toBe(2);
    expect(e.sigma).toBe(Math.sqrt((25 + 36) / 2 / 4));
  });

  /*
   * Tolerance: with n consecutive pairs, Var(d²) = 16σ⁴ and neighbouring pairs sharing a reporter
   * have covariance 4σ⁴ (exact for the Gaussian model), so the relative standard error of σ̂ is about
   * ½·sqrt(24/16/n) ≈ 0.0097 at n = 4000; the test allows 5 % (about 5 standard errors).
   */
  it('converges to σ for Gaussian reporters around random epicentres (within 5 %)', () => {
    const sigma = 150, events = 100, perEvent = 41, n = events * perEvent;
    const x = new Float64Array(n), y = new Float64Array(n);
    const host0 = new FakeHost(1);
    const s = host0.stream('test-epicentres');
    for (let ev = 0; ev < events; ev++) {
      const cx = uniform(s, 0, 20_000), cy = uniform(s, 0, 20_000);
      for (let j = 0; j < perEvent; j++) {
        const d = ev * perEvent + j;
        x[d] = normal(s, cx, sigma);
        y[d] = normal(s, cy, sigma);
      }
    }
    const host = new FakeHost(n, { x, y });
    const p = createNeighbourPredictor(neighbourSchema.parse({ model: 'neighbour', sigma: 'auto', initial_sigma: '100m' }), host);
    for (let ev = 0; ev < events; ev++) {
      for (let j = 0; j < perEvent; j++) {
        const t = ev * 10_000 + j * 10; // events 10 s apart, reports 10 ms apart: only in-event pairs
        p.observeDelivery(ev * perEvent + j, t, t);
        if (ev === 0 && j < 20) expect(p.sigma).toBe(100); // j pairs so far: below 20, initial_sigma
      }
    }
    expect(Math.abs(p.sigma / sigma - 1)).toBeLessThan(0.05);
  });
});
