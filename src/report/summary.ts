/**
 * summary.json: the experiment's resolved config, its seed, and per point the across-replication
 * statistics of every metric, overall and per group. Deterministic: no timestamps or host details, keys
 * in a fixed order, NaN written as null.
 */
import type { ExperimentResult, PointResult } from '../experiment/run.js';
import type { Summary } from '../stats/index.js';
import type { QuantileSummary } from '../experiment/aggregate.js';
import { toolInfo } from '../version.js';

export interface MetricEntry {
  readonly mean: number | null;
  readonly half_width: number | null;
  readonly std: number | null;
  readonly n: number;
}

const finite = (x: number): number | null => (Number.isFinite(x) ? x : null);

function metricEntry(s: Summary): MetricEntry {
  return { mean: finite(s.mean), half_width: finite(s.half_width), std: finite(s.std), n: s.n };
}

function metricMap(m: Record<string, Summary>): Record<string, MetricEntry> {
  const out: Record<string, MetricEntry> = {};
  for (const [name, s] of Object.entries(m)) out[name] = metricEntry(s);
  return out;
}

function quantileDocument(q: QuantileSummary): Record<string, unknown> {
  return {
    levels: q.levels,
    mean: q.quantiles.map((s) => finite(s.mean)),
    half_width: q.quantiles.map((s) => finite(s.half_width)),
    n: q.quantiles.map((s) => s.n),
  };
}

function pointDocument(p: PointResult): Record<string, unknown> {
  const groups: Record<string, unknown> = {};
  for (const [name, g] of Object.entries(p.summary.groups)) groups[name] = { metrics: metricMap(g.metrics), delay_quantiles_ms: quantileDocument(g.delay) };
  return {
    index: p.spec.index,
    label: p.spec.label,
    parameters: p.spec.parameters,
    replications: p.records.length,
    stopped_by: p.stopCause,
    metrics: metricMap(p.summary.metrics),
    delay_quantiles_ms: quantileDocument(p.summary.delay),
    groups,
  };
}

/** The summary document, with `resolvedConfig` the config rendered back to its YAML-input form. */
export function summaryDocument(result: ExperimentResult, resolvedConfig: unknown): Record<string, unknown> {
  const tool = toolInfo();
  return {
    tool: { name: tool.name, version: tool.version },
    experiment: result.config.experiment,
    seed: result.config.seed,
    confidence_level: result.config.confidence_level,
    replication_rule: result.rule,
    config: resolvedConfig,
    points: result.points.map(pointDocument),
  };
}

export function summaryJson(result: ExperimentResult, resolvedConfig: unknown): string {
  return `${JSON.stringify(summaryDocument(result, resolvedConfig), null, 2)}\n`;
}
