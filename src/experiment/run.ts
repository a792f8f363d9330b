/**
 * Runs an experiment: every point, with a fixed number of replications or until the sequential
 * stopping rule is met. Replications are taken in index order so that the result does not depend on
 * how (or where) they were computed.
 */
import type { ExperimentConfig } from '../config/schema.js';
import { relativePrecisionReached } from '../stats/index.js';
import { summarizePoint, type PointSummary } from './aggregate.js';
import { replicationRule, singlePoint, type PointSpec, type ReplicationRule } from './plan.js';
import { runReplication, type ReplicationRecord } from './replicate.js';

export type StopCause = 'fixed-count' | 'precision-reached' | 'max-replications';

export interface PointResult {
  readonly spec: PointSpec;
  readonly records: readonly ReplicationRecord[];
  readonly summary: PointSummary;
  readonly stopCause: StopCause;
}

export interface ExperimentResult {
  readonly config: ExperimentConfig;
  readonly rule: ReplicationRule;
  readonly points: readonly PointResult[];
}

export interface RunOptions {
  /** The points to run (from the loader's sweep expansion); default: the config alone. */
  readonly points?: readonly PointSpec[];
  /** Folder that data files (layout CSVs, traces) are relative to; default: the working folder. */
  readonly baseDir?: string;
  /** Replaces the configured replication count (or stopping rule). */
  readonly replications?: number;
  /** Called after each finished replication (progress, streaming output). */
  readonly onReplication?: (record: ReplicationRecord) => void;
}

export function runExperiment(config: ExperimentConfig, options: RunOptions = {}): ExperimentResult {
  const rule = replicationRule(config, options.replications);
  const points = (options.points ?? singlePoint(config)).map((spec) => runPoint(spec, rule, options));
  return { config, rule, points };
}

function runPoint(spec: PointSpec, rule: ReplicationRule, options: RunOptions = {}): PointResult {
  const level = spec.config.confidence_level;
  const records: ReplicationRecord[] = [];
  const next = (): void => {
    const record = runReplication(spec.config, spec.index, records.length, undefined, options.baseDir);
    records.push(record);
    options.onReplication?.(record);
  };
  let stopCause: StopCause = 'fixed-count';
  if (rule.kind === 'fixed') {
    while (records.length < rule.count) next();
  } else {
    stopCause = 'max-replications';
    while (records.length < rule.max) {
      next();
      if (records.length >= rule.min && sequentialRuleMet(records, rule.metric, rule.gamma, level)) {
        stopCause = 'precision-reached';
        break;
      }
    }
  }
  return assemblePoint(spec, records, level, stopCause);
}

/** A point's result from its records (in replication order). */
export function assemblePoint(spec: PointSpec, records: readonly ReplicationRecord[], level: number, stopCause: StopCause): PointResult {
  return { spec, records, summary: summarizePoint(records, level), stopCause };
}

export function sequentialRuleMet(records: readonly ReplicationRecord[], metric: string, gamma: number, level: number): boolean {
  return relativePrecisionReached(
    records.map((r) => r.metrics[metric] ?? Number.NaN),
    gamma,
    level,
  );
}
