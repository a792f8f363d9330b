/**
 * The ledger: hot-path counters of one replication, per device group.
 *
 * Access procedures and the cell report outcomes through these typed hooks; nothing here knows which
 * policy produced them. Metrics (see catalogue.ts) are pure functions of the ledger computed once at
 * the end of the replication.
 *
 * Warm-up: a packet counts when it arrives at or after `warmup`; a preamble transmission and an
 * occasion count when the occasion is at or after `warmup`.
 */
import { LogLinearHistogram } from '../stats/index.js';

export interface LedgerOptions {
  readonly groupNames: readonly string[];
  /** Per group deadline in ms (Infinity: none). */
  readonly deadlines: readonly number[];
  readonly warmup: number;
  /** Largest preamble transmission count a completed access can have (the distribution's length). */
  readonly maxPreambleTransmissions: number;
}

export class Ledger {
  readonly groupNames: readonly string[];
  readonly deadlines: Float64Array;
  readonly warmup: number;
  readonly maxTx: number;

  // Packets (counted ones only).
  readonly arrived: Float64Array;
  readonly completed: Float64Array;
  readonly dropped: Float64Array;
  readonly deadlineMet: Float64Array;
  readonly arrivalTimeSum: Float64Array;
  readonly arrivalTimeSquares: Float64Array;
  readonly completedPreambleTx: Float64Array;
  /** completedByTx[g·(maxTx+1) + k]: completed accesses that needed k preamble transmissions. */
  readonly completedByTx: Float64Array;
  readonly delay: LogLinearHistogram[];
  readonly delayFromFirstPreamble: LogLinearHistogram[];
  readonly barringPassed: Float64Array;
  readonly barringDelaySum: Float64Array;

  // Preamble transmissions (at counted occasions).
  readonly preambleTx: Float64Array;
  readonly collidedTx: Float64Array;

  // Occasion level (cell wide).
  firstActiveOccasion = -1;
  lastActiveOccasion = -1;
  singletonPreambles = 0;
  collidedPreambles = 0;
  usedPreambles = 0;

  /** Time of the last processed event that changed a packet's fate (ms). */
  lastOutcomeTime = 0;

  constructor(options: LedgerOptions) {
    const g = options.groupNames.length;
    this.groupNames = options.groupNames;
    this.deadlines = Float64Array.from(options.deadlines);
    this.warmup = options.warmup;
    this.maxTx = options.maxPreambleTransmissions;
    this.arrived = new Float64Array(g);
    this.completed = new Float64Array(g);
    this.dropped = new Float64Array(g);
    this.deadlineMet = new Float64Array(g);
    this.arrivalTimeSum = new Float64Array(g);
    this.arrivalTimeSquares = new Float64Array(g);
    this.completedPreambleTx = new Float64Array(g);
    this.completedByTx = new Float64Array(g * (this.maxTx + 1));
    this.delay = Array.from({ length: g }, () => new LogLinearHistogram());
    this.delayFromFirstPreamble = Array.from({ length: g }, () => new LogLinearHistogram());
    this.barringPassed = new Float64Array(g);
    this.barringDelaySum = new Float64Array(g);
    this.preambleTx = new Float64Array(g);
    this.collidedTx = new Float64Array(g);
  }

  get groupCount(): number {
    return this.groupNames.length;
  }

  /** A packet arrived at time t (ms). */
  arrival(group: number, t: number): void {
    if (t < this.warmup) return;
    this.arrived[group] = (this.arrived[group] as number) + 1;
    this.arrivalTimeSum[group] = (this.arrivalTimeSum[group] as number) + t;
    this.arrivalTimeSquares[group] = (this.arrivalTimeSquares[group] as number) + t * t;
  }

  /**
   * A packet that arrived at `arrival` was delivered at `t` after `preambleTx` preamble transmissions
   * (0 when it never contended), the first of them at `firstPreamble` (NaN when none).
   */
  delivered(group: number, arrival: number, t: number, preambleTx: number, firstPreamble: number): void {
    this.lastOutcomeTime = t;
    if (arrival < this.warmup) return;
    const delay = t - arrival;
    this.completed[group] = (this.completed[group] as number) + 1;
    this.delay[group]!.add(delay);
    if (delay <= (this.deadlines[group] as number)) this.deadlineMet[group] = (this.deadlineMet[group] as number) + 1;
    if (preambleTx > 0) {
      this.completedPreambleTx[group] = (this.completedPreambleTx[group] as number) + preambleTx;
      const slot = group * (this.maxTx + 1) + Math.min(preambleTx, this.maxTx);
      this.completedByTx[slot] = (this.completedByTx[slot] as number) + 1;
      this.delayFromFirstPreamble[group]!.add(t - firstPreamble);
    }
  }

  /** A packet that arrived at `arrival` was given up at `t`. */
  droppedPacket(group: number, arrival: number, t: number): void {
    this.lastOutcomeTime = t;
    if (arrival < this.warmup) return;
    this.dropped[group] = (this.dropped[group] as number) + 1;
  }

  /** A packet that arrived at `arrival` passed access barring after `wait` ms. */
  barringPass(group: number, arrival: number, wait: number): void {
    if (arrival < this.warmup) return;
    this.barringPassed[group] = (this.barringPassed[group] as number) + 1;
    this.barringDelaySum[group] = (this.barringDelaySum[group] as number) + wait;
  }

  /** A device of `group` sent a preamble at a counted occasion; `collided` when others chose it too. */
  preamble(group: number, collided: boolean): void {
    this.preambleTx[group] = (this.preambleTx[group] as number) + 1;
    if (collided) this.collidedTx[group] = (this.collidedTx[group] as number) + 1;
  }

  /** Occasion `index` (counted) carried `used` distinct preambles, `singletons` of them chosen by one device. */
  occasion(index: number, used: number, singletons: number): void {
    if (this.firstActiveOccasion < 0) this.firstActiveOccasion = index;
    this.lastActiveOccasion = index;
    this.usedPreambles += used;
    this.singletonPreambles += singletons;
    this.collidedPreambles += used - singletons;
  }
}
