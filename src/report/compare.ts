/**
 * The comparison table printed when an experiment has several points (a sweep): one row per point,
 * one column per chosen metric, each as mean ± half-width; one table for the cell and one per chosen
 * group.
 */
import type { ExperimentResult } from '../experiment/run.js';
import type { Summary } from '../stats/index.js';
import { DEFAULT_COMPARE_METRICS } from '../metrics/catalogue.js';
import { intervalText } from './numbers.js';

const cellText = (s: Summary | undefined): string => (s === undefined || s.n === 0 ? '—' : intervalText(s.mean, s.half_width));

function table(title: string, rows: Array<{ label: string; metrics: Record<string, Summary> | undefined }>, metrics: readonly string[]): string[] {
  const shown = metrics.filter((m) => rows.some((r) => (r.metrics?.[m]?.n ?? 0) > 0));
  const header = ['point', ...shown];
  const body = rows.map((r) => [r.label, ...shown.map((m) => cellText(r.metrics?.[m]))]);
  const widths = header.map((h, c) => Math.max(h.length, ...body.map((row) => (row[c] ?? '').length)));
  const line = (cells: string[]): string => `  ${cells.map((text, c) => (c === 0 ? text.padEnd(widths[c] ?? 0) : text.padStart(widths[c] ?? 0))).join('   ')}`;
  return [title, line(header), ...body.map(line), ''];
}

/** Comparison tables: the cell, then each group that has a deadline (or the named groups). */
export function comparisonTable(result: ExperimentResult, metrics: readonly string[] = DEFAULT_COMPARE_METRICS, groups?: readonly string[]): string {
  const level = Math.round(result.config.confidence_level * 1000) / 10;
  const points = result.points;
  const all = Object.entries(result.config.groups);
  // With a single group its table would repeat the cell's.
  const chosenGroups = groups ?? (all.length > 1 ? all.filter(([, g]) => g.deadline !== undefined).map(([name]) => name) : []);
  const out = [
    ...table(
      `comparison over ${points.length} points · mean ± ${level} % half-width · cell`,
      points.map((p) => ({ label: p.spec.label, metrics: p.summary.metrics })),
      metrics,
    ),
  ];
  for (const g of chosenGroups) {
    out.push(...table(`group ${g}`, points.map((p) => ({ label: p.spec.label, metrics: p.summary.groups[g]?.metrics })), metrics));
  }
  return out.join('\n');
}
