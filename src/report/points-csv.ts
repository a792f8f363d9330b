/**
 * points.csv: one tidy row per point — the swept parameters as columns, then each metric's mean,
 * half-width and n (cell metrics, then `<group>.<metric>` for every group) — ready for pandas or R.
 */
import type { ExperimentResult } from '../experiment/run.js';
import type { Summary } from '../stats/index.js';
import { csvEscape, csvNumber as number, groupedColumns } from './csv.js';


function parameterText(value: unknown): string {
  if (value === undefined) return '';
  if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') return String(value);
  return JSON.stringify(value);
}

export function pointsCsv(result: ExperimentResult): string {
  const points = result.points;
  if (points.length === 0) return '';
  const paths = [...new Set(points.flatMap((p) => Object.keys(p.spec.parameters)))];
  // Columns from every point: metrics that apply only to some points (grants, predictors) are empty elsewhere.
  const { cell: cellMetrics, groups: groupMetrics } = groupedColumns(
    points.map((p) => ({ metrics: p.summary.metrics, groups: Object.fromEntries(Object.entries(p.summary.groups).map(([g, v]) => [g, v.metrics])) })),
  );
  const header = ['point', 'label', ...paths, 'replications'];
  const stats = (name: string): string[] => [`${name}_mean`, `${name}_half_width`, `${name}_n`];
  for (const m of cellMetrics) header.push(...stats(m));
  for (const [g, ms] of groupMetrics) for (const m of ms) header.push(...stats(`${g}.${m}`));
  const cells = (s: Summary | undefined): string[] => (s === undefined ? ['', '', ''] : [number(s.mean), number(s.half_width), String(s.n)]);
  const rows = points.map((p) => {
    const row = [String(p.spec.index), p.spec.label, ...paths.map((path) => parameterText(p.spec.parameters[path])), String(p.records.length)];
    for (const m of cellMetrics) row.push(...cells(p.summary.metrics[m]));
    for (const [g, ms] of groupMetrics) for (const m of ms) row.push(...cells(p.summary.groups[g]?.metrics[m]));
    return row.map(csvEscape).join(',');
  });
  return `${[header.map(csvEscape).join(','), ...rows].join('\n')}\n`;
}
