/** Across-replication statistics of one point: mean, standard deviation and Student-t half-width per metric. */
import { summarize, type Summary } from '../stats/index.js';
import type { ReplicationRecord } from './replicate.js';

export interface PointSummary {
  readonly metrics: Record<string, Summary>;
  readonly groups: Record<string, { readonly metrics: Record<string, Summary> }>;
}

function summarizeMaps(maps: ReadonlyArray<Record<string, number>>, level: number): Record<string, Summary> {
  const out: Record<string, Summary> = {};
  const names = maps[0] === undefined ? [] : Object.keys(maps[0]);
  for (const name of names) out[name] = summarize(maps.map((m) => m[name] ?? Number.NaN), level);
  return out;
}

export function summarizePoint(records: readonly ReplicationRecord[], level: number): PointSummary {
  const groups: Record<string, { metrics: Record<string, Summary> }> = {};
  const groupNames = records[0] === undefined ? [] : Object.keys(records[0].groups);
  for (const g of groupNames) {
    groups[g] = { metrics: summarizeMaps(records.map((r) => r.groups[g] ?? {}), level) };
  }
  return { metrics: summarizeMaps(records.map((r) => r.metrics), level), groups };
}
