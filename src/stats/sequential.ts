/**
 * Relative-precision stopping rule for independent replications (Law & Kelton, Simulation
 * Modeling and Analysis, 3rd ed., sec. 9.4.1): with the half-width δ = t_{n−1,1−α/2}·s/√n, stop
 * when δ / |mean| ≤ γ/(1+γ); the relative error of the mean is then at most γ with confidence
 * about 1 − α.
 */
import { checkLevel, summarize, tQuantile } from './summary.js';

function checkGamma(gamma: number): void {
  if (!(gamma > 0 && Number.isFinite(gamma))) {
    throw new RangeError(`relative precision gamma must be a finite number > 0, got ${gamma}`);
  }
}

/** The adjusted relative half-width limit γ/(1+γ). */
export function adjustedPrecision(gamma: number): number {
  checkGamma(gamma);
  return gamma / (1 + gamma);
}

/**
 * True when the finite samples (NaN/Infinity skipped) meet the relative-precision rule at
 * `level`. False with fewer than two samples or a zero mean with zero spread.
 */
export function relativePrecisionReached(samples: ArrayLike<number>, gamma: number, level: number): boolean {
  const limit = adjustedPrecision(gamma);
  const s = summarize(samples, level);
  if (s.n < 2) return false;
  return s.half_width / Math.abs(s.mean) <= limit;
}

/** t_{n−1} · std / √n / |mean| for n replications. */
function relativeHalfWidth(n: number, mean: number, std: number, p: number): number {
  return (tQuantile(p, n - 1) * std) / Math.sqrt(n) / Math.abs(mean);
}

/**
 * Smallest n ≥ max(2, nMin) for which t_{n−1,1−α/2} · std/√n / |mean| ≤ γ/(1+γ), given a pilot
 * mean and standard deviation (the planning form of the same rule). The left side decreases in n,
 * so an exponential search followed by bisection finds n. Infinity when the mean is 0 (and the
 * std is not) or n would exceed 2^52.
 */
export function replicationsNeeded(mean: number, std: number, gamma: number, level: number, nMin = 2): number {
  const limit = adjustedPrecision(gamma);
  checkLevel(level);
  if (!Number.isFinite(mean) || !(std >= 0) || !Number.isFinite(std)) {
    throw new RangeError(`replicationsNeeded: mean and std must be finite, std ≥ 0 (got ${mean}, ${std})`);
  }
  const start = Math.max(2, Math.ceil(nMin));
  if (std === 0) return start;
  if (mean === 0) return Infinity;
  const p = 1 - (1 - level) / 2;
  const ok = (n: number): boolean => relativeHalfWidth(n, mean, std, p) <= limit;
  if (ok(start)) return start;
  let low = start; // fails
  let high = start * 2;
  while (!ok(high)) {
    low = high;
    high *= 2;
    if (high > 2 ** 52) return Infinity;
  }
  while (high - low > 1) {
    const mid = Math.floor((low + high) / 2);
    if (ok(mid)) high = mid;
    else low = mid;
  }
  return high;
}
