/** Across-replication statistics of one point: mean, standard deviation and Student-t half-width per metric. */
import { summarize, type Summary } from '../stats/index.js';
import { DELAY_QUANTILE_LEVELS, type ReplicationRecord } from './replicate.js';

/** Across-replication summary of each delay quantile (per level: mean, half-width, n). */
export interface QuantileSummary {
  readonly levels: readonly number[];
  readonly quantiles: readonly Summary[];
}

export interface PointSummary {
  readonly metrics: Record<string, Summary>;
  readonly groups: Record<string, { readonly metrics: Record<string, Summary>; readonly delay: QuantileSummary }>;
  readonly delay: QuantileSummary;
}

function summarizeQuantiles(rows: ReadonlyArray<readonly number[]>, level: number): QuantileSummary {
  return {
    levels: DELAY_QUANTILE_LEVELS,
    quantiles: DELAY_QUANTILE_LEVELS.map((_, k) => summarize(rows.map((r) => r[k] ?? Number.NaN), level)),
  };
}

function summarizeMaps(maps: ReadonlyArray<Record<string, number>>, level: number): Record<string, Summary> {
  const out: Record<string, Summary> = {};
  const names = maps[0] === undefined ? [] : Object.keys(maps[0]);
  for (const name of names) out[name] = summarize(maps.map((m) => m[name] ?? Number.NaN), level);
  return out;
}

export function summarizePoint(records: readonly ReplicationRecord[], level: number): PointSummary {
  const groups: Record<string, { metrics: Record<string, Summary>; delay: QuantileSummary }> = {};
  const groupNames = records[0] === undefined ? [] : Object.keys(records[0].groups);
  for (const g of groupNames) {
    groups[g] = {
      metrics: summarizeMaps(records.map((r) => r.groups[g] ?? {}), level),
      delay: summarizeQuantiles(records.map((r) => r.delayQuantiles.groups[g] ?? []), level),
    };
  }
  return {
    metrics: summarizeMaps(records.map((r) => r.metrics), level),
    groups,
    delay: summarizeQuantiles(records.map((r) => r.delayQuantiles.cell), level),
  };
}
