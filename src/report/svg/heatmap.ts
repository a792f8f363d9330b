/**
 * Heat maps: a grid of cells coloured on the viridis sequential scale, with a colour legend, cell
 * values written in when the cells are few and large enough, and one tooltip (<title>) per cell.
 * Row 0 (yValues[0]) is drawn at the bottom, as on a y axis; missing cells (non-finite) show the
 * light grey background and are listed in the legend as "missing".
 */
import { sequentialColour, textColourOn } from './palette.js';
import { el, escapeXml, px, text, textWidth } from './xml.js';
import {
  dimension, AXIS, GRID, INK, LABEL_FONT, TICK_FONT, axisTitles, drawFrame, labelWidth, noData, svgDocument, titleBlock, type Area,
} from './frame.js';
import { categoryLabels } from './labels.js';
import { formatTick, niceTicks, MAX_MAGNITUDE } from './scale.js';

export interface HeatMapSpec {
  title: string;
  description: string;
  xLabel: string;
  yLabel: string;
  /** Column labels, left to right. */
  xValues: string[];
  /** Row labels, bottom to top. */
  yValues: string[];
  /** cells[row y][column x]; NaN (or any non-finite value) = missing. */
  cells: number[][];
  /** Name and unit of the cell values, shown beside the colour legend. */
  valueLabel: string;
  width?: number;
  height?: number;
}

/** Cell values are written in when there are at most this many cells (and they are large enough). */
const MAX_LABELLED_CELLS = 200;
const LEGEND_STEPS = 64;
const MISSING = '#f0f0f0';

function finiteCell(v: number | undefined): v is number {
  return v !== undefined && Number.isFinite(v) && Math.abs(v) <= MAX_MAGNITUDE;
}

/** Range of the finite cells inside the labelled grid, or null when there are none. */
function valueRange(spec: HeatMapSpec): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  spec.yValues.forEach((_, r) =>
    spec.xValues.forEach((_, c) => {
      const v = spec.cells[r]?.[c];
      if (!finiteCell(v)) return;
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }),
  );
  return lo <= hi ? [lo, hi] : null;
}

/** Legend ticks: nice values inside [lo, hi], or the two ends when fewer than two fall inside. */
function legendTicks(lo: number, hi: number): number[] {
  if (lo === hi) return [lo];
  const inside = niceTicks(lo, hi).filter((t) => t >= lo && t <= hi);
  return inside.length >= 2 ? inside : [lo, hi];
}

/** Cell value text: three significant digits in the tick style ("1.23k", "0.0457"). */
function cellText(v: number): string {
  return formatTick(Number(v.toPrecision(3)));
}

/** A heat map with a vertical colour legend on the right. */
export function heatMap(spec: HeatMapSpec): string {
  const width = dimension(spec.width, 640);
  const height = dimension(spec.height, 400);
  const range = valueRange(spec);
  const ticks = range === null ? [] : legendTicks(range[0], range[1]);
  const title = titleBlock(spec.title, width);
  const rowWidth = spec.yValues.reduce((w, y) => Math.max(w, textWidth(y, TICK_FONT)), 0);
  const legendLabels = [...ticks.map(formatTick), ...(hasMissing(spec) ? ['missing'] : [])];
  const legendWidth = range === null ? 0 : 14 + 8 + labelWidth(legendLabels) + 14 + 20;
  const probe: Area = { x0: 40 + rowWidth, x1: width - 12 - legendWidth, y0: title.height + 8, y1: 0 };
  const labels = categoryLabels(spec.xValues, probe, 0.35 * height);
  const xLabelY = height - 10;
  const area: Area = { ...probe, y1: Math.max(probe.y0 + 20, xLabelY - 18 - labels.height) };
  let body = title.svg;
  if (range === null) body += noData(area);
  else body += drawCells(spec, area, range) + drawColourLegend(spec.valueLabel, ticks, range, area, width, hasMissing(spec));
  body += drawFrame(area) + drawRowLabels(spec.yValues, area);
  body += `<g class="columns">${categoryLabels(spec.xValues, area, 0.35 * height).svg}</g>`;
  body += axisTitles(spec.xLabel, spec.yLabel, area, xLabelY, 20);
  return svgDocument(width, height, spec.title, spec.description, body);
}

function hasMissing(spec: HeatMapSpec): boolean {
  return spec.yValues.some((_, r) => spec.xValues.some((_, c) => !finiteCell(spec.cells[r]?.[c])));
}

function drawRowLabels(rows: string[], area: Area): string {
  const h = (area.y1 - area.y0) / Math.max(1, rows.length);
  const out = rows.map((r, i) =>
    text({ x: area.x0 - 6, y: area.y1 - h * (i + 0.5) + 4, 'text-anchor': 'end', 'font-size': TICK_FONT, fill: INK }, r),
  );
  return `<g class="rows">${out.join('')}</g>`;
}

function drawCells(spec: HeatMapSpec, area: Area, [lo, hi]: [number, number]): string {
  const nx = spec.xValues.length;
  const ny = spec.yValues.length;
  const w = (area.x1 - area.x0) / Math.max(1, nx);
  const h = (area.y1 - area.y0) / Math.max(1, ny);
  const labelled = nx * ny <= MAX_LABELLED_CELLS && w >= textWidth('0.000', TICK_FONT) + 4 && h >= TICK_FONT + 4;
  let out = el('rect', { x: area.x0, y: area.y0, width: area.x1 - area.x0, height: area.y1 - area.y0, fill: MISSING });
  spec.yValues.forEach((yName, r) =>
    spec.xValues.forEach((xName, c) => {
      const v = spec.cells[r]?.[c];
      if (!finiteCell(v)) return;
      const colour = sequentialColour(hi === lo ? 0.5 : (v - lo) / (hi - lo));
      const x = area.x0 + c * w;
      const y = area.y1 - (r + 1) * h;
      const tip = el('title', {}, escapeXml(`${xName}, ${yName}: ${cellText(v)}`));
      out += el('rect', { class: 'cell', x, y, width: w, height: h, fill: colour, stroke: '#ffffff', 'stroke-width': '0.5' }, tip);
      if (labelled) {
        out += text({ x: x + w / 2, y: y + h / 2 + 4, 'text-anchor': 'middle', 'font-size': TICK_FONT, fill: textColourOn(colour) }, cellText(v));
      }
    }),
  );
  return `<g class="cells">${out}</g>`;
}

function drawColourLegend(label: string, ticks: number[], [lo, hi]: [number, number], area: Area, width: number, missing: boolean): string {
  const x = area.x1 + 16;
  const top = area.y0;
  const bottom = missing ? area.y1 - 26 : area.y1;
  const step = (bottom - top) / LEGEND_STEPS;
  let out = '';
  for (let i = 0; i < LEGEND_STEPS; i++) {
    const y = bottom - (i + 1) * step;
    out += el('rect', { class: 'legend-step', x, y, width: 14, height: step + 0.5, fill: sequentialColour((i + 0.5) / LEGEND_STEPS) });
  }
  out += el('rect', { x, y: top, width: 14, height: bottom - top, fill: 'none', stroke: AXIS, 'stroke-width': '0.5' });
  for (const t of ticks) {
    const y = hi === lo ? (top + bottom) / 2 : bottom - ((t - lo) / (hi - lo)) * (bottom - top);
    out += el('line', { x1: x + 14, x2: x + 18, y1: y, y2: y, stroke: AXIS });
    out += text({ x: x + 21, y: y + 4, 'font-size': TICK_FONT, fill: INK }, formatTick(t));
  }
  if (missing) {
    out += el('rect', { x, y: area.y1 - 14, width: 14, height: 14, fill: MISSING, stroke: GRID });
    out += text({ x: x + 21, y: area.y1 - 3, 'font-size': TICK_FONT, fill: INK }, 'missing');
  }
  const lx = width - 14;
  const ly = (top + bottom) / 2;
  out += text({ x: lx, y: ly, 'text-anchor': 'middle', 'font-size': LABEL_FONT, fill: INK, transform: `rotate(-90 ${px(lx)} ${px(ly)})` }, label);
  return `<g class="colour-legend">${out}</g>`;
}
