import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { categoryChart, lineChart, type LineChartSpec, type Series } from '../../src/report/svg/charts.js';
import { checkXml, countClass } from './xml-check.js';

const SEED = 20_260_102;
// Checks of structure cite XML 1.0 (5th ed.) via checkXml; accessibility markup follows the
// W3C SVG Accessibility API Mappings (role="img" with <title>/<desc>) — common practice.

function spec(series: Series[], extra: Partial<LineChartSpec> = {}): LineChartSpec {
  return { title: 'Access success', description: 'Share of devices served', xLabel: 'devices', yLabel: 'delay (ms)', series, ...extra };
}

const twoSeries: Series[] = [
  { name: 'contention', points: [1000, 3000, 10000].map((x, i) => ({ x, y: 0.9 - i * 0.2, low: 0.85 - i * 0.2, high: 0.95 - i * 0.2 })) },
  { name: 'grant', points: [1000, 3000, 10000].map((x, i) => ({ x, y: 0.95 - i * 0.1 })) },
];

/** Vertices of the d attribute of the first path with class `cls` (M/L commands only). */
function vertices(svg: string, cls: string): Array<[number, number]> {
  const d = new RegExp(`<path class="${cls}" d="([^"]*)"`).exec(svg)?.[1] ?? '';
  return d.replace(/^M/, '').split('L').map((p) => p.split(',').map(Number) as [number, number]);
}

describe('lineChart', () => {
  it('is well-formed XML with role="img", <title>, <desc>, viewBox, size and a system-ui/sans-serif font', () => {
    const svg = lineChart(spec(twoSeries));
    expect(checkXml(svg)).toEqual([]);
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg" width="640" height="400" viewBox="0 0 640 400" role="img"/);
    expect(svg).toMatch(/<title id="(chart-[0-9a-f]{8})-title">Access success<\/title><desc id="\1-desc">Share of devices served<\/desc>/);
    expect(svg).toMatch(/font-family="system-ui[^"]*sans-serif"/);
    expect(svg).toContain('>devices</text>');
    expect(svg).toContain('>delay (ms)</text>');
  });

  it('escapes every text it writes (XML 1.0 §2.4)', () => {
    const svg = lineChart({ ...spec([{ name: 'a<b & "c"', points: [{ x: 1, y: 1 }] }, { name: "d'e", points: [{ x: 2, y: 2 }] }]), title: 'x < y & z' });
    expect(checkXml(svg)).toEqual([]);
    expect(svg).toContain('x &lt; y &amp; z');
    expect(svg).toContain('a&lt;b &amp; &quot;c&quot;');
    expect(svg).toContain('d&#39;e');
  });

  it('is deterministic: the same spec (or a copy) gives the same bytes', () => {
    const s = spec(twoSeries, { xScale: 'log' });
    expect(lineChart(s)).toBe(lineChart(structuredClone(s)));
  });

  it('draws one series path per series, a band only where low/high are given, a legend only for > 1 series', () => {
    const svg = lineChart(spec(twoSeries));
    expect(countClass(svg, 'path', 'series-line')).toBe(2);
    expect(countClass(svg, 'path', 'band')).toBe(1);
    expect(countClass(svg, 'g', 'legend')).toBe(1);
    const one = lineChart(spec([twoSeries[1]!]));
    expect(countClass(one, 'path', 'series-line')).toBe(1);
    expect(countClass(one, 'path', 'band')).toBe(0);
    expect(countClass(one, 'g', 'legend')).toBe(0);
  });

  it('maps points linearly: the middle of three equally spaced points is the midpoint of the others (exact)', () => {
    const svg = lineChart(spec([{ name: 's', points: [{ x: 0, y: 0 }, { x: 5, y: 5 }, { x: 10, y: 10 }] }]));
    const [a, b, c] = vertices(svg, 'series-line');
    expect(b![0]).toBeCloseTo((a![0] + c![0]) / 2, 1);
    expect(b![1]).toBeCloseTo((a![1] + c![1]) / 2, 1);
    expect(a![1]).toBeGreaterThan(c![1]); // y grows upwards on the page
  });

  it('log axes: equal ratios give equal distances; non-positive values are skipped (exact: log10)', () => {
    const points = [-1, 0, 1, 10, 100].map((x) => ({ x, y: x }));
    const svg = lineChart(spec([{ name: 's', points }], { xScale: 'log', yScale: 'log' }));
    expect(checkXml(svg)).toEqual([]);
    const v = vertices(svg, 'series-line');
    expect(v).toHaveLength(3);
    expect(v[1]![0] - v[0]![0]).toBeCloseTo(v[2]![0] - v[1]![0], 1);
    expect(v[0]![1] - v[1]![1]).toBeCloseTo(v[1]![1] - v[2]![1], 1);
  });

  it('step mode draws a staircase: n points → 2n − 1 vertices, each level held until the next x (empirical CDF)', () => {
    const svg = lineChart(spec([{ name: 'cdf', points: [{ x: 1, y: 0.25 }, { x: 2, y: 0.5 }, { x: 4, y: 1 }] }], { step: true }));
    const v = vertices(svg, 'series-line');
    expect(v).toHaveLength(5);
    expect(v[1]![1]).toBe(v[0]![1]); // horizontal first
    expect(v[2]![0]).toBe(v[1]![0]); // then vertical
  });

  it('falls back to the default size for a non-finite width or height', () => {
    const svg = lineChart(spec(twoSeries, { width: Number.NaN, height: Number.POSITIVE_INFINITY }));
    expect(svg).toContain('width="640" height="400" viewBox="0 0 640 400"');
    expect(lineChart(spec(twoSeries, { width: 800.4, height: 300 }))).toContain('width="800" height="300" viewBox="0 0 800 300"');
  });

  it('skips NaN and ±Infinity, and writes "no data" when nothing is left', () => {
    const bad = [{ x: Number.NaN, y: 1 }, { x: 1, y: Number.POSITIVE_INFINITY }, { x: 2, y: 3, low: Number.NaN, high: 4 }];
    const svg = lineChart(spec([{ name: 's', points: bad }]));
    expect(svg).not.toMatch(/NaN|Infinity/);
    expect(countClass(svg, 'path', 'band')).toBe(0);
    expect(vertices(svg, 'series-line')).toHaveLength(1);
    for (const empty of [[], [{ name: 'e', points: [] }], [{ name: 'n', points: [{ x: Number.NaN, y: Number.NaN }] }]]) {
      const out = lineChart(spec(empty));
      expect(checkXml(out)).toEqual([]);
      expect(out).toContain('>no data</text>');
      expect(out).toContain('>devices</text>');
    }
  });

  it('property: well-formed, no NaN/Infinity in attributes, deterministic, one path per non-empty series', () => {
    const value = fc.oneof(
      fc.double({ noNaN: false }),
      fc.double({ min: -1e6, max: 1e6, noNaN: true }),
      fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 0, -1, 1e-320),
    );
    const point = fc.record({ x: value, y: value, low: value, high: value }, { requiredKeys: ['x', 'y'] });
    const series = fc.array(fc.record({ name: fc.string({ maxLength: 12, unit: 'binary' }), points: fc.array(point, { maxLength: 30 }) }), { maxLength: 5 });
    const scale = fc.constantFrom<'linear' | 'log'>('linear', 'log');
    fc.assert(
      fc.property(series, scale, scale, fc.boolean(), (s, xScale, yScale, step) => {
        const chart = spec(s, { xScale, yScale, step });
        const svg = lineChart(chart);
        expect(checkXml(svg)).toEqual([]);
        expect(svg).toBe(lineChart(chart));
        const ok = (v: number | undefined, kind: string): boolean =>
          v !== undefined && Number.isFinite(v) && Math.abs(v) <= 1e100 && (kind === 'linear' || v >= 1e-100);
        const nonEmpty = s.filter((x) => x.points.some((p) => ok(p.x, xScale) && ok(p.y, yScale))).length;
        expect(countClass(svg, 'path', 'series-line')).toBe(nonEmpty);
        expect(svg.includes('>no data</text>')).toBe(nonEmpty === 0);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });
});

describe('categoryChart', () => {
  const categories = ['contention', 'random grant', 'oracle + fallback'];
  const base = {
    title: 'Delay p95', description: 'p95 access delay per scheme', yLabel: 'delay (ms)', categories,
    series: [
      { name: 'flood sensors', values: [{ y: 190, low: 180, high: 200 }, { y: 1800, low: 1700, high: 1900 }, null] },
      { name: 'trackers', values: [{ y: 55 }, { y: Number.NaN }, { y: 60, low: 58, high: 62 }] },
    ],
  };

  it('draws one error bar per value with low/high and one marker per finite value, skipping null and NaN', () => {
    const svg = categoryChart(base);
    expect(checkXml(svg)).toEqual([]);
    expect(countClass(svg, 'path', 'error-bar')).toBe(3);
    expect(countClass(svg, 'g', 'series')).toBe(2);
    const markers = (svg.match(/<(circle|polygon) [^>]*fill="#(0072B2|D55E00)"/g) ?? []).length;
    expect(markers).toBe(4 + 2); // 4 data points + 2 legend markers
    expect(svg).not.toMatch(/NaN|Infinity/);
    for (const c of categories) expect(svg).toContain(`>${c}</text>`);
    expect(svg).toContain('>delay (ms)</text>');
  });

  it('rotates category labels only when they do not fit their band', () => {
    expect(categoryChart({ ...base, width: 900 })).not.toContain('rotate(-40');
    const long = categoryChart({ ...base, categories: categories.map((c) => `${c} with a long qualifying suffix`) });
    expect(long).toContain('rotate(-40');
    expect(checkXml(long)).toEqual([]);
  });

  it('is deterministic, and empty data gives "no data"', () => {
    expect(categoryChart(base)).toBe(categoryChart(structuredClone(base)));
    const empty = categoryChart({ ...base, series: [{ name: 'x', values: [null, null, null] }] });
    expect(empty).toContain('>no data</text>');
    expect(checkXml(empty)).toEqual([]);
  });
});

describe('xml-check (the checker itself must reject what XML 1.0 forbids)', () => {
  it.each([
    ['<a><b></a>', 'mismatched tags'],
    ['<a x=1/>', 'unquoted attribute'],
    ['<a>&</a>', 'bare ampersand'],
    ['<a x="NaN"/>', 'NaN in an attribute'],
    ['<a/><b/>', 'two roots'],
    ['<a x="1" x="2"/>', 'duplicate attribute'],
    ['<a>', 'unclosed element'],
    ['<a>\u0001</a>', 'control character'],
  ])('%s is rejected (%s)', (doc) => {
    expect(checkXml(doc).length).toBeGreaterThan(0);
  });

  it('accepts a well-formed document', () => {
    expect(checkXml('<a x="1 &amp; 2"><b/>t &lt; u<!-- c --></a>')).toEqual([]);
  });
});
