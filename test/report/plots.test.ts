/**
 * Which figures a sweep gets (common practice for parameter studies: a metric against a numeric
 * parameter with its confidence band, categories as points with error bars, a heat map over two
 * numeric parameters, one delay CDF per point).
 */
import { describe, expect, it } from 'vitest';
import { figuresOf, type SummaryDoc } from '../../src/report/plots.js';

const stat = (mean: number) => ({ mean, half_width: mean / 10, n: 5 });
const quantiles = { levels: [0.5, 0.9], mean: [10, 30] };

function doc(axes: Array<{ path: string; labels?: string[] }>, combine: 'grid' | 'zip', params: Array<Record<string, unknown>>): SummaryDoc {
  return {
    experiment: 'x',
    confidence_level: 0.95,
    config: { sweep: { combine, axes } },
    points: params.map((parameters, index) => ({
      index,
      label: `p${index}`,
      parameters,
      metrics: { delay_mean_ms: stat(20 + index), access_success_probability: stat(0.99) },
      delay_quantiles_ms: quantiles,
      groups: { a: { metrics: { delay_mean_ms: stat(21) } }, b: { metrics: { delay_mean_ms: stat(22) } } },
    })),
  };
}

describe('figures of a sweep', () => {
  it('one numeric axis: a line chart per metric (cell and groups) and a CDF per point', () => {
    const figures = figuresOf(doc([{ path: 'groups.a.count' }], 'grid', [{ 'groups.a.count': 1000 }, { 'groups.a.count': 5000 }, { 'groups.a.count': 30000 }]));
    const names = figures.map((f) => f.file);
    expect(names).toContain('delay_mean_ms.svg');
    expect(names).toContain('access_success_probability.svg');
    expect(names.filter((n) => n.startsWith('delay-cdf-point-'))).toHaveLength(3);
    const delay = figures.find((f) => f.file === 'delay_mean_ms.svg')?.svg ?? '';
    expect(delay).toContain('groups.a.count');
    expect(delay).toContain('delay_mean_ms (ms)');
    // Cell and both groups are drawn: a legend with three entries.
    for (const name of ['cell', '>a<', '>b<']) expect(delay).toContain(name);
  });

  it('durations on an axis are numeric, in ms', () => {
    const figures = figuresOf(doc([{ path: 'cell.random_access.backoff_indicator' }], 'grid', [{ 'cell.random_access.backoff_indicator': '10ms' }, { 'cell.random_access.backoff_indicator': '1s' }]));
    expect(figures.find((f) => f.file === 'delay_mean_ms.svg')?.svg).toContain('random_access.backoff_indicator (ms)');
  });

  it('two numeric axes: lines by the second axis and a heat map', () => {
    const params = [1, 2].flatMap((a) => [10, 20].map((b) => ({ 'x.a': a, 'x.b': b })));
    const names = figuresOf(doc([{ path: 'x.a' }, { path: 'x.b' }], 'grid', params)).map((f) => f.file);
    expect(names).toContain('heatmap-delay_mean_ms.svg');
    expect(names).toContain('delay_mean_ms.svg');
  });

  it('a categorical axis gives points with error bars per category', () => {
    const figures = figuresOf(doc([{ path: 'groups.a.access', labels: ['contention', 'grants'] }], 'grid', [{ 'groups.a.access': { policy: 'contention' } }, { 'groups.a.access': { policy: 'random-grant' } }]));
    const svg = figures.find((f) => f.file === 'delay_mean_ms.svg')?.svg ?? '';
    // Categories are named by the point labels (the axis labels, in a real run).
    expect(svg).toContain('>p0<');
    expect(svg).toContain('>p1<');
    expect(svg).toContain('role="img"');
  });

  it('categories are points, not labels: two points that read alike are drawn at their own values', () => {
    // Two zipped axes (no single axis to name categories by); both points labelled alike, cell means 20 and 30.
    const d: SummaryDoc = {
      ...doc([{ path: 'a' }, { path: 'b' }], 'zip', [
        { a: { p: 1 }, b: { q: 1 } },
        { a: { p: 2 }, b: { q: 2 } },
      ]),
    };
    const points = d.points.map((p, i) => ({ ...p, label: 'same', metrics: { delay_mean_ms: stat(20 + 10 * i) }, groups: {} }));
    const svg = figuresOf({ ...d, points }).find((f) => f.file === 'delay_mean_ms.svg')?.svg ?? '';
    const ys = [...svg.matchAll(/<circle [^>]*cy="([0-9.]+)"/g)].map((m) => Number(m[1]));
    expect(ys).toHaveLength(2);
    // Larger values sit higher (smaller y): the second point is drawn above the first.
    expect(ys[1]).toBeLessThan(ys[0] as number);
  });

  it('no sweep, no figures', () => {
    expect(figuresOf({ ...doc([], 'grid', [{}]), config: {} })).toEqual([]);
  });
});
