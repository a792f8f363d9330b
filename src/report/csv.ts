/** replications.csv: one row per (point, replication) with the seed that reproduces it. */
import type { ReplicationRecord } from '../experiment/replicate.js';

/** A number as a CSV cell: shortest round-trip text, empty for NaN (a metric that does not apply). */
export const csvNumber = (x: number): string => (Number.isFinite(x) ? String(x) : '');
const cell = csvNumber;

export function csvEscape(text: string): string {
  return /[",\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/**
 * The union of several ordered name lists, keeping each list's order: a name missing so far goes right
 * after the name that precedes it in its own list (names before the list's first known name go just
 * before it; a list with no known name is appended). Points of a sweep report different metrics (grant
 * metrics only where grants are used), so columns come from every point, not the first.
 */
export function orderedUnion(lists: Iterable<readonly string[]>): string[] {
  const out: string[] = [];
  const seen = new Set<string>();
  for (const list of lists) {
    let after = -1;
    let leading: string[] = [];
    for (const name of list) {
      if (seen.has(name)) {
        let at = out.indexOf(name);
        if (leading.length > 0) {
          out.splice(at, 0, ...leading);
          at += leading.length;
          leading = [];
        }
        after = at;
      } else if (after >= 0) {
        out.splice(++after, 0, name);
      } else {
        leading.push(name);
      }
      seen.add(name);
    }
    out.push(...leading);
  }
  return out;
}

/** Metric names of a set of tables: cell (or one group's) metrics over all of them, in order. */
export function groupedColumns(tables: readonly { readonly metrics: object; readonly groups: Record<string, object> }[]): {
  cell: string[];
  groups: [string, string[]][];
} {
  const cell = orderedUnion(tables.map((t) => Object.keys(t.metrics)));
  const groupNames = orderedUnion(tables.map((t) => Object.keys(t.groups)));
  const groups = groupNames.map((g): [string, string[]] => [g, orderedUnion(tables.flatMap((t) => (t.groups[g] === undefined ? [] : [Object.keys(t.groups[g])])))]);
  return { cell, groups };
}

/** Column names: point, replication, seed, cell metrics, then `<group>.<metric>` for every group. */
function replicationColumns(records: readonly ReplicationRecord[]): string[] {
  const { cell: cellMetrics, groups } = groupedColumns(records);
  const columns = ['point', 'replication', 'seed', ...cellMetrics];
  for (const [group, names] of groups) for (const name of names) columns.push(`${group}.${name}`);
  return columns;
}

function replicationRow(r: ReplicationRecord, columns: readonly string[]): string {
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
  if (records.length === 0) return '';
  const columns = replicationColumns(records);
  const lines = [columns.map(csvEscape).join(',')];
  for (const r of records) lines.push(replicationRow(r, columns));
  return `${lines.join('\n')}\n`;
}
