/**
 * Beta(a, b) stretched over [0, scale] — the activation-time law of 3GPP TR 37.868 clause 6.1
 * traffic model 2 (Beta(3, 4) over 10 s). Moments are exact.
 */
import jStat from 'jstat';
import { lnBeta } from './special.js';
import { requirePositive } from './validate.js';

export interface BetaMoments {
  /** Mean, in scale units: scale·a/(a + b). */
  readonly mean: number;
  /** Standard deviation, in scale units: scale·√(ab/((a+b)²(a+b+1))). */
  readonly sd: number;
  /** Mode, in scale units: scale·(a−1)/(a+b−2) for a, b > 1; at an end when a or b ≤ 1; NaN when not unique. */
  readonly mode: number;
  /** Density at the mode, per scale unit (1/scale at the unit-interval density); Infinity when unbounded. */
  readonly peakDensity: number;
}

/** Mode on [0, 1] and density there; unbounded densities (a < 1 or b < 1) give Infinity. */
function unitMode(a: number, b: number): { mode: number; density: number } {
  if (a > 1 && b > 1) {
    const m = (a - 1) / (a + b - 2);
    return { mode: m, density: Math.exp((a - 1) * Math.log(m) + (b - 1) * Math.log1p(-m) - lnBeta(a, b)) };
  }
  if (a < 1 || b < 1) return { mode: a < 1 && b < 1 ? NaN : a < 1 ? 0 : 1, density: Infinity };
  if (a === 1 && b === 1) return { mode: NaN, density: 1 };
  return a === 1 ? { mode: 0, density: b } : { mode: 1, density: a };
}

/** Mean, standard deviation, mode and peak density of scale·X with X ~ Beta(a, b). Exact. */
export function betaMoments(a: number, b: number, scale = 1): BetaMoments {
  requirePositive('a', a);
  requirePositive('b', b);
  requirePositive('scale', scale);
  const s = a + b;
  const { mode, density } = unitMode(a, b);
  return {
    mean: (scale * a) / s,
    sd: scale * Math.sqrt((a * b) / (s * s * (s + 1))),
    mode: mode * scale,
    peakDensity: density / scale,
  };
}

/**
 * P(start ≤ scale·X < end) for X ~ Beta(a, b): the probability that an activation falls in a window
 * (for example one random-access occasion), from the Beta distribution function. `start` and `end`
 * are in scale units and are clipped to [0, scale].
 */
export function betaWindowProbability(a: number, b: number, scale: number, start: number, end: number): number {
  requirePositive('a', a);
  requirePositive('b', b);
  requirePositive('scale', scale);
  if (!(end >= start)) throw new RangeError(`window end must be ≥ start, got [${start}, ${end}]`);
  const lo = Math.min(1, Math.max(0, start / scale));
  const hi = Math.min(1, Math.max(0, end / scale));
  return jStat.beta.cdf(hi, a, b) - jStat.beta.cdf(lo, a, b);
}
