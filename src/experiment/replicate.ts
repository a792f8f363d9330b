/**
 * One replication: build the cell of one point from its resolved config, run it, compute the metrics.
 * A pure function of (config, point index, replication index): the same inputs give the same record
 * in any process, worker or shard.
 */
import { Cell, type CellPlan } from '../access/cell.js';
import type { ExperimentConfig } from '../config/schema.js';
import { computeMetrics, type MetricValues } from '../metrics/catalogue.js';
import { cellTally, groupTally, type Tally } from '../metrics/tally.js';
import { replicationSeed, StreamSet } from '../random/index.js';

export interface ReplicationRecord {
  readonly point: number;
  readonly replication: number;
  /** Seed of the replication's streams; with the config it reproduces the replication exactly. */
  readonly seed: string;
  readonly metrics: MetricValues['cell'];
  readonly groups: MetricValues['groups'];
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

export function cellPlan(config: ExperimentConfig): CellPlan {
  return {
    groups: Object.entries(config.groups).map(([name, g]) => ({
      name,
      count: g.count,
      traffic: g.traffic,
      access: g.access,
      deadline: g.deadline ?? Infinity,
    })),
    randomAccess: config.cell.random_access,
    horizon: config.horizon ?? Infinity,
    warmup: config.warmup,
    eventLimit: config.max_events,
  };
}

export function seedFor(config: ExperimentConfig, point: number, replication: number): string {
  return replicationSeed(config.seed, config.common_random_numbers ? null : point, replication);
}

export function runReplication(config: ExperimentConfig, point: number, replication: number, seed = seedFor(config, point, replication)): ReplicationRecord {
  const plan = cellPlan(config);
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
  plan.groups.forEach((g, i) => groups.set(g.name, groupTally(outcome.ledger, i, outcome.open)));
  const ledger = outcome.ledger;
  const occasionsCounted = ledger.firstActiveOccasion < 0 ? 0 : ledger.lastActiveOccasion - ledger.firstActiveOccasion + 1;
  const values = computeMetrics(cellTally([...groups.values()]), groups, {
    observationMs: outcome.endTime - plan.warmup,
    occasionsCounted,
    preambles: plan.randomAccess.preambles,
    singletonPreambles: ledger.singletonPreambles,
    collidedPreambles: ledger.collidedPreambles,
    usedPreambles: ledger.usedPreambles,
    barring: plan.randomAccess.barring !== undefined,
    anyDeadline: plan.groups.some((g) => Number.isFinite(g.deadline)),
    events: outcome.events,
  });
  return { point, replication, seed, metrics: values.cell, groups: values.groups };
}
