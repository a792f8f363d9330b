/**
 * Grant candidates of one predictor. Each device is *absent*, *pending* (it becomes a candidate at
 * its `eligibleAt`) or *ready* (a candidate: flagged through `host.flag`), with a priority (larger =
 * granted first) and an expiry time (a ready device stops being a candidate at `expiresAt`).
 *
 * The queue keeps its own clock: the latest `now` given to {@link CandidateQueue.advance} (−Infinity
 * before the first call). Time never goes back: an earlier `now` is ignored. State changes happen
 * only in calls, so flags change at `schedule`, `advance`, `take` and `remove`:
 * - an entry whose `eligibleAt` is at or before the clock is ready at once;
 * - an entry whose `expiresAt` is at or before the clock (or at or before its `eligibleAt`) is never
 *   ready: it is dropped without being flagged.
 * Three IndexedHeaps: pending by eligibleAt, ready by −priority, and ready with a finite expiry by
 * expiresAt. Ties go to the smaller device index.
 */
import { IndexedHeap } from './indexed-heap.js';

/** What the queue reports flag changes to (a PredictorHost fits). */
export interface FlagSink {
  flag(device: number, on: boolean): void;
}

export class CandidateQueue {
  private readonly host: FlagSink;
  private readonly pending: IndexedHeap;
  private readonly ready: IndexedHeap;
  private readonly expiry: IndexedHeap;
  private readonly priority: Float64Array;
  private readonly expiresAt: Float64Array;
  private clock = -Infinity;

  constructor(deviceCount: number, host: FlagSink) {
    this.host = host;
    this.pending = new IndexedHeap(deviceCount);
    this.ready = new IndexedHeap(deviceCount);
    this.expiry = new IndexedHeap(deviceCount);
    this.priority = new Float64Array(deviceCount);
    this.expiresAt = new Float64Array(deviceCount);
  }

  /** The queue's clock (ms): the latest time given to advance, −Infinity before. */
  get now(): number {
    return this.clock;
  }

  /** Number of ready devices (candidates). */
  get readyCount(): number {
    return this.ready.size;
  }

  /** Number of pending devices. */
  get pendingCount(): number {
    return this.pending.size;
  }

  isReady(device: number): boolean {
    return this.ready.has(device);
  }

  isPending(device: number): boolean {
    return this.pending.has(device);
  }

  /** The priority of a pending or ready device (meaningless when absent). */
  priorityOf(device: number): number {
    return this.priority[device] as number;
  }

  /** The expiry time (ms) of a pending or ready device (meaningless when absent). */
  expiryOf(device: number): number {
    return this.expiresAt[device] as number;
  }

  /**
   * Makes `device` a candidate from `eligibleAt` (ms) until `expiresAt` (ms, exclusive) with
   * `priority`, replacing any entry it had. A ready device that stays ready keeps its flag.
   */
  schedule(device: number, eligibleAt: number, priority: number, expiresAt = Infinity): void {
    if (Number.isNaN(eligibleAt) || Number.isNaN(priority) || Number.isNaN(expiresAt)) {
      throw new RangeError(`CandidateQueue.schedule: NaN time or priority for device ${device}`);
    }
    const wasReady = this.detach(device);
    this.priority[device] = priority;
    this.expiresAt[device] = expiresAt;
    if (expiresAt <= this.clock || expiresAt <= eligibleAt) {
      if (wasReady) this.host.flag(device, false);
    } else if (eligibleAt <= this.clock) {
      this.attachReady(device);
      if (!wasReady) this.host.flag(device, true);
    } else {
      this.pending.insert(device, eligibleAt);
      if (wasReady) this.host.flag(device, false);
    }
  }

  /** Removes `device` (unflagging it if it was ready); returns whether it was present. */
  remove(device: number): boolean {
    if (this.pending.remove(device)) return true;
    if (!this.detach(device)) return false;
    this.host.flag(device, false);
    return true;
  }

  /**
   * Moves the clock to `now` (ignored if earlier): pending devices with eligibleAt ≤ now become ready
   * (flagged) unless already expired; ready devices with expiresAt ≤ now are dropped (unflagged).
   */
  advance(now: number): void {
    if (!(now >= this.clock)) return;
    this.clock = now;
    const pending = this.pending;
    while (pending.size > 0 && pending.peekKey() <= now) {
      const d = pending.pop();
      if ((this.expiresAt[d] as number) <= now) continue;
      this.attachReady(d);
      this.host.flag(d, true);
    }
    const expiry = this.expiry;
    while (expiry.size > 0 && expiry.peekKey() <= now) {
      const d = expiry.pop();
      this.ready.remove(d);
      this.host.flag(d, false);
    }
  }

  /**
   * Pops up to `k` ready devices, highest priority first (ties: smaller index), into out[offset …];
   * each is unflagged and becomes absent. Returns how many were taken.
   */
  take(k: number, out: Int32Array, offset = 0): number {
    let taken = 0;
    const limit = Math.min(k, out.length - offset);
    while (taken < limit && this.ready.size > 0) {
      const d = this.ready.pop();
      this.expiry.remove(d);
      this.host.flag(d, false);
      out[offset + taken++] = d;
    }
    return taken;
  }

  /**
   * Multiplies every stored priority (pending and ready) by `factor` (> 0, finite). The ranking is
   * unchanged except where rounding makes two priorities equal (then the smaller index goes first).
   */
  scalePriorities(factor: number): void {
    if (!(factor > 0 && factor < Infinity)) throw new RangeError(`CandidateQueue.scalePriorities: factor must be finite and > 0, got ${factor}`);
    const p = this.priority;
    for (let d = 0; d < p.length; d++) p[d] = (p[d] as number) * factor;
    this.ready.scaleKeys(factor);
  }

  /** Takes `device` out of the ready heaps; returns whether it was ready (flag not touched). */
  private detach(device: number): boolean {
    this.pending.remove(device);
    this.expiry.remove(device);
    return this.ready.remove(device);
  }

  private attachReady(device: number): void {
    this.ready.insert(device, -(this.priority[device] as number));
    const e = this.expiresAt[device] as number;
    if (e < Infinity) this.expiry.insert(device, e);
  }
}
