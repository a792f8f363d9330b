/**
 * The figures of a run, drawn from its summary document (so `jostle plot DIR` redraws them from saved
 * results): each chosen metric against the swept parameter with its confidence band — one line per
 * group (one swept axis) or per value of the second axis — a heat map when two numeric axes are
 * swept, and an access-delay CDF per point.
 */
import { parseDuration } from '../config/duration.js';
import { parseLength } from '../config/length.js';
import { metricDefinition } from '../metrics/catalogue.js';
import { categoryChart, heatMap, lineChart, type Series } from './svg/charts.js';

export interface Figure {
  /** File name under plots/ (e.g. `delay_p95_ms.svg`). */
  readonly file: string;
  readonly title: string;
  readonly svg: string;
}

interface Stat {
  readonly mean: number | null;
  readonly half_width: number | null;
  readonly n: number;
}

interface QuantileDoc {
  readonly levels: readonly number[];
  readonly mean: ReadonlyArray<number | null>;
}

interface PointDoc {
  readonly index: number;
  readonly label: string;
  readonly parameters: Record<string, unknown>;
  readonly metrics: Record<string, Stat>;
  readonly delay_quantiles_ms?: QuantileDoc;
  readonly groups: Record<string, { metrics: Record<string, Stat>; delay_quantiles_ms?: QuantileDoc }>;
}

export interface SummaryDoc {
  readonly experiment: string;
  readonly confidence_level: number;
  readonly config: {
    readonly description?: string;
    readonly sweep?: { readonly combine: 'grid' | 'zip'; readonly axes: ReadonlyArray<{ path: string; labels?: string[] }> };
    readonly report?: { readonly plot_metrics?: string[]; readonly compare_groups?: string[] };
  };
  readonly points: readonly PointDoc[];
}

const DEFAULT_PLOT_METRICS = [
  'access_success_probability',
  'deadline_met_share',
  'delay_mean_ms',
  'delay_p95_ms',
  'throughput_per_s',
  'collision_probability_per_rao',
  'grants_wasted',
  'energy_per_delivered_packet_mj',
  'aoi_mean_ms',
];

/** One swept axis as seen in the points: numeric (with a unit) or categorical. */
interface Axis {
  readonly path: string;
  readonly label: string;
  readonly numeric: boolean;
  /** Per point: the numeric value, or the category name. */
  readonly value: (p: PointDoc) => number;
  readonly category: (p: PointDoc) => string;
  readonly categories: string[];
  /** Whether the categories are labels given in the file (else raw values). */
  readonly named: boolean;
}

function asNumber(v: unknown): { value: number; unit: string } | null {
  if (typeof v === 'number' && Number.isFinite(v)) return { value: v, unit: '' };
  if (typeof v === 'string') {
    const d = parseDuration(v);
    if (d.ok) return { value: d.ms, unit: 'ms' };
    const l = parseLength(v);
    if (l.ok) return { value: l.metres, unit: 'm' };
  }
  return null;
}

function categoryOf(v: unknown): string {
  if (typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean') return String(v);
  return JSON.stringify(v);
}

function axisOf(doc: SummaryDoc, a: number): Axis {
  const spec = doc.config.sweep?.axes[a];
  const path = spec?.path ?? '';
  const values = doc.points.map((p) => p.parameters[path]);
  const numbers = values.map(asNumber);
  const numeric = numbers.every((n) => n !== null) && new Set(numbers.map((n) => n?.unit)).size === 1;
  const unit = numeric ? (numbers[0]?.unit ?? '') : '';
  const distinct = [...new Set(values.map(categoryOf))];
  const labelFor = (v: unknown): string => {
    const i = distinct.indexOf(categoryOf(v));
    return spec?.labels?.[i] ?? categoryOf(v);
  };
  const short = path.split('.').slice(-2).join('.');
  return {
    path,
    label: unit === '' ? short : `${short} (${unit})`,
    numeric,
    value: (p) => asNumber(p.parameters[path])?.value ?? Number.NaN,
    category: (p) => labelFor(p.parameters[path]),
    categories: distinct.map((_, i) => spec?.labels?.[i] ?? distinct[i] ?? ''),
    named: spec?.labels !== undefined,
  };
}

function metricLabel(name: string): string {
  const unit = metricDefinition(name)?.unit ?? '';
  return unit === '' || unit === '1' ? name : `${name} (${unit})`;
}

/** Shares and probabilities (unit 1) lie in [0, 1]: their intervals are clipped to it. */
function isShare(metric: string): boolean {
  return metricDefinition(metric)?.unit === '1';
}

function point(stat: Stat | undefined, x: number, clipToUnit: boolean): { x: number; y: number; low?: number; high?: number } | null {
  if (stat === undefined || stat.mean === null) return null;
  const hw = stat.half_width;
  if (hw === null) return { x, y: stat.mean };
  const low = stat.mean - hw;
  const high = stat.mean + hw;
  return clipToUnit ? { x, y: stat.mean, low: Math.max(0, low), high: Math.min(1, high) } : { x, y: stat.mean, low, high };
}

function logWorthy(values: number[]): boolean {
  const positive = values.filter((v) => v > 0);
  return positive.length === values.length && positive.length > 1 && Math.max(...positive) / Math.min(...positive) >= 20;
}

function level(doc: SummaryDoc): string {
  return `${Math.round(doc.confidence_level * 1000) / 10} %`;
}

/** Metric against one numeric axis: a line for the cell and one per group. */
function againstAxis(doc: SummaryDoc, axis: Axis, metric: string): Figure | null {
  const groupNames = Object.keys(doc.points[0]?.groups ?? {});
  const sorted = [...doc.points].sort((a, b) => axis.value(a) - axis.value(b));
  const lines: Series[] = [{ name: 'cell', points: sorted.flatMap((p) => point(p.metrics[metric], axis.value(p), isShare(metric)) ?? []) }];
  if (groupNames.length > 1) {
    for (const g of groupNames) lines.push({ name: g, points: sorted.flatMap((p) => point(p.groups[g]?.metrics[metric], axis.value(p), isShare(metric)) ?? []) });
  }
  if (lines.every((s) => s.points.length === 0)) return null;
  const title = `${metric} against ${axis.path}`;
  return {
    file: `${metric}.svg`,
    title,
    svg: lineChart({
      title,
      description: `Mean over replications with its ${level(doc)} confidence band, for the whole cell${groupNames.length > 1 ? ' and each device group' : ''}.`,
      xLabel: axis.label,
      yLabel: metricLabel(metric),
      xScale: logWorthy(sorted.map(axis.value)) ? 'log' : 'linear',
      series: lines.filter((s) => s.points.length > 0),
    }),
  };
}

/** Metric against a numeric axis, one line per value of a second axis (the cell, or one group). */
function againstTwoAxes(doc: SummaryDoc, x: Axis, by: Axis, metric: string, group?: string): Figure | null {
  const stat = (p: PointDoc): Stat | undefined => (group === undefined ? p.metrics[metric] : p.groups[group]?.metrics[metric]);
  const lines: Series[] = by.categories.map((c) => ({
    name: by.named ? c : `${by.label}=${c}`,
    points: doc.points
      .filter((p) => by.category(p) === c)
      .sort((a, b) => x.value(a) - x.value(b))
      .flatMap((p) => point(stat(p), x.value(p), isShare(metric)) ?? []),
  }));
  if (lines.every((s) => s.points.length === 0)) return null;
  const who = group === undefined ? 'cell' : `group ${group}`;
  const title = `${metric} (${who}) against ${x.path}, by ${by.path}`;
  return {
    file: group === undefined ? `${metric}.svg` : `${group}.${metric}.svg`,
    title,
    svg: lineChart({
      title,
      description: `Mean over replications (${who}) with its ${level(doc)} confidence band; one line per value of ${by.path}.`,
      xLabel: x.label,
      yLabel: metricLabel(metric),
      xScale: logWorthy(doc.points.map(x.value)) ? 'log' : 'linear',
      series: lines.filter((s) => s.points.length > 0),
    }),
  };
}

/**
 * Metric per point (categorical sweeps): points with error bars, cell and groups. The categories are
 * the points themselves, in order, named by their labels (taken by index, never looked up by label).
 */
function perPoint(doc: SummaryDoc, metric: string): Figure | null {
  const categories = doc.points.map((p) => p.label);
  const groupNames = Object.keys(doc.points[0]?.groups ?? {});
  const value = (s: Stat | undefined): { y: number; low?: number; high?: number } | null => {
    const p = point(s, 0, isShare(metric));
    return p === null ? null : p.low === undefined || p.high === undefined ? { y: p.y } : { y: p.y, low: p.low, high: p.high };
  };
  const series = [{ name: 'cell', values: doc.points.map((p) => value(p.metrics[metric])) }];
  if (groupNames.length > 1) for (const g of groupNames) series.push({ name: g, values: doc.points.map((p) => value(p.groups[g]?.metrics[metric])) });
  if (series.every((s) => s.values.every((v) => v === null))) return null;
  const title = `${metric} by point`;
  return {
    file: `${metric}.svg`,
    title,
    svg: categoryChart({
      title,
      description: `Mean over replications with its ${level(doc)} confidence interval, for the whole cell${groupNames.length > 1 ? ' and each device group' : ''}.`,
      categories,
      yLabel: metricLabel(metric),
      series: series.filter((s) => s.values.some((v) => v !== null)),
    }),
  };
}

function heat(doc: SummaryDoc, x: Axis, y: Axis, metric: string): Figure | null {
  const xs = [...new Set(doc.points.map(x.value))].sort((a, b) => a - b);
  const ys = [...new Set(doc.points.map(y.value))].sort((a, b) => a - b);
  const cells = ys.map((yv) =>
    xs.map((xv) => doc.points.find((p) => x.value(p) === xv && y.value(p) === yv)?.metrics[metric]?.mean ?? Number.NaN),
  );
  if (cells.every((row) => row.every((v) => Number.isNaN(v)))) return null;
  const title = `${metric} over ${x.path} × ${y.path}`;
  return {
    file: `heatmap-${metric}.svg`,
    title,
    svg: heatMap({
      title,
      description: 'Cell-level mean over replications for every combination of the two swept parameters.',
      xLabel: x.label,
      yLabel: y.label,
      xValues: xs.map(String),
      yValues: ys.map(String),
      cells,
      valueLabel: metricLabel(metric),
    }),
  };
}

/** The access-delay CDF of one point: the cell and each group. */
function delayCdf(p: PointDoc): Figure | null {
  const series: Series[] = [];
  const add = (name: string, q: QuantileDoc | undefined): void => {
    if (q === undefined) return;
    const points = q.levels.flatMap((level, k) => {
      const x = q.mean[k];
      return x === null || x === undefined ? [] : [{ x, y: level }];
    });
    if (points.length > 0) series.push({ name, points });
  };
  add('cell', p.delay_quantiles_ms);
  const groups = Object.entries(p.groups);
  if (groups.length > 1) for (const [g, v] of groups) add(g, v.delay_quantiles_ms);
  if (series.length === 0) return null;
  const xs = series.flatMap((s) => s.points.map((q) => q.x));
  const title = `Access-delay CDF, point ${p.index}: ${p.label}`;
  return {
    file: `delay-cdf-point-${p.index}.svg`,
    title,
    svg: lineChart({
      title,
      description: 'Share of delivered packets with an access delay at most x; each delay quantile is the mean over replications.',
      xLabel: 'access delay (ms)',
      yLabel: 'share of delivered packets',
      xScale: logWorthy(xs) ? 'log' : 'linear',
      series,
      step: true,
    }),
  };
}

/** Every figure of a run with a sweep (none without one). */
export function figuresOf(doc: SummaryDoc, metrics?: readonly string[]): Figure[] {
  const axesCount = doc.config.sweep?.axes.length ?? 0;
  if (axesCount === 0 || doc.points.length < 2) return [];
  const present = (m: string): boolean => doc.points.some((p) => p.metrics[m] !== undefined);
  const chosen = (metrics ?? doc.config.report?.plot_metrics ?? DEFAULT_PLOT_METRICS).filter(present);
  const axes = Array.from({ length: axesCount }, (_, a) => axisOf(doc, a));
  const zipped = doc.config.sweep?.combine === 'zip';
  const figures: Figure[] = [];
  for (const metric of chosen) {
    let f: Figure | null;
    const [a0, a1] = axes;
    if (a0 === undefined) continue;
    if (zipped || axes.length === 1) {
      // A numeric axis can carry the x of a line only if no two points share its value.
      const numeric = axes.find((a) => a.numeric && new Set(doc.points.map(a.value)).size === doc.points.length);
      f = numeric !== undefined ? againstAxis(doc, numeric, metric) : perPoint(doc, metric);
    } else if (axes.length === 2 && a1 !== undefined) {
      const x = a0.numeric ? a0 : a1.numeric ? a1 : null;
      const by = x === a0 ? a1 : a0;
      f = x === null ? perPoint(doc, metric) : againstTwoAxes(doc, x, by, metric);
      if (x !== null) {
        for (const g of doc.config.report?.compare_groups ?? []) {
          const gf = againstTwoAxes(doc, x, by, metric, g);
          if (gf !== null) figures.push(gf);
        }
      }
      if (a0.numeric && a1.numeric) {
        const h = heat(doc, a0, a1, metric);
        if (h !== null) figures.push(h);
      }
    } else {
      f = perPoint(doc, metric);
    }
    if (f !== null) figures.push(f);
  }
  for (const p of doc.points) {
    const f = delayCdf(p);
    if (f !== null) figures.push(f);
  }
  return figures;
}
