/**
 * Device layouts. Sources (exact):
 * - uniform in a disc of radius R: r² = R²·U with U ~ Uniform(0, 1), so E[r²] = R²/2 and
 *   Var[r²] = R⁴/12; the angle is Uniform(0, 2π), so each of k equal sectors holds Binomial(N, 1/k);
 * - Thomas process offsets: (dx, dy) independent Normal(0, s²), so dx² + dy² = s²·χ²₂ with mean 2s² and
 *   variance 4s⁴; each device picks one of K centres uniformly: cluster sizes Binomial(N, 1/K).
 */
import { describe, expect, it } from 'vitest';
import { clusterCount, clusteredLayout, createLayout, layoutSchema, uniformDisc } from '../../src/geometry/layout.js';
import { replicationSeed, StreamSet } from '../../src/random/index.js';

const streams = new StreamSet(replicationSeed('jostle-layout-tests', null, 0));

describe('uniform-disc layout', () => {
  it('has mean squared radius R²/2 (exact) and a uniform angle over 12 sectors (binomial 4-sd bands)', () => {
    const n = 40_000;
    const R = 1500;
    const pos = createLayout(layoutSchema.parse({ model: 'uniform-disc' }), n, streams.stream('disc'), R);
    let sum = 0;
    const sectors = new Float64Array(12);
    for (let i = 0; i < n; i++) {
      const x = pos.x[i] as number, y = pos.y[i] as number;
      const r2 = x * x + y * y;
      expect(r2).toBeLessThanOrEqual(R * R * (1 + 1e-12));
      sum += r2;
      const theta = Math.atan2(y, x) + Math.PI;
      const k = Math.min(11, Math.floor((theta / (2 * Math.PI)) * 12));
      sectors[k] = (sectors[k] as number) + 1;
    }
    const se = Math.sqrt((R ** 4 / 12) / n);
    expect(Math.abs(sum / n - R * R / 2)).toBeLessThan(4 * se);
    for (const c of sectors) expect(Math.abs(c - n / 12)).toBeLessThan(4 * Math.sqrt(n * (1 / 12) * (11 / 12)));
  });
});

describe('clustered layout', () => {
  it('offsets from the cluster centre have mean squared length 2·spread² (exact, χ²₂)', () => {
    const n = 20_000;
    const s = 50;
    const layout = clusteredLayout(n, streams.stream('thomas'), 1000, 20, s);
    let sum = 0;
    for (let i = 0; i < n; i++) {
      const c = layout.clusterOf[i] as number;
      sum += ((layout.positions.x[i] as number) - (layout.centres.x[c] as number)) ** 2 + ((layout.positions.y[i] as number) - (layout.centres.y[c] as number)) ** 2;
    }
    expect(Math.abs(sum / n - 2 * s * s)).toBeLessThan(4 * (2 * s * s) / Math.sqrt(n));
  });

  it('has max(1, round(density·πR²)) centres inside the disc, uniform cluster choice, and devices ordered by cluster', () => {
    expect(clusterCount(20, 1000)).toBe(63); // 20/km² × π km² = 62.8 (exact arithmetic)
    expect(clusterCount(0.001, 100)).toBe(1);
    const n = 20_000;
    const layout = clusteredLayout(n, streams.stream('thomas-2'), 1000, 20, 50);
    const k = layout.centres.x.length;
    expect(k).toBe(63);
    for (let c = 0; c < k; c++) expect(Math.hypot(layout.centres.x[c] as number, layout.centres.y[c] as number)).toBeLessThanOrEqual(1000);
    const sizes = new Float64Array(k);
    for (let i = 0; i < n; i++) {
      const c = layout.clusterOf[i] as number;
      if (i > 0) expect(c).toBeGreaterThanOrEqual(layout.clusterOf[i - 1] as number);
      sizes[c] = (sizes[c] as number) + 1;
    }
    for (const size of sizes) expect(Math.abs(size - n / k)).toBeLessThan(4 * Math.sqrt((n * (k - 1)) / (k * k)));
  });

  it('schema defaults: 20 clusters per km², spread 50 m; lengths need units (common practice)', () => {
    expect(layoutSchema.parse({ model: 'clustered' })).toEqual({ model: 'clustered', clusters_per_km2: 20, spread: 50 });
    expect(layoutSchema.parse({ model: 'clustered', spread: '0.1km' })).toMatchObject({ spread: 100 });
    expect(layoutSchema.safeParse({ model: 'clustered', spread: 50 }).success).toBe(false);
    expect(layoutSchema.safeParse({ model: 'clustered', clusters_per_km2: 0 }).success).toBe(false);
    expect(layoutSchema.safeParse({ model: 'csv' }).success).toBe(false);
  });
});

describe('createLayout', () => {
  it('returns the given positions for csv, and refuses missing or mis-sized ones', () => {
    const params = layoutSchema.parse({ model: 'csv', file: 'a.csv' });
    const pos = { x: Float64Array.of(1, 2), y: Float64Array.of(3, 4) };
    expect(createLayout(params, 2, streams.stream('csv'), 100, pos)).toBe(pos);
    expect(() => createLayout(params, 3, streams.stream('csv'), 100, pos)).toThrow();
    expect(() => createLayout(params, 2, streams.stream('csv'), 100)).toThrow();
  });

  it('is deterministic for a given stream seed (common practice: seeded streams)', () => {
    const a = uniformDisc(10, new StreamSet('s').stream('p'), 100);
    const b = uniformDisc(10, new StreamSet('s').stream('p'), 100);
    expect(Array.from(a.x)).toEqual(Array.from(b.x));
  });
});
