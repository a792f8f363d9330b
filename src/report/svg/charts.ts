/**
 * Line charts (with confidence bands, optional CDF-style steps, linear or log axes) and category
 * charts (points with error bars, dodged per series). Pure functions: spec in, SVG text out; the
 * same spec always gives the same bytes. Points that cannot be drawn (NaN, ±Infinity, |v| > 1e100,
 * v ≤ 0 on a log axis) are skipped.
 */
import { marker, seriesStyle } from './palette.js';
import { el, px, textWidth } from './xml.js';
import {
  dimension, TICK_FONT, axisTicks, axisTitles, continuousAxis, drawFrame, drawLegend, drawXAxis, drawYAxis,
  drawable, labelWidth, legendHeight, noData, svgDocument, titleBlock, type Area, type LegendEntry,
} from './frame.js';
import { formatTick } from './scale.js';
import { categoryLabels } from './labels.js';

export { heatMap, type HeatMapSpec } from './heatmap.js';

/** One point; low/high bound its confidence band (both needed). */
export interface SeriesPoint { x: number; y: number; low?: number; high?: number }
export interface Series { name: string; points: SeriesPoint[] }
export interface LineChartSpec {
  title: string;
  description: string;
  xLabel: string;
  yLabel: string;
  xScale?: 'linear' | 'log';
  yScale?: 'linear' | 'log';
  series: Series[];
  /** Pixels; default 640 × 400. */
  width?: number;
  height?: number;
  /** Draw each series as a right-continuous staircase (an empirical CDF). */
  step?: boolean;
}

/** Series with more points than this are drawn without markers. */
const MAX_MARKERS = 40;

interface Drawn { x: number; y: number; band: [number, number] | null }

function prepare(points: SeriesPoint[], xs: 'linear' | 'log', ys: 'linear' | 'log'): Drawn[] {
  const out: Drawn[] = [];
  for (const p of points) {
    if (!drawable(p.x, xs) || !drawable(p.y, ys)) continue;
    const band: [number, number] | null =
      drawable(p.low, ys) && drawable(p.high, ys) ? [Math.min(p.low, p.high), Math.max(p.low, p.high)] : null;
    out.push({ x: p.x, y: p.y, band });
  }
  return out.sort((a, b) => a.x - b.x);
}

type Vertex = [number, number];

/** Vertices through the points; with `step`, each value holds until the next x. */
function vertices(points: Drawn[], value: (p: Drawn) => number, step: boolean, X: (v: number) => number, Y: (v: number) => number): Vertex[] {
  const out: Vertex[] = [];
  points.forEach((p, i) => {
    const prev = points[i - 1];
    if (step && prev !== undefined) out.push([X(p.x), Y(value(prev))]);
    out.push([X(p.x), Y(value(p))]);
  });
  return out;
}

function polyline(v: Vertex[]): string {
  return `M${v.map(([x, y]) => `${px(x)},${px(y)}`).join('L')}`;
}

/** Band outline: one closed sub-path per run of consecutive points that carry low/high. */
function bandPath(points: Drawn[], step: boolean, X: (v: number) => number, Y: (v: number) => number): { area: string; bars: string } {
  let area = '';
  let bars = '';
  let run: Drawn[] = [];
  const flush = (): void => {
    if (run.length === 1) {
      const p = run[0]!;
      bars += `M${px(X(p.x))},${px(Y(p.band![0]))}V${px(Y(p.band![1]))}`;
    } else if (run.length > 1) {
      const upper = vertices(run, (p) => p.band![1], step, X, Y);
      const lower = vertices(run, (p) => p.band![0], step, X, Y).reverse();
      area += `${polyline([...upper, ...lower])}Z`;
    }
    run = [];
  };
  for (const p of points) {
    if (p.band === null) flush();
    else run.push(p);
  }
  flush();
  return { area, bars };
}

interface LineLayout { area: Area; xLabelY: number; legendTop: number; title: string }

function lineLayout(spec: LineChartSpec, width: number, height: number, yLabels: string[], xLabels: string[], legend: number): LineLayout {
  const title = titleBlock(spec.title, width);
  const lastX = xLabels[xLabels.length - 1] ?? '';
  const x0 = 44 + labelWidth(yLabels);
  const x1 = width - Math.max(16, textWidth(lastX, TICK_FONT) / 2 + 6);
  const xLabelY = height - 10 - legend;
  const area = { x0, x1, y0: title.height + 8, y1: Math.max(title.height + 28, xLabelY - 38) };
  return { area, xLabelY, legendTop: xLabelY + 8, title: title.svg };
}

/** A line chart: bands under lines under markers, axes with grid, axis titles, legend (> 1 series). */
export function lineChart(spec: LineChartSpec): string {
  const width = dimension(spec.width, 640);
  const height = dimension(spec.height, 400);
  const xs = spec.xScale ?? 'linear';
  const ys = spec.yScale ?? 'linear';
  const step = spec.step ?? false;
  const series = spec.series.map((s) => prepare(s.points, xs, ys));
  const all = series.flat();
  const xTicks = axisTicks(all.map((p) => p.x), xs);
  const yTicks = axisTicks(all.flatMap((p) => (p.band === null ? [p.y] : [p.y, p.band[0], p.band[1]])), ys);
  const entries: LegendEntry[] = spec.series.map((s, i) => ({
    name: s.name, style: seriesStyle(i), line: true, marker: (series[i]?.length ?? 0) <= MAX_MARKERS,
  }));
  const legend = legendHeight(entries, width - 24);
  const L = lineLayout(spec, width, height, yTicks.map(formatTick), xTicks.map(formatTick), legend);
  let body = L.title;
  if (all.length === 0) {
    body += drawFrame(L.area) + noData(L.area);
  } else {
    const X = continuousAxis(xTicks, xs, L.area.x0, L.area.x1);
    const Y = continuousAxis(yTicks, ys, L.area.y1, L.area.y0);
    body += drawYAxis(Y, L.area) + drawXAxis(X, L.area) + drawFrame(L.area);
    body += drawSeries(series, step, X.map, Y.map);
  }
  body += axisTitles(spec.xLabel, spec.yLabel, L.area, L.xLabelY, 20);
  body += drawLegend(entries, 12, L.legendTop, width - 24);
  return svgDocument(width, height, spec.title, spec.description, body);
}

function drawSeries(series: Drawn[][], step: boolean, X: (v: number) => number, Y: (v: number) => number): string {
  let bands = '';
  let lines = '';
  series.forEach((points, i) => {
    if (points.length === 0) return;
    const style = seriesStyle(i);
    const band = bandPath(points, step, X, Y);
    if (band.area !== '') bands += el('path', { class: 'band', d: band.area, fill: style.colour, 'fill-opacity': '0.18', stroke: 'none' });
    if (band.bars !== '') bands += el('path', { class: 'band-bar', d: band.bars, stroke: style.colour, 'stroke-opacity': '0.5', 'stroke-width': '3' });
    const dash = style.dash === '' ? undefined : style.dash;
    let g = el('path', {
      class: 'series-line', d: polyline(vertices(points, (p) => p.y, step, X, Y)), fill: 'none',
      stroke: style.colour, 'stroke-width': '2', 'stroke-dasharray': dash, 'stroke-linejoin': 'round',
    });
    if (points.length <= MAX_MARKERS) g += points.map((p) => marker(style.marker, X(p.x), Y(p.y), 3.5, style.colour)).join('');
    lines += el('g', { class: 'series' }, g);
  });
  return el('g', { class: 'bands' }, bands) + lines;
}

/** A value of a category chart: the point and optionally its interval. */
export interface CategoryValue { y: number; low?: number; high?: number }
export interface CategoryChartSpec {
  title: string;
  description: string;
  categories: string[];
  yLabel: string;
  series: Array<{ name: string; values: Array<CategoryValue | null> }>;
  width?: number;
  height?: number;
}

/** A category chart: per category, one point per series (dodged) with its error bar. */
export function categoryChart(spec: CategoryChartSpec): string {
  const width = dimension(spec.width, 640);
  const height = dimension(spec.height, 400);
  const values = spec.series.map((s) => s.values.slice(0, spec.categories.length));
  const ys = values.flat().flatMap((v) => (v === null ? [] : [v.y, ...(drawable(v.low, 'linear') && drawable(v.high, 'linear') ? [v.low, v.high] : [])]));
  const yTicks = axisTicks(ys.filter((v) => drawable(v, 'linear')), 'linear');
  const entries: LegendEntry[] = spec.series.map((s, i) => ({ name: s.name, style: seriesStyle(i), line: false, marker: true }));
  const legend = legendHeight(entries, width - 24);
  const title = titleBlock(spec.title, width);
  const x0 = 44 + labelWidth(yTicks.map(formatTick));
  const probe: Area = { x0, x1: width - 16, y0: title.height + 8, y1: 0 };
  const labels = categoryLabels(spec.categories, probe, 0.35 * height);
  const area: Area = { ...probe, y1: Math.max(probe.y0 + 20, height - 10 - legend - labels.height) };
  let body = title.svg;
  if (yTicks.length === 0) body += drawFrame(area) + noData(area);
  else {
    const Y = continuousAxis(yTicks, 'linear', area.y1, area.y0);
    body += drawYAxis(Y, area) + drawFrame(area) + drawPoints(values, area, spec.categories.length, Y.map);
  }
  body += `<g class="categories">${categoryLabels(spec.categories, area, 0.35 * height).svg}</g>`;
  body += axisTitles('', spec.yLabel, area, 0, 20);
  body += drawLegend(entries, 12, area.y1 + labels.height + 6, width - 24);
  return svgDocument(width, height, spec.title, spec.description, body);
}

function drawPoints(values: Array<Array<CategoryValue | null>>, area: Area, n: number, Y: (v: number) => number): string {
  const band = (area.x1 - area.x0) / Math.max(1, n);
  const dodge = Math.min((band * 0.8) / Math.max(1, values.length), 18);
  let out = '';
  values.forEach((vals, i) => {
    const style = seriesStyle(i);
    const offset = (i - (values.length - 1) / 2) * dodge;
    let g = '';
    vals.forEach((v, j) => {
      if (v === null || !drawable(v.y, 'linear')) return;
      const x = area.x0 + band * (j + 0.5) + offset;
      if (drawable(v.low, 'linear') && drawable(v.high, 'linear')) {
        const [a, b] = [Y(v.low), Y(v.high)];
        const d = `M${px(x)},${px(a)}V${px(b)}M${px(x - 4)},${px(a)}H${px(x + 4)}M${px(x - 4)},${px(b)}H${px(x + 4)}`;
        g += el('path', { class: 'error-bar', d, fill: 'none', stroke: style.colour, 'stroke-width': '1.5' });
      }
      g += marker(style.marker, x, Y(v.y), 4, style.colour);
    });
    out += el('g', { class: 'series' }, g);
  });
  return out;
}
