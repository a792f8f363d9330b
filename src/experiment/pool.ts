/**
 * Where replications run: in this thread (one worker), or in a pool of worker threads. Both give the
 * same records — a record depends only on (config, point, replication) — so the number of workers
 * never changes a result.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { PointSpec } from './plan.js';
import { ReplicationError, runReplication, type ReplicationRecord } from './replicate.js';
import type { FromWorker, ToWorker } from './worker.js';

export interface TaskRunner {
  run(point: number, replication: number): Promise<ReplicationRecord>;
  close(): Promise<void>;
}

/** Runs each task in this thread, yielding to the event loop first so that signals are handled. */
class InlineRunner implements TaskRunner {
  constructor(
    private readonly points: readonly PointSpec[],
    private readonly baseDir: string,
  ) {}

  async run(point: number, replication: number): Promise<ReplicationRecord> {
    await new Promise((resolve) => setImmediate(resolve));
    const spec = this.points[point];
    if (spec === undefined) throw new Error(`no point ${point}`);
    return runReplication(spec.config, spec.index, replication, undefined, this.baseDir);
  }

  async close(): Promise<void> {}
}

/**
 * The worker script: the bundled one next to the bundled command (dist/bundle/worker.mjs), the
 * compiled one next to this module (dist/src/experiment/worker.js), or — for tests, which run the
 * TypeScript sources — the compiled twin in dist/.
 */
function workerScript(): URL {
  for (const relative of ['./worker.mjs', './worker.js', '../../dist/src/experiment/worker.js']) {
    const url = new URL(relative, import.meta.url);
    if (existsSync(fileURLToPath(url))) return url;
  }
  throw new Error('the compiled worker is missing: run `npm run build`');
}

interface Pending {
  resolve(record: ReplicationRecord): void;
  reject(error: Error): void;
}

/** A fixed pool of worker threads; tasks go to the first idle worker. */
class ThreadPool implements TaskRunner {
  private readonly workers: Worker[] = [];
  private readonly idle: Worker[] = [];
  private readonly queue: Array<{ message: ToWorker; pending: Pending }> = [];
  private readonly pending = new Map<number, Pending>();
  private readonly busy = new Map<Worker, number>();
  private nextId = 0;
  private closed = false;

  constructor(size: number, points: readonly PointSpec[], baseDir: string) {
    const script = workerScript();
    for (let k = 0; k < size; k++) {
      const worker = new Worker(script);
      worker.postMessage({ kind: 'init', points, baseDir } satisfies ToWorker);
      worker.on('message', (message: FromWorker) => this.answered(worker, message));
      worker.on('error', (error) => this.lost(worker, error));
      worker.on('exit', (code) => this.lost(worker, new Error(`a worker thread stopped unexpectedly (exit code ${code})`)));
      this.workers.push(worker);
      this.idle.push(worker);
    }
  }

  run(point: number, replication: number): Promise<ReplicationRecord> {
    if (this.closed) return Promise.reject(new Error('the pool is closed'));
    return new Promise((resolve, reject) => {
      const message: ToWorker = { kind: 'task', id: this.nextId++, point, replication };
      this.queue.push({ message, pending: { resolve, reject } });
      this.dispatch();
    });
  }

  private dispatch(): void {
    while (this.idle.length > 0 && this.queue.length > 0) {
      const worker = this.idle.pop() as Worker;
      const { message, pending } = this.queue.shift() as { message: ToWorker & { kind: 'task' }; pending: Pending };
      this.pending.set(message.id, pending);
      this.busy.set(worker, message.id);
      worker.postMessage(message);
    }
  }

  private answered(worker: Worker, message: FromWorker): void {
    const pending = this.pending.get(message.id);
    this.pending.delete(message.id);
    this.busy.delete(worker);
    this.idle.push(worker);
    if (pending !== undefined) {
      if (message.kind === 'done') pending.resolve(message.record as ReplicationRecord);
      else if (message.seed !== null) pending.reject(new ReplicationError(message.message.replace(/ \(point .*\)$/, ''), message.point, message.replication, message.seed));
      else pending.reject(new Error(message.message));
    }
    this.dispatch();
  }

  /**
   * A worker died (an uncaught error, out of memory, or it exited): its task fails with the error and
   * the worker leaves the pool; when no worker is left, every queued task fails too (none would run).
   */
  private lost(worker: Worker, error: Error): void {
    if (this.closed || !this.workers.includes(worker)) return;
    this.workers.splice(this.workers.indexOf(worker), 1);
    const at = this.idle.indexOf(worker);
    if (at >= 0) this.idle.splice(at, 1);
    const id = this.busy.get(worker);
    this.busy.delete(worker);
    if (id !== undefined) {
      this.pending.get(id)?.reject(error);
      this.pending.delete(id);
    }
    if (this.workers.length === 0) for (const { pending } of this.queue.splice(0)) pending.reject(error);
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const { pending } of this.queue.splice(0)) pending.reject(new Error('interrupted'));
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}

export function createRunner(workers: number, points: readonly PointSpec[], baseDir: string): TaskRunner {
  return workers <= 1 ? new InlineRunner(points, baseDir) : new ThreadPool(workers, points, baseDir);
}
