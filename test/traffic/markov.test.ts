/**
 * `markov` (two-state Markov-modulated Poisson process), driven directly on a fake environment.
 *
 * Sources (all exact for a stationary two-state MMPP; notation: leave rates α = 1/mean_quiet,
 * β = 1/mean_alarm, κ = α + β, per-device packet rates λq, λa, Δλ = λa − λq):
 * - stationary distribution of the two-state chain: πa = α/κ = mean_alarm/(mean_alarm + mean_quiet);
 * - mean count in [0, t): λ̄·t with λ̄ = πq·λq + πa·λa (stationary start);
 * - variance of the count of m devices sharing one state: Var N = E[Λ] + Var[Λ] (doubly stochastic
 *   Poisson process), with the chain's autocovariance Cov(λ(s), λ(s+u)) = m²Δλ²·πaπq·e^(−κu), so
 *   Var[Λ(t)] = 2·m²Δλ²·πaπq·(t/κ − (1 − e^(−κt))/κ²).
 */
import { describe, expect, it } from 'vitest';
import { alarmProbability, createMarkovSource, markovSchema, type MarkovParams } from '../../src/traffic/markov.js';
import { fakeEnv, mean, variance } from './fake-env.js';

const MIN = 60_000;
const base = {
  model: 'markov',
  quiet_interval: '1h',
  alarm_interval: '10s',
  mean_quiet: '10min',
  mean_alarm: '1min',
} as const;

function params(extra: Record<string, unknown> = {}): MarkovParams {
  return markovSchema.parse({ ...base, ...extra });
}

/** Mean packet rate per device per ms (exact, stationary MMPP). */
function meanRate(p: MarkovParams): number {
  const pa = alarmProbability(p);
  const lq = p.quiet_interval === undefined ? 0 : 1 / p.quiet_interval;
  return (1 - pa) * lq + pa / p.alarm_interval;
}

/** Variance of the count of m devices sharing one state over a window t (exact, see header). */
function countVariance(p: MarkovParams, m: number, t: number): number {
  const alpha = 1 / p.mean_quiet;
  const beta = 1 / p.mean_alarm;
  const k = alpha + beta;
  const pa = alpha / k;
  const dl = 1 / p.alarm_interval - (p.quiet_interval === undefined ? 0 : 1 / p.quiet_interval);
  return m * meanRate(p) * t + 2 * m * m * dl * dl * pa * (1 - pa) * (t / k - (1 - Math.exp(-k * t)) / (k * k));
}

/** Per-device packet counts of a run of `n` devices until `until` ms. */
function deviceCounts(p: MarkovParams, n: number, until: number, seed: string): Float64Array {
  const env = fakeEnv({ deviceCount: n, seed });
  createMarkovSource(p, env).start();
  env.sim.run(until);
  const counts = new Float64Array(n);
  for (const d of env.devices) counts[d] = (counts[d] as number) + 1;
  return counts;
}

/** Sums of consecutive blocks of `m` entries. */
function blockSums(x: Float64Array, m: number): Float64Array {
  const out = new Float64Array(Math.floor(x.length / m));
  for (let i = 0; i < out.length * m; i++) out[Math.floor(i / m)] = (out[Math.floor(i / m)] as number) + (x[i] as number);
  return out;
}

describe('markov traffic', () => {
  it('long-run packet rate is πq·λq + πa·λa per device (exact, stationary MMPP), and the alarm share is πa (exact)', () => {
    const p = params();
    const n = 2000;
    const horizon = 120 * MIN;
    const env = fakeEnv({ deviceCount: n, seed: 'markov-rate' });
    const source = createMarkovSource(p, env);
    // Sample every device's state once a minute: by stationarity each sample is alarm with probability πa.
    const inAlarm = new Float64Array(n);
    const probe = env.sim.defineEvent('probe', (_s, now) => {
      for (let d = 0; d < n; d++) if (source.inAlarm(d)) inAlarm[d] = (inAlarm[d] as number) + 1;
      if (now + MIN < horizon) env.sim.at(now + MIN, probe, 0);
    });
    source.start();
    env.sim.at(0, probe, 0);
    env.sim.run(horizon);
    const counts = new Float64Array(n);
    for (const d of env.devices) counts[d] = (counts[d] as number) + 1;
    // Devices are independent under `scope: device`: 4 standard errors of the mean over devices.
    const expected = meanRate(p) * horizon;
    expect(Math.abs(mean(counts) - expected)).toBeLessThan(4 * Math.sqrt(variance(counts) / n));
    const share = inAlarm.map((k) => k / 120);
    expect(Math.abs(mean(share) - 1 / 11)).toBeLessThan(4 * Math.sqrt(variance(share) / n));
    expect(alarmProbability(p)).toBeCloseTo(1 / 11, 15);
  });

  it('without quiet_interval devices are silent while quiet: rate πa·λa (exact)', () => {
    const p = params({ quiet_interval: undefined });
    expect(p.quiet_interval).toBeUndefined();
    const horizon = 120 * MIN;
    const counts = deviceCounts(p, 2000, horizon, 'markov-silent');
    const expected = (1 / 11) * (horizon / 10_000);
    expect(Math.abs(mean(counts) - expected)).toBeLessThan(4 * Math.sqrt(variance(counts) / counts.length));
  });

  it('zone scope correlates the devices of a zone: index of dispersion of zone counts as the exact MMPP variance', () => {
    // 4000 independent zones (or blocks) of 20 devices, one 1-minute window from the stationary start.
    // Tolerance: 15 % on variance / mean (about 4 standard errors of a sample variance over 4000 blocks).
    const m = 20;
    const blocks = 4000;
    const w = MIN;
    const zoneP = params({ scope: 'zone', zone_devices: m });
    const deviceP = params();
    const zone = blockSums(deviceCounts(zoneP, m * blocks, w, 'markov-zone'), m);
    const dev = blockSums(deviceCounts(deviceP, m * blocks, w, 'markov-device'), m);
    const mu = m * meanRate(deviceP) * w;
    const zoneIod = countVariance(zoneP, m, w) / mu;
    const deviceIod = (m * countVariance(deviceP, 1, w)) / mu; // sum of m independent devices
    expect(Math.abs(mean(zone) - mu)).toBeLessThan(4 * Math.sqrt(variance(zone) / blocks));
    expect(Math.abs(mean(dev) - mu)).toBeLessThan(4 * Math.sqrt(variance(dev) / blocks));
    expect(Math.abs(variance(zone) / mean(zone) / zoneIod - 1)).toBeLessThan(0.15);
    expect(Math.abs(variance(dev) / mean(dev) / deviceIod - 1)).toBeLessThan(0.15);
    expect(zoneIod).toBeGreaterThan(3 * deviceIod);
    expect(variance(zone) / mean(zone)).toBeGreaterThan(3 * (variance(dev) / mean(dev)));
  });

  it('a zone holds consecutive devices; the last zone may be smaller (definition)', () => {
    const p = params({ scope: 'zone', zone_devices: 7, mean_alarm: '10min', mean_quiet: '1s' });
    const env = fakeEnv({ deviceCount: 10, firstDevice: 100, seed: 'markov-last-zone' });
    const source = createMarkovSource(p, env);
    expect(source.zoneCount).toBe(2);
    source.start();
    env.sim.run(10 * MIN);
    const seen = new Set(env.devices);
    for (let d = 100; d < 110; d++) expect(seen.has(d)).toBe(true);
    expect(Math.min(...env.devices)).toBe(100);
    expect(Math.max(...env.devices)).toBe(109);
  });

  it('schema: zone_devices only with scope zone; durations need units (common practice)', () => {
    expect(markovSchema.safeParse({ ...base, zone_devices: 10 }).success).toBe(false);
    expect(markovSchema.safeParse({ ...base, scope: 'zone', zone_devices: 10 }).success).toBe(true);
    expect(markovSchema.safeParse({ ...base, alarm_interval: 10 }).success).toBe(false);
    const p = params({ scope: 'zone' });
    expect(p.zone_devices).toBeUndefined();
    expect(p.start).toBe(0);
  });
});
