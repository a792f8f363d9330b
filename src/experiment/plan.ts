/**
 * The plan of an experiment: its points (one per parameter combination) and how many replications
 * each point gets. Every (point, replication) pair is an independent task with a stable index.
 */
import { DEFAULT_REPLICATIONS, type ExperimentConfig } from '../config/schema.js';
import type { PointSpec } from '../config/sweep.js';

export type { PointSpec };

export type ReplicationRule =
  | { readonly kind: 'fixed'; readonly count: number }
  | {
      readonly kind: 'sequential';
      readonly metric: string;
      readonly gamma: number;
      readonly min: number;
      readonly max: number;
    };

/** The single point of an experiment without a sweep (sweeps are expanded by the loader). */
export function singlePoint(config: ExperimentConfig): PointSpec[] {
  return [{ index: 0, parameters: {}, label: 'base', config }];
}

/** How many replications to run; `override` (from the command line) replaces a fixed count or the rule. */
export function replicationRule(config: ExperimentConfig, override?: number): ReplicationRule {
  if (override !== undefined) return { kind: 'fixed', count: override };
  const s = config.stopping;
  if (s !== undefined) {
    return { kind: 'sequential', metric: s.metric, gamma: s.relative_precision, min: s.min_replications, max: s.max_replications };
  }
  return { kind: 'fixed', count: config.replications ?? DEFAULT_REPLICATIONS };
}

/** The config with a fixed replication count in place of its count or stopping rule (`--reps`). */
export function withReplications(config: ExperimentConfig, count: number): ExperimentConfig {
  const { stopping: _dropped, ...rest } = config;
  return { ...rest, replications: count };
}

/** The same for every point of a sweep. */
export function pointsWithReplications(points: readonly PointSpec[], count: number): PointSpec[] {
  return points.map((p) => ({ ...p, config: withReplications(p.config, count) }));
}
