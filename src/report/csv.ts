/** replications.csv: one row per (point, replication) with the seed that reproduces it. */
import type { ReplicationRecord } from '../experiment/replicate.js';

const cell = (x: number): string => (Number.isFinite(x) ? String(x) : '');

export function csvEscape(text: string): string {
  return /[",\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/** Column names: point, replication, seed, cell metrics, then `<group>.<metric>` for every group. */
export function replicationColumns(first: ReplicationRecord): string[] {
  const columns = ['point', 'replication', 'seed', ...Object.keys(first.metrics)];
  for (const [group, metrics] of Object.entries(first.groups)) {
    for (const name of Object.keys(metrics)) columns.push(`${group}.${name}`);
  }
  return columns;
}

export function replicationRow(r: ReplicationRecord, columns: readonly string[]): string {
  return columns
    .map((c) => {
      if (c === 'point') return String(r.point);
      if (c === 'replication') return String(r.replication);
      if (c === 'seed') return r.seed;
      const dot = c.indexOf('.');
      if (dot > 0 && !(c in r.metrics)) {
        const group = r.groups[c.slice(0, dot)];
        return cell(group?.[c.slice(dot + 1)] ?? Number.NaN);
      }
      return cell(r.metrics[c] ?? Number.NaN);
    })
    .join(',');
}

export function replicationsCsv(records: readonly ReplicationRecord[]): string {
  const first = records[0];
  if (first === undefined) return '';
  const columns = replicationColumns(first);
  const lines = [columns.map(csvEscape).join(',')];
  for (const r of records) lines.push(replicationRow(r, columns));
  return `${lines.join('\n')}\n`;
}
