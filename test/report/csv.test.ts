/**
 * CSV outputs of a sweep whose points report different metrics: every metric of every point gets a
 * column (empty where it does not apply). Checked against the records themselves (exact).
 */
import { describe, expect, it } from 'vitest';
import { orderedUnion, replicationsCsv } from '../../src/report/csv.js';
import { pointsCsv } from '../../src/report/points-csv.js';
import { runYaml } from '../sim/run-yaml.js';

/** Rows of a CSV text (RFC 4180 quoting: "…" with "" for a quote). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  for (const line of text.trimEnd().split('\n')) {
    const row: string[] = [];
    for (const m of line.matchAll(/(?:^|,)(?:"((?:[^"]|"")*)"|([^,]*))/g)) row.push(m[1] !== undefined ? m[1].replaceAll('""', '"') : (m[2] ?? ''));
    rows.push(row);
  }
  return rows;
}

describe('orderedUnion', () => {
  it('keeps every name once, each list’s order, a new name right after its predecessor', () => {
    expect(orderedUnion([['a', 'b', 'e'], ['a', 'c', 'b', 'd', 'e', 'f'], ['g']])).toEqual(['a', 'c', 'b', 'd', 'e', 'f', 'g']);
    expect(orderedUnion([[], ['x', 'y'], ['z', 'x']])).toEqual(['z', 'x', 'y']);
    expect(orderedUnion([])).toEqual([]);
  });
});

describe('sweep CSVs', () => {
  // Contention first: the grant metrics exist only at the second point.
  const r = runYaml(`experiment: csv-union
seed: 71
replications: 2
horizon: 2s
groups:
  trackers:
    count: 200
    traffic: { model: periodic, period: 500ms }
sweep:
  axes:
    - path: groups.trackers.access
      values:
        - { policy: contention }
        - { policy: random-grant, grants_per_occasion: 2, fallback_after: 20ms }
`);

  it('replications.csv has a column for every metric of every point, empty where it does not apply', () => {
    const [header = [], ...rows] = parseCsv(replicationsCsv(r.points.flatMap((p) => p.records)));
    const column = header.indexOf('trackers.grants_issued');
    expect(column).toBeGreaterThan(0);
    expect(header.indexOf('trackers.fallback_share')).toBeGreaterThan(0);
    expect(new Set(header).size).toBe(header.length);
    expect(rows).toHaveLength(4);
    for (const row of rows) {
      expect(row).toHaveLength(header.length);
      const record = r.points[Number(row[0])]?.records[Number(row[1])];
      const expected = record?.groups['trackers']?.['grants_issued'];
      expect(row[column]).toBe(expected === undefined ? '' : String(expected));
    }
    expect(rows.filter((row) => row[column] !== '')).toHaveLength(2);
  });

  it('points.csv likewise', () => {
    const [header = [], ...rows] = parseCsv(pointsCsv(r));
    const column = header.indexOf('trackers.grants_issued_mean');
    expect(column).toBeGreaterThan(0);
    for (const row of rows) expect(row).toHaveLength(header.length);
    expect(rows[0]?.[column]).toBe('');
    expect(rows[1]?.[column]).toBe(String(r.points[1]?.summary.groups['trackers']?.metrics['grants_issued']?.mean));
  });
});
