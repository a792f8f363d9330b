import { describe, it, expect } from 'vitest';
import { betaMoments, betaWindowProbability, lnGamma } from '../../src/analytic/index.js';

describe('Beta(3, 4) over 10 s — 3GPP TR 37.868 clause 6.1 traffic model 2 (exact moments)', () => {
  it('mean 4.285714 s, sd 1.749636 s, mode 4.0 s, peak density 0.20736 /s (exact)', () => {
    const m = betaMoments(3, 4, 10);
    expect(m.mean).toBeCloseTo(4.285714, 6);
    expect(m.sd).toBeCloseTo(1.749636, 6);
    expect(m.mode).toBeCloseTo(4, 12);
    expect(m.peakDensity).toBeCloseTo(0.20736, 12);
  });

  it('expected arrivals in the 5 ms occasion at 4.0 s = N·0.0010368 → 31.10 for N = 30,000 (exact)', () => {
    const perDevice = betaMoments(3, 4, 10).peakDensity * 0.005;
    expect(perDevice).toBeCloseTo(0.0010368, 12);
    expect(30_000 * perDevice).toBeCloseTo(31.1, 2);
    // Cross-check through the Beta distribution function over [3.9975 s, 4.0025 s] (exact up to
    // the O(width³) curvature term, < 1e-9 here).
    expect(betaWindowProbability(3, 4, 10, 3.9975, 4.0025)).toBeCloseTo(0.0010368, 8);
    expect(betaWindowProbability(3, 4, 10, -5, 50)).toBeCloseTo(1, 12);
  });

  it('boundary shapes: Beta(1, 1) is uniform, Beta(1, 3) peaks at 0 with density 3 (exact)', () => {
    const uniform = betaMoments(1, 1, 60);
    expect(uniform.mean).toBe(30);
    expect(uniform.sd).toBeCloseTo(60 / Math.sqrt(12), 12);
    expect(uniform.peakDensity).toBeCloseTo(1 / 60, 15);
    expect(betaMoments(1, 3).mode).toBe(0);
    expect(betaMoments(1, 3).peakDensity).toBe(3);
    expect(betaMoments(0.5, 2).peakDensity).toBe(Infinity);
  });

  it('lnGamma matches ln((n−1)!) and ln Γ(1/2) = ln √π (exact)', () => {
    expect(lnGamma(1)).toBeCloseTo(0, 13);
    expect(lnGamma(7)).toBeCloseTo(Math.log(720), 12);
    expect(lnGamma(21)).toBeCloseTo(Math.log(2432902008176640000), 11);
    expect(lnGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 13);
  });
});
