/**
 * A worker thread: receives the experiment's points once, then replication tasks; answers each with
 * its record (or the replay coordinates of a failure).
 */
import { parentPort } from 'node:worker_threads';
import type { PointSpec } from './plan.js';
import { ReplicationError, runReplication } from './replicate.js';

export type ToWorker =
  | { readonly kind: 'init'; readonly points: readonly PointSpec[]; readonly baseDir: string }
  | { readonly kind: 'task'; readonly id: number; readonly point: number; readonly replication: number };

export type FromWorker =
  | { readonly kind: 'done'; readonly id: number; readonly record: unknown }
  | { readonly kind: 'failed'; readonly id: number; readonly message: string; readonly point: number; readonly replication: number; readonly seed: string | null };

let points: readonly PointSpec[] = [];
let baseDir = process.cwd();

parentPort?.on('message', (message: ToWorker) => {
  if (message.kind === 'init') {
    points = message.points;
    baseDir = message.baseDir;
    return;
  }
  const spec = points[message.point];
  try {
    if (spec === undefined) throw new Error(`no point ${message.point}`);
    const record = runReplication(spec.config, spec.index, message.replication, undefined, baseDir);
    const reply: FromWorker = { kind: 'done', id: message.id, record };
    parentPort?.postMessage(reply);
  } catch (error) {
    const reply: FromWorker = {
      kind: 'failed',
      id: message.id,
      message: error instanceof ReplicationError ? error.message : error instanceof Error ? (error.stack ?? error.message) : String(error),
      point: message.point,
      replication: message.replication,
      seed: error instanceof ReplicationError ? error.seed : null,
    };
    parentPort?.postMessage(reply);
  }
});
