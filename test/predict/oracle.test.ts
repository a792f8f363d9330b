/**
 * The `oracle` predictor against exact binomial and hypergeometric laws. Bands: ±3.2905 standard
 * deviations = the two-sided 99.9 % normal band (Φ⁻¹(0.9995) = 3.2905, exact to 4 decimals), the
 * normal approximation to sums of many independent binomial/hypergeometric counts (common practice).
 */
import { describe, it, expect } from 'vitest';
import { createOracle, oracleSchema } from '../../src/predict/oracle.js';
import { FakeHost } from './fake-host.js';

const Z999 = 3.2905;

function oracle(n: number, recall: number, falseAlarm: number, seed = 'oracle') {
  const host = new FakeHost(n, null, seed);
  const p = createOracle(oracleSchema.parse({ model: 'oracle', recall, false_alarm: falseAlarm }), host);
  return { host, p };
}

describe('oracle predictor', () => {
  it('foresees each packet with probability recall (exact: Binomial(n, r) count, 99.9 % band)', () => {
    const { host, p } = oracle(100, 0.7, 0);
    const packets = 20_000;
    let foreseen = 0;
    for (let i = 0; i < packets; i++) {
      const d = i % 100;
      p.truthWaiting(d);
      foreseen += host.flagged[d] as number;
      p.truthDone(d);
      expect(host.flagged[d]).toBe(0);
    }
    const r = 0.7;
    expect(Math.abs(foreseen - packets * r)).toBeLessThan(Z999 * Math.sqrt(packets * r * (1 - r)));
    expect(host.redundant).toBe(0);
  });

  it('false alarms per select have mean N_idle·f (exact: sum of Binomial(N_idle, f) counts, 99.9 % band)', () => {
    const n = 1000, waiting = 200, f = 0.01, occasions = 2000, k = 5;
    const { host, p } = oracle(n, 0, f); // recall 0: no device is foreseen
    for (let d = 0; d < waiting; d++) p.truthWaiting(d);
    const out = new Int32Array(k);
    let total = 0;
    for (let o = 0; o < occasions; o++) {
      const m = p.select(o, k, out);
      const fa = p.transientFalseAlarms();
      total += fa;
      expect(m).toBe(Math.min(k, fa));
      const picked = [...out.subarray(0, m)];
      expect(new Set(picked).size).toBe(m); // distinct within the occasion
      for (const d of picked) expect(d).toBeGreaterThanOrEqual(waiting); // only idle devices
    }
    const trials = (n - waiting) * occasions;
    expect(Math.abs(total - trials * f)).toBeLessThan(Z999 * Math.sqrt(trials * f * (1 - f)));
    expect(host.flaggedCount).toBe(0); // false alarms are transient, never flagged
  });

  it('recall 1, false_alarm 0: select returns exactly the waiting devices (no waste)', () => {
    const n = 500;
    const { host, p } = oracle(n, 1, 0);
    const out = new Int32Array(n);
    const waiting = new Set<number>();
    for (let round = 0; round < 50; round++) {
      for (let d = (round * 7) % 13; d < n; d += 3 + (round % 5)) {
        if (!waiting.has(d)) { waiting.add(d); p.truthWaiting(d); }
      }
      const k = round % 2 === 0 ? n : 10;
      const m = p.select(round, k, out);
      expect(p.transientFalseAlarms()).toBe(0);
      expect(m).toBe(Math.min(k, waiting.size));
      const picked = [...out.subarray(0, m)];
      expect(new Set(picked).size).toBe(m);
      for (const d of picked) {
        expect(waiting.has(d)).toBe(true);
        expect(host.flagged[d]).toBe(0);
        waiting.delete(d);
        p.truthDone(d);
      }
      expect(host.flaggedCount).toBe(waiting.size);
    }
    expect(host.redundant).toBe(0);
  });

  it('picks foreseen devices in proportion A/(A+F) (exact: hypergeometric mean and variance, 99.9 % band)', () => {
    const n = 1000, a = 50, k = 10, occasions = 3000;
    const { p } = oracle(n, 1, 0.02);
    for (let d = 0; d < a; d++) p.truthWaiting(d);
    const out = new Int32Array(k);
    let dev = 0, variance = 0;
    for (let o = 0; o < occasions; o++) {
      expect(p.foreseenCount).toBe(a);
      const m = p.select(o, k, out);
      const f = p.transientFalseAlarms();
      const total = a + f;
      expect(m).toBe(Math.min(k, total));
      let hits = 0;
      for (let i = 0; i < m; i++) {
        const d = out[i] as number;
        if (d < a) { hits++; p.truthDone(d); p.truthWaiting(d); } // re-foreseen: A stays 50
      }
      // Hypergeometric(m draws, a successes, total): mean m·a/total, variance m·(a/T)(f/T)(T−m)/(T−1).
      dev += hits - (m * a) / total;
      if (total > 1) variance += (m * (a / total) * (f / total) * (total - m)) / (total - 1);
    }
    expect(Math.abs(dev)).toBeLessThan(Z999 * Math.sqrt(variance));
  });

  it('schema: defaults recall 1, false_alarm 0; rejects values outside [0, 1]', () => {
    expect(oracleSchema.parse({ model: 'oracle' })).toEqual({ model: 'oracle', recall: 1, false_alarm: 0 });
    expect(oracleSchema.safeParse({ model: 'oracle', recall: 1.5 }).success).toBe(false);
    expect(oracleSchema.safeParse({ model: 'oracle', false_alarm: -0.1 }).success).toBe(false);
    expect(oracleSchema.safeParse({ model: 'oracle', extra: 1 }).success).toBe(false);
  });
});
