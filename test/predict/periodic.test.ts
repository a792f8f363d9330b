/**
 * The `periodic` predictor against the rules of its header comment (its specification). Sources:
 * "exact, by the documented rule" where a value follows from those rules by arithmetic; the harness
 * (grant occasions every 1 ms, a granted device with data delivers at once with seenStart = the grant
 * time) is common practice for a slotted scheduler. All times in ms.
 */
import { describe, it, expect } from 'vitest';
import { createPeriodicPredictor, periodicPredictorSchema } from '../../src/predict/periodic.js';
import { uniform } from '../../src/random/index.js';
import { FakeHost } from './fake-host.js';

function periodic(n: number, extra: Record<string, unknown> = {}) {
  const host = new FakeHost(n);
  const p = createPeriodicPredictor(periodicPredictorSchema.parse({ model: 'periodic', ...extra }), host);
  return { host, p };
}

type Periodic = ReturnType<typeof createPeriodicPredictor>;

/** Feeds contention deliveries (seenStart = delivery time) to device 0; returns the final P̂. */
function estimateAfter(seen: readonly number[], extra: Record<string, unknown> = {}): number {
  const { p } = periodic(1, extra);
  for (const s of seen) p.observeDelivery(0, s, s);
  return p.periodEstimate(0);
}

/**
 * Strictly periodic reports r = φ_d + kP. The first two of each device reach the base station by
 * contention (seenStart = r exactly); after that the harness grants whatever select returns at each
 * 1 ms occasion: a device with a pending report delivers at once (seenStart = grant time), otherwise
 * the grant is empty. Returns the counts and the extreme lags (grant time − report time; a report
 * still waiting at the horizon counts with its lag so far).
 */
function grantLoop(period: number, phases: readonly number[], horizon: number, check: (p: Periodic, d: number, next: number) => void) {
  const n = phases.length;
  const { host, p } = periodic(n);
  const next = Float64Array.from(phases);
  const pending = new Float64Array(n).fill(NaN); // report time of the pending report, NaN if none
  const seen = new Int32Array(n);
  const out = new Int32Array(n);
  const r = { granted: 0, wasted: 0, overrun: 0, waiting: 0, reports: 0, minLag: Infinity, maxLag: -Infinity, host, p };
  for (let t = 0; t <= horizon; t++) {
    for (let d = 0; d < n; d++) {
      const report = next[d] as number;
      if (report > t) continue;
      r.reports++;
      next[d] = report + period;
      if (!Number.isNaN(pending[d] as number)) r.overrun++; // the previous report is still waiting
      if ((seen[d] as number) < 2) {
        p.observeDelivery(d, t, report);
        seen[d] = (seen[d] as number) + 1;
        if (seen[d] === 2) check(p, d, next[d] as number);
      } else pending[d] = report;
    }
    const m = p.select(t, n, out);
    for (let i = 0; i < m; i++) {
      const d = out[i] as number;
      const report = pending[d] as number;
      if (Number.isNaN(report)) {
        p.observeGrant(d, t, false, t);
        r.wasted++;
        continue;
      }
      r.minLag = Math.min(r.minLag, t - report);
      r.maxLag = Math.max(r.maxLag, t - report);
      p.observeGrant(d, t, true, t);
      p.observeDelivery(d, t, t);
      pending[d] = NaN;
      r.granted++;
    }
  }
  for (let d = 0; d < n; d++) {
    const report = pending[d] as number;
    if (Number.isNaN(report)) continue;
    r.waiting++; // still waiting at the horizon: its lag is at least horizon − report
    r.maxLag = Math.max(r.maxLag, horizon - report);
  }
  return r;
}

describe('periodic predictor: strictly periodic reports', () => {
  const period = 100, margin = 1, horizon = 20_000; // 200 periods
  const cases: [string, (d: number) => number][] = [
    ['integer phases', (d) => (d * 37) % period], // several devices share a phase
    ['phases off the 1 ms grid', (d) => ((d * 37) % period) + (d % 8) / 8], // eighths: exact in binary
  ];
  for (const [name, phase] of cases) {
    it(`${name}: predicted = next report after two deliveries; then no grant wasted, lag in [margin, margin + 1]`, () => {
      const phases = Array.from({ length: 40 }, (_, d) => phase(d));
      const r = grantLoop(period, phases, horizon, (p, d, next) => {
        // exact, by the documented rule: P̂ = difference of the two seenStarts = P, predicted = last + P̂.
        expect(p.periodEstimate(d)).toBe(period);
        expect(p.predictedAccess(d)).toBe(next);
      });
      expect(r.wasted).toBe(0); // exact: a grant aimed at predicted + margin ≥ the report always finds it
      expect(r.overrun).toBe(0); // every report granted before the next one
      expect(r.granted).toBe(r.reports - 2 * phases.length - r.waiting); // all but the two learnt by contention
      // exact: the first occasion at or after report + margin lies in [report + margin, report + margin + 1).
      expect(r.minLag).toBeGreaterThanOrEqual(margin);
      expect(r.maxLag).toBeLessThanOrEqual(margin + 1);
      if (name === 'integer phases') expect(r.maxLag).toBe(margin); // on the grid: exactly margin
      expect(r.host.redundant).toBe(0);
      for (let d = 0; d < phases.length; d++) expect(r.p.periodEstimate(d)).toBe(period);
    });
  }
});

/** Selects device 0 at every 1 ms occasion in [from, to]; `hasData(t)` decides used/empty. Returns grant times. */
function grantTimes(p: Periodic, from: number, to: number, hasData: (t: number) => boolean): number[] {
  const out = new Int32Array(1);
  const times: number[] = [];
  for (let t = from; t <= to; t++) {
    if (p.select(t, 1, out) === 0) continue;
    times.push(t);
    const used = hasData(t);
    p.observeGrant(0, t, used, t);
    if (used) p.observeDelivery(0, t, t);
  }
  return times;
}

/** exact, by the documented rule: first grant at predicted + margin, then gaps retry_after·2^j, j < max_retries. */
function retrySchedule(predicted: number, margin: number, retryAfter: number, maxRetries: number): number[] {
  const times = [predicted + margin];
  for (let j = 0; j < maxRetries; j++) times.push((times[j] as number) + retryAfter * 2 ** j);
  return times;
}

describe('periodic predictor: empty grants', () => {
  it('re-arm after retry_after, 2×, 4×, … at most max_retries times, then wait for the next delivery', () => {
    for (const [maxRetries, retryAfter, margin] of [[0, 2, 1], [2, 2, 1], [5, 2, 1], [7, 3, 2]] as const) {
      const { p } = periodic(1, { max_retries: maxRetries, retry_after: `${retryAfter}ms`, margin: `${margin}ms` });
      p.observeDelivery(0, 0, 0);
      p.observeDelivery(0, 100, 100); // P̂ = 100, predicted 200; the report never comes
      // (In every case the next, uncapped retry would fall before the expiry 200 + patience = 1200.)
      expect(grantTimes(p, 101, 1250, () => false)).toEqual(retrySchedule(200, margin, retryAfter, maxRetries));
      // A later delivery 12 periods on (11 reports lost): P̂ = (1300 − 0)/13 = 100 (exact, whole-period
      // rule) and the retries start over from the new prediction 1400.
      p.observeDelivery(0, 1300, 1300);
      expect(p.periodEstimate(0)).toBe(100);
      expect(grantTimes(p, 1300, 2250, () => false)).toEqual(retrySchedule(1400, margin, retryAfter, maxRetries));
    }
  });

  it('defaults: an early first estimate is caught by the doubling window, and the grant re-anchors', () => {
    // True reports at 100·k; the first one was seen 10 ms late by contention: P̂ = 100 − 10 = 90.
    const { p } = periodic(1);
    p.observeDelivery(0, 10, 10);
    p.observeDelivery(0, 100, 100);
    expect(p.predictedAccess(0)).toBe(190);
    // exact, by the documented rule: 191 (empty), 193 (empty), 197 (empty), 205 (the report is there).
    expect(grantTimes(p, 101, 260, (t) => t >= 200)).toEqual([191, 193, 197, 205]);
    // The first delivery through our grant, dated back by margin (204), is the new anchor; P̂ kept.
    expect(p.periodEstimate(0)).toBe(90);
    expect(p.predictedAccess(0)).toBe(294);
    // Next: 295 (empty), 297 (empty), 301 (used): dated 300, P̂ = (300 − 204)/1 = 96.
    expect(grantTimes(p, 261, 360, (t) => t >= 300)).toEqual([295, 297, 301]);
    expect(p.periodEstimate(0)).toBe(96);
  });

  it('a used grant changes nothing until its delivery; lead and patience bound the candidacy', () => {
    const { p } = periodic(1, { lead: '5ms', patience: '10ms' });
    p.observeDelivery(0, 0, 0);
    p.observeDelivery(0, 50, 50); // predicted 100: candidate from 100 + 1 − 5 = 96 until 100 + 10
    const out = new Int32Array(1);
    for (const [t, expected] of [[95.5, false], [96, true], [109.5, true], [110, false]] as const) {
      p.select(t, 0, out);
      expect(p.isCandidate(0)).toBe(expected); // exact, by the documented rule
    }
    const q = periodic(1).p;
    q.observeDelivery(0, 0, 0);
    q.observeDelivery(0, 50, 50);
    expect(q.select(101, 1, out)).toBe(1);
    q.observeGrant(0, 101, true, 101);
    expect(q.isCandidate(0)).toBe(false);
    expect(q.predictedAccess(0)).toBe(100);
    expect(q.periodEstimate(0)).toBe(50);
  });
});

describe('periodic predictor: baseline estimate', () => {
  it('P̂ = (last − anchor)/periods over noisy observations; a missed report adds two periods', () => {
    const anchor = 5, period = 100;
    const noise = [0, 0.4, -0.3, 0.2, -0.1, 0.35, -0.45, 0.05];
    const { p } = periodic(1);
    noise.forEach((e, k) => {
      const s = anchor + k * period + e;
      p.observeDelivery(0, s, s);
      // exact, by the documented rule (every difference is within 1 ms of P: one period each).
      expect(p.periodEstimate(0)).toBe(k === 0 ? NaN : (s - anchor) / k);
    });
    const last = anchor + 9 * period + 0.3; // report 8 missed: difference ≈ 2P
    p.observeDelivery(0, last, last);
    expect(p.periodEstimate(0)).toBe((last - anchor) / 9);
    expect(p.predictedAccess(0)).toBe(last + (last - anchor) / 9);
  });

  it('whole-period rule at its edges: |diff − m·P̂| ≤ tolerance·P̂ adds m periods, else restart', () => {
    // After 0 and 100 (P̂ = 100) a third seenStart at 100 + diff. Accepted with m periods:
    // P̂ = (100 + diff)/(1 + m); restarted: P̂ = diff (last two). exact, by the documented rule.
    const cases: [number, number | null][] = [
      [75, 1], [74.5, null], [125, 1], [125.5, null], [150, null], [175, 2], [225, 2], [174.5, null],
      [300.2, 3], [60, null], [20, null],
    ];
    for (const [diff, m] of cases) {
      expect(estimateAfter([0, 100, 100 + diff]), `diff ${diff}`).toBe(m === null ? diff : (100 + diff) / (1 + m));
    }
    // reset_tolerance 0.1: 10 ms either way.
    expect(estimateAfter([0, 100, 209.5], { reset_tolerance: 0.1 })).toBe(209.5 / 2);
    expect(estimateAfter([0, 100, 210.5], { reset_tolerance: 0.1 })).toBe(110.5);
    expect(estimateAfter([0, 100, 190.5], { reset_tolerance: 0.1 })).toBe(190.5 / 2);
    expect(estimateAfter([0, 100, 189.5], { reset_tolerance: 0.1 })).toBe(89.5);
  });

  it('a restart counts from the last two seenStarts; differences ≤ 0 are ignored', () => {
    // 0, 100, 200 (P̂ 100), 350 (off by 0.5 P: restart, anchor 200, P̂ 150), 500 (P̂ (500 − 200)/2).
    expect(estimateAfter([0, 100, 200, 350])).toBe(150);
    expect(estimateAfter([0, 100, 200, 350, 500])).toBe(150);
    expect(estimateAfter([0, 100, 200, 350, 501])).toBe(301 / 2);
    const { p } = periodic(1);
    for (const s of [0, 100, 200]) p.observeDelivery(0, s, s);
    for (const s of [200, 150]) {
      p.observeDelivery(0, 260, s); // the same or an earlier instant: nothing changes
      expect(p.periodEstimate(0)).toBe(100);
      expect(p.predictedAccess(0)).toBe(300);
    }
  });

  it('re-anchoring: the first delivery through our grant (minus margin, at most the prediction) becomes the anchor, P̂ kept', () => {
    for (const margin of [1, 2.5]) {
      const { p } = periodic(1, { margin: `${margin}ms` });
      for (const s of [3, 105, 198]) p.observeDelivery(0, s, s); // rough, by contention
      expect(p.periodEstimate(0)).toBe((198 - 3) / 2);
      expect(p.predictedAccess(0)).toBe(295.5);
      // Through our first grant, late: 297 + margin − margin = 297 > 295.5, so dated to the
      // prediction 295.5 (a late grant must not push the estimate later).
      const grant = 297 + margin;
      p.observeGrant(0, grant, true, grant);
      p.observeDelivery(0, grant, grant);
      expect(p.periodEstimate(0)).toBe(97.5); // kept until the next observation
      expect(p.predictedAccess(0)).toBe(295.5 + 97.5);
      p.observeDelivery(0, 401, 401); // by contention: one period from the new anchor 295.5
      expect(p.periodEstimate(0)).toBe(401 - 295.5); // not (401 − 3)/4
      // A second grant delivery, earlier than its prediction (506.5): dated back by margin, no re-anchoring.
      p.observeGrant(0, 500 + margin, true, 500 + margin);
      p.observeDelivery(0, 500 + margin, 500 + margin);
      expect(p.periodEstimate(0)).toBe((500 - 295.5) / 2);
      // exact, by the documented rule (margin 2.5 and these times are exact in binary).
    }
  });

  /*
   * Reports r_k = φ + kP + J_k, J_k ∈ [0, J), seen exactly by contention. While no restart happens,
   * P̂ after report k = (r_k − r_0)/k, so |P̂ − P| = |J_k − J_0|/k < J/k (exact). No restart can
   * happen: every difference is within J of P and P̂ within J of P, so |diff − P̂| < 2J = 0.2P
   * ≤ tolerance·P̂ = 0.25·P̂ for P̂ > 0.8P (exact, for J = P/10).
   */
  it('jittered periods: the baseline estimate converges within J/periods of P', () => {
    const n = 50, period = 1000, jitter = 100, reports = 400;
    const { host, p } = periodic(n);
    const s = host.stream('test-jitter');
    const first = new Float64Array(n);
    for (let k = 0; k < reports; k++) {
      for (let d = 0; d < n; d++) {
        const r = d * 17.5 + k * period + uniform(s, 0, jitter);
        p.observeDelivery(d, r, r);
        if (k === 0) first[d] = r;
        else {
          expect(p.periodEstimate(d)).toBe((r - (first[d] as number)) / k);
          expect(Math.abs(p.periodEstimate(d) - period)).toBeLessThan(jitter / k);
        }
      }
    }
  });
});

describe('periodic predictor: schema', () => {
  it('defaults; reset_tolerance must be in (0, 0.5); smoothing is gone', () => {
    expect(periodicPredictorSchema.parse({ model: 'periodic' })).toEqual({
      model: 'periodic', reset_tolerance: 0.25, lead: 0, margin: 1, patience: 1000, retry_after: 2, max_retries: 5,
    });
    const ok = (extra: Record<string, unknown>) => periodicPredictorSchema.safeParse({ model: 'periodic', ...extra }).success;
    expect(ok({ reset_tolerance: 0.49 })).toBe(true);
    expect(ok({ reset_tolerance: 0.5 })).toBe(false); // 0.5 would make the whole number m ambiguous
    expect(ok({ reset_tolerance: 0.6 })).toBe(false);
    expect(ok({ reset_tolerance: 0 })).toBe(false);
    expect(ok({ smoothing: 0.5 })).toBe(false);
    expect(ok({ patience: '0ms' })).toBe(false);
    expect(ok({ retry_after: '0ms' })).toBe(false);
    expect(ok({ max_retries: 0 })).toBe(true);
    expect(ok({ max_retries: 1.5 })).toBe(false);
  });
});
