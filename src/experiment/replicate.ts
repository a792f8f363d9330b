/**
 * One replication: build the cell of one point from its resolved config, run it, compute the metrics.
 * A pure function of (config, point index, replication index): the same inputs give the same record
 * in any process, worker or shard.
 */
import { Cell, type CellPlan, type GroupPlan } from '../access/cell.js';
import { layoutPositionsFromCsv } from '../geometry/layout-files.js';
import { resolveDataFile } from '../config/data-files.js';
import type { ExperimentConfig } from '../config/schema.js';
import { computeMetrics, conditionsOf, type MetricValues } from '../metrics/catalogue.js';
import { cellTally, groupTally, type Tally } from '../metrics/tally.js';
import type { AgeSummary } from '../metrics/age.js';
import { replicationSeed, StreamSet } from '../random/index.js';

export interface ReplicationRecord {
  readonly point: number;
  readonly replication: number;
  /** Seed of the replication's streams; with the config it reproduces the replication exactly. */
  readonly seed: string;
  readonly metrics: MetricValues['cell'];
  readonly groups: MetricValues['groups'];
  /** Kernel events the replication processed: a cost figure, kept out of the results. */
  readonly events: number;
  /** Access-delay quantiles (ms) at DELAY_QUANTILE_LEVELS, for the cell and each group (NaN: no delivery). */
  readonly delayQuantiles: { readonly cell: number[]; readonly groups: Record<string, number[]> };
}

/** Probabilities at which every replication records its delay quantiles (for CDF plots). */
export const DELAY_QUANTILE_LEVELS: readonly number[] = [
  0.01, 0.025, 0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.35, 0.4, 0.45, 0.5, 0.55, 0.6, 0.65, 0.7, 0.75, 0.8, 0.85, 0.9, 0.925, 0.95, 0.975, 0.99,
];

function quantilesOf(t: Tally): number[] {
  return DELAY_QUANTILE_LEVELS.map((q) => t.delay.quantile(q));
}

/** A replication that could not finish, with the coordinates to replay it. */
export class ReplicationError extends Error {
  constructor(
    message: string,
    readonly point: number,
    readonly replication: number,
    readonly seed: string,
  ) {
    super(`${message} (point ${point}, replication ${replication}, seed ${seed})`);
    this.name = 'ReplicationError';
  }
}

export function cellPlan(config: ExperimentConfig, baseDir = process.cwd()): CellPlan {
  return {
    groups: Object.entries(config.groups).map(([name, g]) => {
      const plan: GroupPlan = {
        name,
        count: g.count,
        traffic: g.traffic.model === 'trace' ? { ...g.traffic, file: resolveDataFile(baseDir, g.traffic.file) } : g.traffic,
        access: g.access,
        deadline: g.deadline ?? Infinity,
        layout: g.layout,
      };
      return g.layout.model === 'csv' ? { ...plan, csvPositions: layoutPositionsFromCsv(resolveDataFile(baseDir, g.layout.file), g.count) } : plan;
    }),
    randomAccess: config.cell.random_access,
    uplink: config.cell.uplink,
    radius: config.cell.radius,
    horizon: config.horizon ?? Infinity,
    warmup: config.warmup,
    eventLimit: config.max_events,
  };
}

export function seedFor(config: ExperimentConfig, point: number, replication: number): string {
  return replicationSeed(config.seed, config.common_random_numbers ? null : point, replication);
}

export function runReplication(
  config: ExperimentConfig,
  point: number,
  replication: number,
  seed = seedFor(config, point, replication),
  baseDir = process.cwd(),
): ReplicationRecord {
  const plan = cellPlan(config, baseDir);
  const cell = new Cell(plan, new StreamSet(seed));
  const outcome = cell.run();
  if (outcome.stopReason === 'event-limit') {
    throw new ReplicationError(
      `the replication reached max_events (${config.max_events}) at simulated time ${outcome.endTime} ms; raise max_events or shorten the horizon`,
      point,
      replication,
      seed,
    );
  }
  const groups = new Map<string, Tally>();
  plan.groups.forEach((g, i) => groups.set(g.name, groupTally(outcome.ledger, i, outcome.open, g.count, outcome.ages[i] as AgeSummary)));
  const ledger = outcome.ledger;
  const occasionsCounted = ledger.firstActiveOccasion < 0 ? 0 : ledger.lastActiveOccasion - ledger.firstActiveOccasion + 1;
  const whole = cellTally([...groups.values()]);
  const values = computeMetrics(whole, groups, {
    observationMs: outcome.endTime - plan.warmup,
    occasionsCounted,
    preambles: plan.randomAccess.preambles,
    singletonPreambles: ledger.singletonPreambles,
    collidedPreambles: ledger.collidedPreambles,
    usedPreambles: ledger.usedPreambles,
    events: outcome.events,
    power: config.cell.energy,
    ...conditionsOf(config),
  });
  const groupQuantiles: Record<string, number[]> = {};
  for (const [name, t] of groups) groupQuantiles[name] = quantilesOf(t);
  return { point, replication, seed, events: outcome.events, metrics: values.cell, groups: values.groups, delayQuantiles: { cell: quantilesOf(whole), groups: groupQuantiles } };
}
