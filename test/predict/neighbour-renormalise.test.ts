/**
 * Renormalisation of the `neighbour` scores (t_ref moves when (t − t_ref)/τ > 500) must not change
 * scores or rankings. Reference: the documented score computed directly, exact closed form
 * score_i(t) = Σ_{reports r after i's own last report, d ≤ 3σ} exp(−d²/2σ² − (t − t_r)/τ).
 * Tolerance 1e-9 relative on ties and on the threshold boundary (double rounding only).
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { createNeighbourPredictor, NeighbourPredictor, neighbourSchema } from '../../src/predict/neighbour.js';
import { FakeHost, positionsOf } from './fake-host.js';

const TAU = 5000, SIGMA = 100, TOL = 1e-9;
const THETA = 0.01;

function referenceScores(x: number[], y: number[], reports: { d: number; t: number }[], now: number): number[] {
  const score = new Array<number>(x.length).fill(0);
  const parts: { d2: number; t: number }[][] = x.map(() => []);
  for (const r of reports) {
    parts[r.d] = []; // the reporter's own score restarts
    for (let i = 0; i < x.length; i++) {
      if (i === r.d) continue;
      const d2 = ((x[i] as number) - (x[r.d] as number)) ** 2 + ((y[i] as number) - (y[r.d] as number)) ** 2;
      if (d2 <= 9 * SIGMA * SIGMA) parts[i]!.push({ d2, t: r.t });
    }
  }
  parts.forEach((ps, i) => {
    for (const p of ps) score[i] = (score[i] as number) + Math.exp(-p.d2 / (2 * SIGMA * SIGMA) - (now - p.t) / TAU);
  });
  return score;
}

/** Mostly gaps of a fraction of τ, sometimes a long silence. */
const gapArb = fc.oneof(
  { arbitrary: fc.integer({ min: 0, max: 2 * TAU }), weight: 20 },
  { arbitrary: fc.integer({ min: 400 * TAU, max: 3000 * TAU }), weight: 1 },
);

describe('neighbour renormalisation', () => {
  // The renormalisation point is lowered from 500 to `maxExponent` (1 … 20) so that it happens often
  // while candidates are alive; the production value is checked by the deterministic tests below.
  it('scores and rankings match the direct sum, renormalising often', () => {
    let renormalised = 0;
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 800 }), fc.integer({ min: 0, max: 400 })), { minLength: 2, maxLength: 12 }),
        fc.array(fc.tuple(fc.nat(), gapArb), { minLength: 1, maxLength: 60 }),
        fc.integer({ min: 0, max: 10_000 }),
        fc.integer({ min: 1, max: 20 }),
        (pts, steps, extra, maxExponent) => {
          const x = pts.map((p) => p[0]), y = pts.map((p) => p[1]);
          const host = new FakeHost(x.length, positionsOf(x, y));
          const params = neighbourSchema.parse({ model: 'neighbour', quiet_after_report: 0, threshold: THETA });
          const p = new NeighbourPredictor(params, host, { maxExponent });
          let t = 0;
          const reports: { d: number; t: number }[] = [];
          for (const [dev, gap] of steps) {
            t += gap;
            const d = dev % x.length;
            reports.push({ d, t });
            p.observeDelivery(d, t, t);
          }
          const now = t + extra;
          const ref = referenceScores(x, y, reports, now);
          ref.forEach((s, i) => expect(Math.abs(p.scoreOf(i, now) - s)).toBeLessThanOrEqual(TOL * Math.max(1, s)));
          const out = new Int32Array(x.length);
          const m = p.select(now, x.length, out);
          const chosen = new Set(out.subarray(0, m));
          ref.forEach((s, i) => {
            if (s > THETA * (1 + TOL)) expect(chosen.has(i)).toBe(true);
            if (s < THETA * (1 - TOL)) expect(chosen.has(i)).toBe(false);
          });
          for (let j = 1; j < m; j++) {
            const a = ref[out[j - 1] as number] as number, b = ref[out[j] as number] as number;
            expect(a).toBeGreaterThanOrEqual(b * (1 - TOL)); // best first
          }
          if (p.referenceTime > 0) renormalised++;
        },
      ),
      { numRuns: 200 },
    );
    expect(renormalised).toBeGreaterThan(50); // the property did exercise renormalisation
  });

  it('a candidate scored before a renormalisation ranks correctly against one scored after', () => {
    // A at 0 m, C at 10 000 m; reporters at 10 m from A and at 100 m from C (no overlap).
    const pos = positionsOf([0, 10, 10_000, 10_100], [0, 0, 0, 0]);
    const host = new FakeHost(4, pos);
    const p = createNeighbourPredictor(neighbourSchema.parse({ model: 'neighbour', threshold: 0.01 }), host);
    p.observeDelivery(1, 499 * TAU, 499 * TAU); // A scores ≈ 1 (stored as ≈ e^499)
    p.observeDelivery(3, 501 * TAU, 501 * TAU); // renormalises; C scores e^{−1/2} ≈ 0.61
    expect(p.referenceTime).toBe(501 * TAU);
    const out = new Int32Array(4);
    const m = p.select(501 * TAU, 4, out);
    // exact: A's score is e^{−10²/2σ²}·e^{−2} ≈ 0.134 < C's e^{−1/2}: C first.
    expect([...out.subarray(0, m)]).toEqual([2, 0]);
  });

  it('moves t_ref only past 500 τ, and an old burst ranks as a fresh one would', () => {
    const pos = positionsOf([0, 30, 60, 90], [0, 0, 0, 0]);
    const run = (offset: number) => {
      const host = new FakeHost(4, pos);
      const p = createNeighbourPredictor(neighbourSchema.parse({ model: 'neighbour' }), host);
      p.observeDelivery(0, offset, offset);
      p.observeDelivery(3, offset + 5, offset + 5);
      const out = new Int32Array(4);
      const m = p.select(offset + 10, 4, out);
      return { order: [...out.subarray(0, m)], tRef: p.referenceTime, s1: p.scoreOf(1, offset + 10) };
    };
    const fresh = run(0), old = run(10_000 * TAU + 0.5);
    expect(fresh.tRef).toBe(0);
    expect(old.tRef).toBe(10_000 * TAU + 0.5); // moved to the first report past 500 τ
    expect(old.order).toEqual(fresh.order);
    expect(Math.abs(old.s1 - fresh.s1)).toBeLessThan(1e-12);
    expect(run(500 * TAU - 5).tRef).toBe(0); // last report at exactly 500 τ: not yet
    expect(run(500 * TAU - 4.5).tRef).toBe(500 * TAU + 0.5); // its second report is past it: moved there
  });
});
