/** The compact terminal table printed by `jostle run`. */
import type { ExperimentResult, PointResult } from '../experiment/run.js';
import type { Summary } from '../stats/index.js';
import { withInterval } from './numbers.js';
import { comparisonTable } from './compare.js';

/** Metrics shown per group (all metrics are in summary.json). */
const GROUP_METRICS = [
  'access_success_probability',
  'delay_mean_ms',
  'delay_p95_ms',
  'deadline_met_share',
  'throughput_per_s',
  'mean_preamble_transmissions',
];

/** Metrics left out of the terminal table (bookkeeping; still in the files). */
const HIDDEN = new Set(['occasions_counted', 'observation_time_s', 'arrival_time_mean_ms', 'arrival_time_sd_ms']);

function pad(text: string, width: number, right = false): string {
  return right ? text.padStart(width) : text.padEnd(width);
}

function rows(metrics: Record<string, Summary>, pick: (name: string) => boolean, level: number): string[] {
  const entries = Object.entries(metrics).filter(([name, s]) => pick(name) && s.n > 0);
  const nameWidth = Math.max(6, ...entries.map(([n]) => n.length));
  const pct = `${Math.round(level * 1000) / 10} %`;
  const lines = [`  ${pad('metric', nameWidth)}  ${pad('mean', 14, true)}  ${pad(`± (${pct})`, 12, true)}  ${pad('n', 4, true)}`];
  for (const [name, s] of entries) {
    const f = withInterval(s.mean, s.half_width);
    lines.push(`  ${pad(name, nameWidth)}  ${pad(f.mean, 14, true)}  ${pad(f.halfWidth === '' ? '' : `± ${f.halfWidth}`, 12, true)}  ${pad(String(s.n), 4, true)}`);
  }
  return lines;
}

function describeParameters(p: PointResult): string {
  const entries = Object.entries(p.spec.parameters);
  return entries.length === 0 ? '' : ` · ${entries.map(([k, v]) => `${k}=${String(v)}`).join(', ')}`;
}

export function resultTable(result: ExperimentResult): string {
  if (result.points.length > 1) return comparisonTable(result, result.config.report.compare_metrics, result.config.report.compare_groups);
  const level = result.config.confidence_level;
  const out: string[] = [];
  for (const p of result.points) {
    const stopMetric = result.config.stopping?.metric;
    const zeroMean = stopMetric !== undefined && p.summary.metrics[stopMetric]?.mean === 0;
    const why =
      p.stopCause === 'precision-reached'
        ? ' (precision reached)'
        : p.stopCause === 'max-replications'
          ? zeroMean
            ? ` (stopped at max_replications: ${stopMetric} was 0 in every replication, so its relative precision is undefined — stop on another metric)`
            : ' (stopped at max_replications)'
          : '';
    out.push(`point ${p.spec.index}${describeParameters(p)} · ${p.records.length} replications${why}`);
    out.push('cell');
    out.push(...rows(p.summary.metrics, (n) => !HIDDEN.has(n), level));
    const groups = Object.entries(p.summary.groups);
    if (groups.length > 1) {
      for (const [name, g] of groups) {
        out.push(`group ${name}`);
        out.push(...rows(g.metrics, (n) => GROUP_METRICS.includes(n), level));
      }
    }
    out.push('');
  }
  return out.join('\n');
}
