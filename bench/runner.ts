/**
 * Times the replications of one simulator case: one untimed warm-up replication, then
 * `replications` timed calls of runReplication(config, 0, r).
 */
import { loadExperimentText } from '../src/config/load.js';
import { formatProblems } from '../src/config/problems.js';
import type { ExperimentConfig } from '../src/config/schema.js';
import { runReplication } from '../src/experiment/replicate.js';
import type { SimulatorCase } from './cases.js';

export interface Spread {
  readonly median: number;
  readonly min: number;
  readonly max: number;
}

export interface ReplicationTiming {
  readonly replication: number;
  readonly wallMs: number;
  /** Kernel events (the record's cost figure). */
  readonly events: number;
  /** Packets that arrived in the observation window (`accesses_started`). */
  readonly packets: number;
  /** Simulated time covered (warm-up + observation window), ms. */
  readonly simulatedMs: number;
}

export interface CaseResult {
  readonly kind: 'simulator';
  readonly id: string;
  readonly description: string;
  readonly replications: number;
  readonly wallMs: Spread;
  readonly eventsPerReplication: Spread;
  /** Medians over replications of the per-replication rates. */
  readonly eventsPerSecond: number;
  readonly simulatedPerWall: number;
  readonly packetsPerSecond: number;
  /** Process peak resident set so far (process.resourceUsage().maxRSS), read after the case. */
  readonly maxRssMiB: number;
  /** V8 heap used after the case (live data plus not-yet-collected garbage). */
  readonly heapUsedMiB: number;
  readonly samples: readonly ReplicationTiming[];
}

const MIB = 1024 * 1024;

export function spread(values: readonly number[]): Spread {
  const sorted = [...values].sort((a, b) => a - b);
  const n = sorted.length;
  if (n === 0) return { median: Number.NaN, min: Number.NaN, max: Number.NaN };
  const mid = Math.floor(n / 2);
  const median = n % 2 === 1 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
  return { median, min: sorted[0] as number, max: sorted[n - 1] as number };
}

function loadCase(c: SimulatorCase): ExperimentConfig {
  const loaded = loadExperimentText(`bench:${c.id}`, c.yaml, c.sets ?? []);
  if (!loaded.ok) throw new Error(`bench case ${c.id}: invalid experiment\n${formatProblems(loaded.problems, loaded.sources)}`);
  return loaded.config;
}

function metric(values: Readonly<Record<string, number>>, name: string): number {
  const v = values[name];
  if (v === undefined) throw new Error(`bench: metric ${name} missing from the record`);
  return v;
}

function timeReplication(config: ExperimentConfig, r: number): ReplicationTiming {
  const start = process.hrtime.bigint();
  const record = runReplication(config, 0, r);
  const wallMs = Number(process.hrtime.bigint() - start) / 1e6;
  return {
    replication: r,
    wallMs,
    events: record.events,
    packets: metric(record.metrics, 'accesses_started'),
    simulatedMs: metric(record.metrics, 'observation_time_s') * 1000 + config.warmup,
  };
}

/** Runs the case; `progress` is told after each timed replication. */
export function runCase(c: SimulatorCase, progress?: (t: ReplicationTiming) => void): CaseResult {
  const config = loadCase(c);
  // Warm-up uses replication index `replications`, outside the timed range 0 … replications−1.
  runReplication(config, 0, c.replications);
  const samples: ReplicationTiming[] = [];
  for (let r = 0; r < c.replications; r++) {
    const t = timeReplication(config, r);
    samples.push(t);
    progress?.(t);
  }
  const perSecond = (f: (t: ReplicationTiming) => number): number => spread(samples.map((t) => f(t) / (t.wallMs / 1000))).median;
  return {
    kind: 'simulator',
    id: c.id,
    description: c.description,
    replications: c.replications,
    wallMs: spread(samples.map((t) => t.wallMs)),
    eventsPerReplication: spread(samples.map((t) => t.events)),
    eventsPerSecond: perSecond((t) => t.events),
    simulatedPerWall: spread(samples.map((t) => t.simulatedMs / t.wallMs)).median,
    packetsPerSecond: perSecond((t) => t.packets),
    maxRssMiB: (process.resourceUsage().maxRSS * 1024) / MIB,
    heapUsedMiB: process.memoryUsage().heapUsed / MIB,
    samples,
  };
}
