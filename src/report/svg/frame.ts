/**
 * Shared chart furniture: the SVG document with its accessible name, the visible title, continuous
 * axes (ticks, grid, labels), the legend and the "no data" note. Sizes are in pixels; fonts are
 * system-ui/sans-serif at 11–15 px.
 */
import { linearScale, logScale, logTicks, niceTicks, formatTick, MAX_MAGNITUDE } from './scale.js';
import { el, escapeXml, hashId, px, text, textWidth } from './xml.js';
import { marker, type SeriesStyle } from './palette.js';

export const FONT = 'system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';
export const INK = '#222222';
export const AXIS = '#555555';
export const GRID = '#e4e4e4';
export const TICK_FONT = 11;
export const LABEL_FONT = 12;
export const TITLE_FONT = 15;

/** Plot area in pixels: x grows to the right from x0 to x1, y downwards from y0 (top) to y1 (bottom). */
export interface Area {
  readonly x0: number;
  readonly x1: number;
  readonly y0: number;
  readonly y1: number;
}

/** A chart dimension in whole pixels: `value` if finite, clamped to [120, 10000]; otherwise `fallback`. */
export function dimension(value: number | undefined, fallback: number): number {
  return value !== undefined && Number.isFinite(value) ? Math.round(Math.min(10000, Math.max(120, value))) : fallback;
}

/** Wraps `content` into lines of at most `maxWidth` pixels at `fontSize`, breaking at spaces. */
export function wrapWords(content: string, maxWidth: number, fontSize: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of content.split(/\s+/).filter((w) => w !== '')) {
    const next = line === '' ? word : `${line} ${word}`;
    if (line !== '' && textWidth(next, fontSize) > maxWidth) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line !== '') lines.push(line);
  return lines.length > 0 ? lines : [''];
}

/** The visible title (wrapped) and the height it takes, from the top edge. */
export function titleBlock(title: string, width: number): { svg: string; height: number } {
  const lines = wrapWords(title, width - 24, TITLE_FONT);
  const svg = lines
    .map((line, i) => text({ x: 12, y: 22 + i * 19, 'font-size': TITLE_FONT, 'font-weight': '600', fill: INK }, line))
    .join('');
  return { svg, height: 14 + lines.length * 19 };
}

/** The complete <svg> element: role="img" with <title> and <desc> referenced by aria attributes. */
export function svgDocument(width: number, height: number, title: string, description: string, body: string): string {
  const id = `chart-${hashId(`${width}x${height}\n${title}\n${description}\n${body}`)}`;
  const head =
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}"` +
    ` role="img" aria-labelledby="${id}-title" aria-describedby="${id}-desc"` +
    ` font-family="${escapeXml(FONT)}" font-size="${LABEL_FONT}">`;
  return (
    head +
    el('title', { id: `${id}-title` }, escapeXml(title)) +
    el('desc', { id: `${id}-desc` }, escapeXml(description)) +
    el('rect', { x: 0, y: 0, width, height, fill: '#ffffff' }) +
    body +
    '</svg>'
  );
}

/** True when v can be drawn on an axis of the given kind (finite, |v| ≤ 1e100, and > 0 on a log axis). */
export function drawable(v: number | undefined, kind: 'linear' | 'log'): v is number {
  if (v === undefined || !Number.isFinite(v) || Math.abs(v) > MAX_MAGNITUDE) return false;
  return kind === 'log' ? v >= 1 / MAX_MAGNITUDE : true;
}

/** A continuous axis: its ticks (which also bound the domain) and the mapping to pixels. */
export interface ContinuousAxis {
  readonly ticks: number[];
  readonly labels: string[];
  readonly map: (v: number) => number;
}

/** Ticks for the values (already drawable); empty when there are none. */
export function axisTicks(values: number[], kind: 'linear' | 'log'): number[] {
  if (values.length === 0) return [];
  let lo = values[0]!;
  let hi = lo;
  for (const v of values) {
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return kind === 'log' ? logTicks(lo, hi) : niceTicks(lo, hi);
}

/** The axis over [first tick, last tick] mapped to [r0, r1]. */
export function continuousAxis(ticks: number[], kind: 'linear' | 'log', r0: number, r1: number): ContinuousAxis {
  const d: [number, number] = [ticks[0]!, ticks[ticks.length - 1]!];
  const map = kind === 'log' ? logScale(d, [r0, r1]) : linearScale(d, [r0, r1]);
  return { ticks, labels: ticks.map(formatTick), map };
}

/** Widest tick label in pixels. */
export function labelWidth(labels: string[]): number {
  return labels.reduce((w, l) => Math.max(w, textWidth(l, TICK_FONT)), 0);
}

/** Horizontal grid lines, tick marks and labels of a y axis. */
export function drawYAxis(axis: ContinuousAxis, area: Area): string {
  let out = '';
  axis.ticks.forEach((t, i) => {
    const y = axis.map(t);
    out += el('line', { x1: area.x0, x2: area.x1, y1: y, y2: y, stroke: GRID, 'stroke-width': '1' });
    out += el('line', { x1: area.x0 - 5, x2: area.x0, y1: y, y2: y, stroke: AXIS });
    out += text({ x: area.x0 - 8, y: y + 4, 'text-anchor': 'end', 'font-size': TICK_FONT, fill: INK }, axis.labels[i] ?? '');
  });
  return `<g class="y-axis">${out}</g>`;
}

/** Vertical grid lines, tick marks and labels of an x axis; labels are thinned when they would overlap. */
export function drawXAxis(axis: ContinuousAxis, area: Area): string {
  const spacing = (area.x1 - area.x0) / Math.max(1, axis.ticks.length - 1);
  const every = Math.max(1, Math.ceil((labelWidth(axis.labels) + 8) / spacing));
  let out = '';
  axis.ticks.forEach((t, i) => {
    const x = axis.map(t);
    out += el('line', { x1: x, x2: x, y1: area.y0, y2: area.y1, stroke: GRID, 'stroke-width': '1' });
    out += el('line', { x1: x, x2: x, y1: area.y1, y2: area.y1 + 5, stroke: AXIS });
    if (i % every === 0) {
      out += text({ x, y: area.y1 + 18, 'text-anchor': 'middle', 'font-size': TICK_FONT, fill: INK }, axis.labels[i] ?? '');
    }
  });
  return `<g class="x-axis">${out}</g>`;
}

/** The plot frame (left and bottom axis lines). */
export function drawFrame(area: Area): string {
  const d = `M${px(area.x0)},${px(area.y0)}V${px(area.y1)}H${px(area.x1)}`;
  return el('path', { class: 'frame', d, fill: 'none', stroke: AXIS, 'stroke-width': '1' });
}

/** Axis titles: x centred below the tick labels, y rotated along the left edge. */
export function axisTitles(xLabel: string, yLabel: string, area: Area, xLabelY: number, yLabelX: number): string {
  const cx = (area.x0 + area.x1) / 2;
  const cy = (area.y0 + area.y1) / 2;
  const x = xLabel === '' ? '' : text({ class: 'x-label', x: cx, y: xLabelY, 'text-anchor': 'middle', fill: INK }, xLabel);
  const y = text(
    { class: 'y-label', x: yLabelX, y: cy, 'text-anchor': 'middle', transform: `rotate(-90 ${px(yLabelX)} ${px(cy)})`, fill: INK },
    yLabel,
  );
  return x + y;
}

/** A centred "no data" note in the plot area. */
export function noData(area: Area): string {
  const x = (area.x0 + area.x1) / 2;
  const y = (area.y0 + area.y1) / 2;
  return text({ class: 'no-data', x, y, 'text-anchor': 'middle', 'font-size': 13, fill: AXIS, 'font-style': 'italic' }, 'no data');
}

/** One legend entry: its name, style, and whether it shows a line sample and/or a marker. */
export interface LegendEntry {
  readonly name: string;
  readonly style: SeriesStyle;
  readonly line: boolean;
  readonly marker: boolean;
}

const SAMPLE = 26;
const ROW = 18;

/** Rows of legend entries fitted into `width`: each row lists entry indices. */
function legendRows(entries: LegendEntry[], width: number): number[][] {
  const rows: number[][] = [];
  let row: number[] = [];
  let used = 0;
  entries.forEach((e, i) => {
    const w = SAMPLE + 6 + textWidth(e.name, LABEL_FONT) + 18;
    if (row.length > 0 && used + w > width) {
      rows.push(row);
      row = [];
      used = 0;
    }
    row.push(i);
    used += w;
  });
  if (row.length > 0) rows.push(row);
  return rows;
}

/** Height the legend needs in `width` pixels (0 for a single series: no legend then). */
export function legendHeight(entries: LegendEntry[], width: number): number {
  return entries.length > 1 ? legendRows(entries, width).length * ROW + 4 : 0;
}

/** The legend laid out in rows from (x, top); only for more than one series. */
export function drawLegend(entries: LegendEntry[], x: number, top: number, width: number): string {
  if (entries.length <= 1) return '';
  let out = '';
  legendRows(entries, width).forEach((row, r) => {
    let cx = x;
    const cy = top + r * ROW + 9;
    for (const i of row) {
      const e = entries[i]!;
      const stroke = { stroke: e.style.colour, 'stroke-width': '2', 'stroke-dasharray': e.style.dash === '' ? undefined : e.style.dash };
      if (e.line) out += el('line', { x1: cx, x2: cx + SAMPLE, y1: cy, y2: cy, ...stroke });
      if (e.marker) out += marker(e.style.marker, cx + SAMPLE / 2, cy, 4, e.style.colour);
      out += text({ x: cx + SAMPLE + 6, y: cy + 4, fill: INK }, e.name);
      cx += SAMPLE + 6 + textWidth(e.name, LABEL_FONT) + 18;
    }
  });
  return `<g class="legend">${out}</g>`;
}
