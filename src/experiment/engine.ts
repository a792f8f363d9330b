/**
 * The task engine: runs the (point, replication) tasks of an experiment — or of one shard of it — on a
 * task runner (this thread or worker threads), records each finished replication in the journal as
 * soon as it arrives, and stops early and cleanly when asked (Ctrl-C).
 *
 * Determinism: a record depends only on (config, point, replication); results are assembled in index
 * order; the sequential stopping rule is evaluated on prefixes 1…n in order. So neither the number of
 * workers, nor the order of completion, nor an interruption and resume can change a result.
 *
 * Shards: with a fixed replication count, shard i of N takes the tasks whose index p·R + r is
 * i − 1 modulo N; with the sequential rule (whose length per point is not known in advance) it takes
 * the points whose index is i − 1 modulo N.
 */
import type { Journal, Shard } from './journal.js';
import type { PointSpec, ReplicationRule } from './plan.js';
import { createRunner, type TaskRunner } from './pool.js';
import type { ReplicationRecord } from './replicate.js';
import { assemblePoint, sequentialRuleMet, type PointResult } from './run.js';

export interface EngineOptions {
  readonly workers: number;
  readonly shard: Shard | null;
  readonly journal: Journal | null;
  readonly signal?: AbortSignal;
  /** Called after each finished replication with the number done and the total (null: unknown yet). */
  readonly onProgress?: (done: number, total: number | null) => void;
}

export interface EngineOutcome {
  /** The points this run covered (all, or the shard's), complete; empty when interrupted. */
  readonly points: readonly PointResult[];
  readonly interrupted: boolean;
  /** Replications finished in this session (not counting resumed ones). */
  readonly ran: number;
}

interface PointState {
  readonly spec: PointSpec;
  readonly records: Map<number, ReplicationRecord>;
  /** Replications this point needs (fixed), or, once the sequential rule decided, where it stopped. */
  decided: number | null;
  /** Prefix lengths up to this have been checked against the sequential rule. */
  checked: number;
  next: number;
  inFlight: number;
}

function taskInShard(shard: Shard | null, rule: ReplicationRule, point: number, replication: number, replicationsPerPoint: number): boolean {
  if (shard === null) return true;
  const index = rule.kind === 'fixed' ? point * replicationsPerPoint + replication : point;
  return index % shard.count === shard.index - 1;
}

export async function runTasks(points: readonly PointSpec[], baseDir: string, rule: ReplicationRule, options: EngineOptions): Promise<EngineOutcome> {
  const perPoint = rule.kind === 'fixed' ? rule.count : rule.max;
  const states: PointState[] = points
    .filter((p) => rule.kind === 'fixed' || taskInShard(options.shard, rule, p.index, 0, perPoint))
    .map((spec) => ({ spec, records: new Map(), decided: rule.kind === 'fixed' ? rule.count : null, checked: 0, next: 0, inFlight: 0 }));
  const byIndex = new Map(states.map((s) => [s.spec.index, s]));
  for (const record of options.journal?.previous ?? []) byIndex.get(record.point)?.records.set(record.replication, record);

  const wanted = (s: PointState, r: number): boolean => taskInShard(options.shard, rule, s.spec.index, r, perPoint);
  const total = rule.kind === 'fixed' ? states.reduce((n, s) => n + countWanted(s, perPoint, wanted), 0) : null;
  let done = states.reduce((n, s) => n + [...s.records.keys()].filter((r) => r < perPoint && wanted(s, r)).length, 0);
  states.forEach((s) => decide(s, rule));

  const runner = createRunner(options.workers, points, baseDir);
  let ran = 0;
  let failure: unknown = null;
  let interrupted = options.signal?.aborted === true;
  const inFlight = new Set<Promise<void>>();
  const limit = Math.max(1, options.workers);

  const launch = (s: PointState, r: number): void => {
    s.inFlight++;
    const task = runner
      .run(s.spec.index, r)
      .then((record) => {
        s.records.set(r, record);
        options.journal?.append(record);
        ran++;
        done++;
        decide(s, rule);
        options.onProgress?.(done, total);
      })
      .catch((error: unknown) => {
        if (!interrupted && failure === null) failure = error;
      })
      .finally(() => {
        s.inFlight--;
        inFlight.delete(task);
      });
    inFlight.add(task);
  };

  const onAbort = (): void => {
    interrupted = true;
  };
  options.signal?.addEventListener('abort', onAbort);
  try {
    for (;;) {
      if (interrupted || failure !== null) break;
      const next = inFlight.size < limit ? nextTask(states, rule, perPoint, limit, wanted) : null;
      if (next !== null) {
        launch(next.state, next.replication);
        continue;
      }
      if (inFlight.size === 0) break;
      await Promise.race(inFlight);
    }
  } finally {
    options.signal?.removeEventListener('abort', onAbort);
    await closeRunner(runner, interrupted || failure !== null, inFlight);
  }
  if (failure !== null) throw failure;
  if (interrupted) return { points: [], interrupted: true, ran };
  const level = points[0]?.config.confidence_level ?? 0.95;
  const results = states.map((s) => assemblePoint(s.spec, recordsOf(s, wanted), level, stopCauseOf(s, rule)));
  return { points: results, interrupted: false, ran };
}

/**
 * Results of whole points from their records (a merge of shards): fixed counts need every replication;
 * with the sequential rule each point stops where the rule decides on its prefix. Returns the results
 * or a message naming what is missing.
 */
export function assembleResults(points: readonly PointSpec[], rule: ReplicationRule, records: readonly ReplicationRecord[]): PointResult[] | string {
  const perPoint = rule.kind === 'fixed' ? rule.count : rule.max;
  const states: PointState[] = points.map((spec) => ({ spec, records: new Map(), decided: rule.kind === 'fixed' ? rule.count : null, checked: 0, next: 0, inFlight: 0 }));
  for (const record of records) states[record.point]?.records.set(record.replication, record);
  const level = points[0]?.config.confidence_level ?? 0.95;
  const results: PointResult[] = [];
  for (const s of states) {
    decide(s, rule);
    const need = s.decided ?? perPoint;
    const prefix = contiguous(s);
    if (prefix < need) return `point ${s.spec.index} (${s.spec.label}) lacks replication ${prefix}`;
    results.push(assemblePoint(s.spec, recordsOf(s, () => true), level, stopCauseOf(s, rule)));
  }
  return results;
}

function countWanted(s: PointState, perPoint: number, wanted: (s: PointState, r: number) => boolean): number {
  let n = 0;
  for (let r = 0; r < perPoint; r++) if (wanted(s, r)) n++;
  return n;
}

/** The next task to start, or null when none should start now. */
function nextTask(
  states: PointState[],
  rule: ReplicationRule,
  perPoint: number,
  limit: number,
  wanted: (s: PointState, r: number) => boolean,
): { state: PointState; replication: number } | null {
  for (const s of states) {
    const stopAt = s.decided ?? perPoint;
    while (s.next < stopAt && (s.records.has(s.next) || !wanted(s, s.next))) s.next++;
    if (s.next >= stopAt) continue;
    // Sequential rule: run ahead of the decided prefix by at most `limit` replications per point.
    if (rule.kind === 'sequential' && s.decided === null && s.next >= Math.max(rule.min, contiguous(s)) + limit) continue;
    const replication = s.next;
    s.next++;
    return { state: s, replication };
  }
  return null;
}

/** Length of the run of records 0, 1, 2, … without a gap. */
function contiguous(s: PointState): number {
  let n = 0;
  while (s.records.has(n)) n++;
  return n;
}

/** Applies the sequential rule to every new prefix length (in order). */
function decide(s: PointState, rule: ReplicationRule): void {
  if (rule.kind !== 'sequential' || s.decided !== null) return;
  const prefix = contiguous(s);
  const level = s.spec.config.confidence_level;
  for (let n = Math.max(s.checked + 1, rule.min); n <= prefix; n++) {
    s.checked = n;
    const records = Array.from({ length: n }, (_, r) => s.records.get(r) as ReplicationRecord);
    if (sequentialRuleMet(records, rule.metric, rule.gamma, level) || n >= rule.max) {
      s.decided = n;
      return;
    }
  }
}

function recordsOf(s: PointState, wanted: (s: PointState, r: number) => boolean): ReplicationRecord[] {
  const stop = s.decided ?? 0;
  const out: ReplicationRecord[] = [];
  for (let r = 0; r < stop; r++) {
    const record = s.records.get(r);
    if (record !== undefined && wanted(s, r)) out.push(record);
  }
  return out;
}

function stopCauseOf(s: PointState, rule: ReplicationRule): PointResult['stopCause'] {
  if (rule.kind === 'fixed') return 'fixed-count';
  return s.decided !== null && s.decided < rule.max ? 'precision-reached' : 'max-replications';
}

async function closeRunner(runner: TaskRunner, abandon: boolean, inFlight: Set<Promise<void>>): Promise<void> {
  if (!abandon) {
    await Promise.all(inFlight);
  }
  await runner.close();
}
