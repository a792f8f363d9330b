/**
 * Estimates the spatial spread σ (metres) of correlated reports from the distances between
 * consecutive reporters.
 *
 * Model: during an event, reporters are placed as a 2-D Gaussian around a common epicentre c,
 * X = c + σ·Z with Z standard normal in the plane. Two independent reporters differ by
 * X₁ − X₂ ~ N(0, 2σ²·I₂), so E[d²] = E|X₁ − X₂|² = 2·2σ² = 4σ² (exact for that model), whatever c is.
 * The estimate is σ̂ = sqrt(mean(d²) / 4) over all pairs of consecutive reports (in the order they
 * were observed) that are less than `pairWindow` apart in time and come from different devices;
 * pairs further apart are taken to belong to different events and are skipped. Until `minPairs`
 * pairs have been seen, σ̂ is `initialSigma`.
 */
import type { Positions } from '../geometry/positions.js';

export class PairSigmaEstimator {
  private readonly positions: Positions;
  private readonly pairWindow: number;
  private readonly initialSigma: number;
  private readonly minPairs: number;
  private lastDevice = -1;
  private lastTime = -Infinity;
  private sumD2 = 0;
  private count = 0;

  /** `pairWindow` in ms, `initialSigma` in metres. */
  constructor(positions: Positions, pairWindow: number, initialSigma: number, minPairs = 20) {
    this.positions = positions;
    this.pairWindow = pairWindow;
    this.initialSigma = initialSigma;
    this.minPairs = minPairs;
  }

  /** Pairs used so far. */
  get pairs(): number {
    return this.count;
  }

  /** Current estimate of σ in metres. */
  get sigma(): number {
    return this.count < this.minPairs ? this.initialSigma : Math.sqrt(this.sumD2 / this.count / 4);
  }

  /** A report from `device` at time `t` (ms; non-decreasing from call to call). */
  observe(device: number, t: number): void {
    const prev = this.lastDevice;
    if (prev >= 0 && prev !== device && t - this.lastTime < this.pairWindow) {
      const { x, y } = this.positions;
      const dx = (x[device] as number) - (x[prev] as number);
      const dy = (y[device] as number) - (y[prev] as number);
      this.sumD2 += dx * dx + dy * dy;
      this.count++;
    }
    this.lastDevice = device;
    this.lastTime = t;
  }
}
