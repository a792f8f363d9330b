import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { heatMap, type HeatMapSpec } from '../../src/report/svg/charts.js';
import { OKABE_ITO, VIRIDIS_STOPS, luminance, sequentialColour, textColourOn } from '../../src/report/svg/palette.js';
import { checkXml, countClass } from './xml-check.js';

const SEED = 20_260_103;

function spec(cells: number[][], extra: Partial<HeatMapSpec> = {}): HeatMapSpec {
  return {
    title: 'Deadline met', description: 'Share of packets within the deadline', xLabel: 'devices', yLabel: 'preambles',
    xValues: cells[0]?.map((_, i) => `${(i + 1) * 1000}`) ?? [], yValues: cells.map((_, i) => `${16 * (i + 1)}`),
    cells, valueLabel: 'share', ...extra,
  };
}

/** #rrggbb from sRGB floats in [0, 1], rounded to 8 bits. */
function hex(rgb: [number, number, number]): string {
  return `#${rgb.map((c) => Math.round(c * 255).toString(16).padStart(2, '0')).join('')}`;
}

/** WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05). */
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi! + 0.05) / (lo! + 0.05);
}

describe('heatMap', () => {
  it('draws one rect per finite cell, a colour legend, the axis and value labels; well-formed', () => {
    const cells = [[0.9, 0.7, Number.NaN], [0.95, Number.POSITIVE_INFINITY, 0.5]];
    const svg = heatMap(spec(cells));
    expect(checkXml(svg)).toEqual([]);
    expect(countClass(svg, 'rect', 'cell')).toBe(4);
    expect(countClass(svg, 'g', 'colour-legend')).toBe(1);
    expect(countClass(svg, 'rect', 'legend-step')).toBe(64);
    expect(svg).toContain('>missing</text>');
    for (const label of ['devices', 'preambles', 'share', '1000', '3000', '16', '32']) expect(svg).toContain(`>${label}</text>`);
    expect(svg).toContain('<title>1000, 16: 0.9</title>');
    expect(svg).not.toMatch(/NaN|Infinity/);
  });

  it('colours the minimum, middle and maximum with viridis entries 0, 128 and 255 (matplotlib _viridis_data, Smith & van der Walt 2015)', () => {
    const svg = heatMap(spec([[0, 0.5, 1]]));
    // Published sRGB floats of entries 0, 128, 255 of the 256-entry table.
    expect(svg).toMatch(new RegExp(`class="cell"[^>]*fill="${hex([0.267004, 0.004874, 0.329415])}"`));
    expect(svg).toMatch(new RegExp(`class="cell"[^>]*fill="${hex([0.127568, 0.566949, 0.550556])}"`));
    expect(svg).toMatch(new RegExp(`class="cell"[^>]*fill="${hex([0.993248, 0.906157, 0.143936])}"`));
  });

  it('writes cell values only when the cells are few and large enough', () => {
    const cellTexts = (svg: string): number => (/<g class="cells">(.*?)<\/g>/.exec(svg)?.[1]?.match(/<text /g) ?? []).length;
    const small = heatMap(spec([[1, 2], [3, 4.25]]));
    expect(cellTexts(small)).toBe(4);
    expect(small).toMatch(/>4.25<\/text>/);
    const many = Array.from({ length: 20 }, (_, r) => Array.from({ length: 20 }, (_, c) => r * 20 + c + 0.5));
    const big = heatMap(spec(many));
    expect(countClass(big, 'rect', 'cell')).toBe(400);
    expect(cellTexts(big)).toBe(0);
  });

  it('all cells missing → "no data" and no legend; a single value still draws', () => {
    const none = heatMap(spec([[Number.NaN, Number.NaN]]));
    expect(none).toContain('>no data</text>');
    expect(countClass(none, 'g', 'colour-legend')).toBe(0);
    const one = heatMap(spec([[7]]));
    expect(countClass(one, 'rect', 'cell')).toBe(1);
    expect(checkXml(one)).toEqual([]);
  });

  it('property: one cell per finite value, well-formed, deterministic', () => {
    const value = fc.oneof(fc.double(), fc.constantFrom(Number.NaN, 0, 1));
    const grid = fc.integer({ min: 1, max: 6 }).chain((w) => fc.array(fc.array(value, { minLength: w, maxLength: w }), { minLength: 1, maxLength: 6 }));
    fc.assert(
      fc.property(grid, (cells) => {
        const s = spec(cells);
        const svg = heatMap(s);
        expect(checkXml(svg)).toEqual([]);
        expect(svg).toBe(heatMap(s));
        const finite = cells.flat().filter((v) => Number.isFinite(v) && Math.abs(v) <= 1e100).length;
        expect(countClass(svg, 'rect', 'cell')).toBe(finite);
      }),
      { seed: SEED, numRuns: 150 },
    );
  });
});

describe('palette', () => {
  it('Okabe–Ito colours equal the published RGB values (Okabe & Ito 2008, Color Universal Design)', () => {
    expect(OKABE_ITO).toEqual({
      black: hex([0, 0, 0]),
      orange: '#E69F00', // 230, 159, 0
      skyBlue: '#56B4E9', // 86, 180, 233
      bluishGreen: '#009E73', // 0, 158, 115
      yellow: '#F0E442', // 240, 228, 66
      blue: '#0072B2', // 0, 114, 178
      vermillion: '#D55E00', // 213, 94, 0
      reddishPurple: '#CC79A7', // 204, 121, 167
    });
    const rgb = (h: string): number[] => [1, 3, 5].map((i) => Number.parseInt(h.slice(i, i + 2), 16));
    expect(rgb(OKABE_ITO.orange)).toEqual([230, 159, 0]);
    expect(rgb(OKABE_ITO.vermillion)).toEqual([213, 94, 0]);
    expect(rgb(OKABE_ITO.reddishPurple)).toEqual([204, 121, 167]);
  });

  it('the sequential scale gets lighter monotonically (viridis is monotonic in lightness, Smith & van der Walt 2015)', () => {
    expect(VIRIDIS_STOPS[0]).toBe(sequentialColour(0));
    expect(VIRIDIS_STOPS[16]).toBe(sequentialColour(1));
    let previous = -1;
    for (let i = 0; i <= 100; i++) {
      const l = luminance(sequentialColour(i / 100));
      expect(l).toBeGreaterThan(previous);
      previous = l;
    }
  });

  it('cell text reaches 4.5:1 contrast on every colour of the scale (WCAG 2.1 SC 1.4.3)', () => {
    for (let i = 0; i <= 1000; i++) {
      const background = sequentialColour(i / 1000);
      expect(contrast(background, textColourOn(background))).toBeGreaterThanOrEqual(4.5);
    }
  });
});
