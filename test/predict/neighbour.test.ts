/**
 * The `neighbour` predictor: exact kernel and decay (closed forms of the documented score
 * score_i(t) = Σ exp(−d²/2σ²)·e^{−(t − t_r)/τ}), ranking, expiry, holds, and the renormalisation of
 * the stored scores against a direct computation of that sum.
 */
import { describe, it, expect } from 'vitest';
import { createNeighbourPredictor, neighbourSchema } from '../../src/predict/neighbour.js';
import type { Positions } from '../../src/geometry/positions.js';
import { FakeHost, positionsOf } from './fake-host.js';

const TAU = 5000;
const SIGMA = 100;

function neighbour(positions: Positions, extra: Record<string, unknown> = {}) {
  const host = new FakeHost(positions.x.length, positions);
  const p = createNeighbourPredictor(neighbourSchema.parse({ model: 'neighbour', ...extra }), host);
  return { host, p };
}

/** Relative closeness for closed-form checks (double rounding only). */
function expectRel(a: number, b: number, tol = 1e-13): void {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.abs(b));
}

// Device 0 reports from (0, 0); the others sit on the x axis at these distances (metres).
const DIST = [0, 50, 100, 150, 179, 180, 250, 299, 301];
const line = () => positionsOf([0, ...DIST], new Array<number>(DIST.length + 1).fill(0));

describe('neighbour predictor', () => {
  it('a device at distance d gets exp(−d²/2σ²), nothing beyond 3σ (exact)', () => {
    const { p } = neighbour(line());
    p.observeDelivery(0, 1000, 1000);
    DIST.forEach((d, i) => {
      const expected = d <= 3 * SIGMA ? Math.exp(-(d * d) / (2 * SIGMA * SIGMA)) : 0;
      expectRel(p.scoreOf(i + 1, 1000), expected);
    });
    expect(p.scoreOf(0, 1000)).toBe(0); // the reporter itself
  });

  it('scores decay by e^{−Δt/τ} and add up over reports (exact)', () => {
    const pos = positionsOf([0, 100, 50], [0, 0, 0]);
    const { p } = neighbour(pos, { quiet_after_report: 0 });
    const k50 = Math.exp(-(50 * 50) / (2 * SIGMA * SIGMA));
    p.observeDelivery(0, 0, 0);
    for (const dt of [0, 1, 1234.5, 20_000]) expectRel(p.scoreOf(2, dt), k50 * Math.exp(-dt / TAU));
    p.observeDelivery(1, 1000, 1000);
    for (const t of [1000, 7000]) expectRel(p.scoreOf(2, t), k50 * Math.exp(-t / TAU) + k50 * Math.exp(-(t - 1000) / TAU));
  });

  it('ranks by proximity; candidates are exactly the devices with exp(−d²/2σ²) ≥ threshold', () => {
    const { p, host } = neighbour(line());
    p.observeDelivery(0, 1000, 1000);
    const out = new Int32Array(20);
    const m = p.select(1000, 20, out);
    // exact: k(d) ≥ 0.2 ⟺ d ≤ σ·sqrt(2 ln 5) = 179.41 m.
    const expected = DIST.map((d, i) => [d, i + 1] as const).filter(([d]) => d <= SIGMA * Math.sqrt(2 * Math.log(5))).map(([, i]) => i);
    expect([...out.subarray(0, m)]).toEqual(expected);
    expect(host.flaggedCount).toBe(0);
  });

  it('a candidate expires when its score falls to the threshold: t + τ·ln(k/θ) (exact)', () => {
    const { p } = neighbour(line());
    p.observeDelivery(0, 1000, 1000);
    const expiry = 1000 + TAU * Math.log(Math.exp(-(50 * 50) / (2 * SIGMA * SIGMA)) / 0.2); // device 2, d = 50
    const out = new Int32Array(1);
    p.select(expiry - 0.01, 0, out);
    expect(p.isCandidate(2)).toBe(true);
    p.select(expiry + 0.01, 0, out);
    expect(p.isCandidate(2)).toBe(false);
    expect(p.isCandidate(1)).toBe(true); // d = 0 lasts until 1000 + τ ln 5
  });

  it('an empty grant holds the device back retry_after; a used one waits for the delivery', () => {
    const { p, host } = neighbour(line(), { retry_after: '20ms' });
    p.observeDelivery(0, 1000, 1000);
    const out = new Int32Array(2);
    expect(p.select(1010, 2, out)).toBe(2);
    expect([...out]).toEqual([1, 2]);
    p.observeGrant(1, 1011, false, 1011);
    p.observeGrant(2, 1011, true, 1011);
    p.select(1030, 0, out);
    expect(p.isCandidate(1)).toBe(false);
    p.select(1031, 0, out);
    expect(p.isCandidate(1)).toBe(true);
    expect(p.isCandidate(2)).toBe(false);
    // Device 2 reports: it is not a candidate for its own report, and its score restarts at 0.
    p.observeDelivery(2, 1040, 1040);
    expect(p.scoreOf(2, 1040)).toBe(0);
    expect(p.isCandidate(2)).toBe(false);
    expect(host.redundant).toBe(0);
  });

  it('a reporter is not a candidate during quiet_after_report, even if others report nearby', () => {
    const { p } = neighbour(positionsOf([0, 10], [0, 0]), { quiet_after_report: '1s' });
    const out = new Int32Array(2);
    p.observeDelivery(0, 0, 0);
    p.observeDelivery(1, 10, 10); // device 0 scores ≈ 1 but is quiet until 1000
    p.select(999, 0, out);
    expect(p.isCandidate(0)).toBe(false);
    p.select(1000, 0, out);
    expect(p.isCandidate(0)).toBe(true);
  });

  it('needs positions', () => {
    const host = new FakeHost(3, null);
    expect(() => createNeighbourPredictor(neighbourSchema.parse({ model: 'neighbour' }), host)).toThrow(/positions/);
  });

  it('schema defaults and units', () => {
    expect(neighbourSchema.parse({ model: 'neighbour' })).toEqual({
      model: 'neighbour', sigma: 100, initial_sigma: 100, pair_window: 1000, decay: 5000, threshold: 0.2,
      retry_after: 20, quiet_after_report: 60_000, neighbours: 32,
    });
    expect(neighbourSchema.parse({ model: 'neighbour', sigma: 'auto' }).sigma).toBe('auto');
    expect(neighbourSchema.parse({ model: 'neighbour', sigma: '1.5km' }).sigma).toBe(1500);
    expect(neighbourSchema.safeParse({ model: 'neighbour', sigma: 100 }).success).toBe(false); // unit required
  });
});
