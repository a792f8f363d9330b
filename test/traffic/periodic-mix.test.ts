/**
 * `periodic` with a `mix` of periods. Sources: the mix of 3GPP TR 45.820 Annex E as recalled in
 * reference-values.md §5 ("periods 1 day / 2 h / 1 h / 30 min with shares 40 / 40 / 15 / 5 %" ⇒
 * "0.4667 reports/device/h"; from memory); the number of devices drawing each period is
 * Binomial(N, share) (exact); with a uniform phase and jitter 0 a device with period T reports exactly
 * H/T times in [0, H) when H is a multiple of T (exact).
 */
import { describe, expect, it } from 'vitest';
import { meanReportRate, periodic, periodicSchema } from '../../src/traffic/periodic.js';
import { fakeEnv } from './fake-env.js';

const HOUR = 3_600_000;
const TR45820_MIX = [
  { period: '1d', share: 0.4 },
  { period: '2h', share: 0.4 },
  { period: '1h', share: 0.15 },
  { period: '30min', share: 0.05 },
];

function issuePaths(input: unknown): string[] {
  const r = periodicSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
}

describe('periodic traffic with a mix of periods', () => {
  it('the TR 45.820 mix gives 0.4667 reports per device per hour (reference-values §5, from memory)', () => {
    const p = periodicSchema.parse({ model: 'periodic', mix: TR45820_MIX });
    expect(meanReportRate(p) * HOUR).toBeCloseTo(0.4667, 4);
  });

  it('each device keeps one period; shares of periods within binomial 4-sd bands (exact)', () => {
    const n = 2000;
    const p = periodicSchema.parse({ model: 'periodic', mix: TR45820_MIX });
    const env = fakeEnv({ deviceCount: n, firstDevice: 50, seed: 'periodic-mix' });
    periodic.create(p, env).start();
    const horizon = 48 * HOUR;
    env.sim.run(horizon - 1e-6);
    const byDevice = new Map<number, number[]>();
    env.devices.forEach((d, k) => {
      const list = byDevice.get(d) ?? [];
      list.push(env.times[k] as number);
      byDevice.set(d, list);
    });
    expect(byDevice.size).toBe(n);
    const periodCount = new Map<number, number>();
    for (const times of byDevice.values()) {
      const gap = (times[1] as number) - (times[0] as number);
      for (let k = 1; k < times.length; k++) expect((times[k] as number) - (times[k - 1] as number)).toBeCloseTo(gap, 3);
      expect(times.length).toBe(Math.round(horizon / gap)); // H/T reports (exact)
      const period = Math.round(gap);
      periodCount.set(period, (periodCount.get(period) ?? 0) + 1);
    }
    const expected = new Map(p.mix?.map((e) => [e.period, e.share]) ?? []);
    expect([...periodCount.keys()].sort()).toEqual([...expected.keys()].sort());
    for (const [period, share] of expected) {
      const k = periodCount.get(period) ?? 0;
      expect(Math.abs(k - n * share)).toBeLessThan(4 * Math.sqrt(n * share * (1 - share)));
    }
  });

  it('requires exactly one of period and mix, shares summing to 1, and jitter below every period', () => {
    expect(issuePaths({ model: 'periodic' })).toEqual(['period']);
    expect(issuePaths({ model: 'periodic', period: '1h', mix: TR45820_MIX })).toEqual(['mix']);
    expect(issuePaths({ model: 'periodic', mix: [{ period: '1h', share: 0.5 }, { period: '2h', share: 0.49 }] })).toEqual(['mix']);
    expect(issuePaths({ model: 'periodic', mix: [{ period: '1h', share: 0.5 }, { period: '2h', share: 0.5 + 1e-12 }] })).toEqual([]);
    expect(issuePaths({ model: 'periodic', mix: TR45820_MIX, jitter: '30min' })).toEqual(['jitter']);
    expect(issuePaths({ model: 'periodic', period: '10s', jitter: '10s' })).toEqual(['jitter']);
    expect(periodicSchema.parse({ model: 'periodic', period: '10s' }).period).toBe(10_000);
  });
});
