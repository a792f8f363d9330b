/**
 * `alarm-field`, driven directly. Sources:
 * - reporters of one event are independent Bernoulli(p_i), p_i = exp(−d_i²/(2σ²)): mean Σp_i, variance
 *   Σp_i(1−p_i) (exact; the model visits only d ≤ 4σ, which the sums below respect);
 * - for devices of uniform density ρ around an epicentre at least 4σ inside the disc,
 *   E[reporters] = ρ·∫₀^{4σ} e^(−r²/(2σ²))·2πr dr = ρ·2πσ²·(1 − e^(−8)) (exact integral);
 * - report delays are exponential with mean `report_delay`: standard deviation = mean (exact);
 * - alarm events form a Poisson process: the count in H is Poisson(H / event_interval) (exact).
 */
import { describe, expect, it } from 'vitest';
import { PointGrid } from '../../src/geometry/grid.js';
import { uniformDisc } from '../../src/geometry/layout.js';
import type { Positions } from '../../src/geometry/positions.js';
import { replicationSeed, StreamSet } from '../../src/random/index.js';
import { alarmField, alarmFieldSchema, createAlarmField, CUTOFF_SIGMAS, ReporterSampler } from '../../src/traffic/alarm-field.js';
import { fakeEnv, mean } from './fake-env.js';

const streams = new StreamSet(replicationSeed('jostle-alarm-field-tests', null, 0));

/** Reporting probabilities of every device within 4σ of (x, y) (exact kernel). */
function probabilities(pos: Positions, x: number, y: number, sigma: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < pos.x.length; i++) {
    const d2 = ((pos.x[i] as number) - x) ** 2 + ((pos.y[i] as number) - y) ** 2;
    if (d2 <= (CUTOFF_SIGMAS * sigma) ** 2) out.push(Math.exp(-d2 / (2 * sigma * sigma)));
  }
  return out;
}

/** A square lattice of side `k` with spacing `step` (m), centred at (0, 0). */
function lattice(k: number, step: number): Positions {
  const x = new Float64Array(k * k);
  const y = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      x[i * k + j] = (i - (k - 1) / 2) * step;
      y[i * k + j] = (j - (k - 1) / 2) * step;
    }
  }
  return { x, y };
}

describe('alarm-field traffic', () => {
  it('expected reports of an event = Σ exp(−d²/(2σ²)) over the devices (exact, fixed layout and epicentre)', () => {
    const sigma = 100;
    const pos = lattice(40, 20); // 1600 devices over 780 m × 780 m
    const [ex, ey] = [13, -7];
    const hits = new Float64Array(pos.x.length);
    const sampler = new ReporterSampler(new PointGrid(pos, sigma), sigma, streams.stream('fixed'), (i) => {
      hits[i] = (hits[i] as number) + 1;
    });
    const rounds = 3000;
    const counts = new Float64Array(rounds);
    for (let r = 0; r < rounds; r++) counts[r] = sampler.draw(ex, ey);
    const p = probabilities(pos, ex, ey, sigma);
    const expected = p.reduce((s, v) => s + v, 0);
    const varOne = p.reduce((s, v) => s + v * (1 - v), 0);
    expect(Math.abs(mean(counts) - expected)).toBeLessThan(4 * Math.sqrt(varOne / rounds));
    // Per device: the device nearest the epicentre and one about 2σ away, binomial 4-sd bands.
    for (let i = 0; i < pos.x.length; i++) {
      const d2 = ((pos.x[i] as number) - ex) ** 2 + ((pos.y[i] as number) - ey) ** 2;
      const pi = Math.exp(-d2 / (2 * sigma * sigma));
      if (d2 > (CUTOFF_SIGMAS * sigma) ** 2) expect(hits[i]).toBe(0); // truncation at 4σ (documented)
      else expect(Math.abs((hits[i] as number) - rounds * pi)).toBeLessThanOrEqual(4 * Math.sqrt(rounds * pi * (1 - pi)) + 1);
    }
  });

  it('uniform density ρ far from the edge: expected reporters ρ·2πσ²·(1 − e^−8) (exact integral), within 2 %', () => {
    const sigma = 100;
    const radius = 2000;
    const n = 50_000;
    const pos = uniformDisc(n, streams.stream('layout'), radius);
    const sampler = new ReporterSampler(new PointGrid(pos, sigma), sigma, streams.stream('uniform'), () => undefined);
    const places = uniformDisc(400, streams.stream('epicentres'), radius - CUTOFF_SIGMAS * sigma);
    const counts = new Float64Array(400);
    for (let e = 0; e < 400; e++) counts[e] = sampler.draw(places.x[e] as number, places.y[e] as number);
    const rho = n / (Math.PI * radius * radius);
    const expected = rho * 2 * Math.PI * sigma * sigma * (1 - Math.exp(-8));
    // Tolerance 2 %: about 4 standard errors (Bernoulli ≈ 0.3 %, layout fluctuation ≈ 0.4 %).
    expect(Math.abs(mean(counts) / expected - 1)).toBeLessThan(0.02);
  });

  it('runs as a traffic source: Poisson events, Σp reports per event, exponential delays with mean report_delay (exact)', () => {
    const params = alarmFieldSchema.parse({ model: 'alarm-field', event_interval: '10h', sigma: '100m', report_delay: '2s' });
    expect(params.sigma).toBe(100);
    expect(params.report_delay).toBe(2000);
    const radius = 1000;
    const pos = uniformDisc(5000, streams.stream('run-layout'), radius);
    const env = fakeEnv({ deviceCount: 5000, firstDevice: 7, positions: pos, cellRadius: radius, seed: 'alarm-run' });
    const events: Array<{ t: number; x: number; y: number }> = [];
    createAlarmField(params, env, (t, x, y) => events.push({ t, x, y })).start();
    const horizon = 1000 * 3_600_000;
    env.sim.run(horizon);
    // Event count: Poisson(100), 4 standard deviations.
    expect(Math.abs(events.length - 100)).toBeLessThan(40);
    // Reports of events ending before the horizon (delays are at most 22.2 × mean by construction).
    const last = horizon - 50_000;
    const kept = events.filter((e) => e.t <= last);
    let expected = 0;
    let varSum = 0;
    for (const e of kept) {
      for (const p of probabilities(pos, e.x, e.y, params.sigma)) {
        expected += p;
        varSum += p * (1 - p);
      }
    }
    const delays: number[] = [];
    let ei = 0;
    env.times.forEach((t) => {
      while (ei + 1 < events.length && (events[ei + 1]?.t ?? Infinity) <= t) ei++;
      const e = events[ei];
      if (e !== undefined && e.t <= last) delays.push(t - e.t);
    });
    expect(Math.abs(delays.length - expected)).toBeLessThan(4 * Math.sqrt(varSum));
    expect(Math.abs(mean(delays) - 2000)).toBeLessThan((4 * 2000) / Math.sqrt(delays.length));
    expect(Math.min(...env.devices)).toBeGreaterThanOrEqual(7);
    expect(Math.max(...env.devices)).toBeLessThan(5007);
  });

  it('declares that it needs positions and refuses to run without them', () => {
    const params = alarmFieldSchema.parse({ model: 'alarm-field', event_interval: '1h' });
    expect(params.sigma).toBe(100);
    expect(alarmField.needsPositions?.(params)).toBe(true);
    expect(() => alarmField.create(params, fakeEnv({ deviceCount: 3 }))).toThrow(/positions/);
    expect(alarmFieldSchema.safeParse({ model: 'alarm-field', event_interval: '1h', sigma: 100 }).success).toBe(false);
  });
});
