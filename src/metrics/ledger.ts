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

  // Granted uplink.
  readonly grantsIssued: Float64Array;
  readonly grantsUsed: Float64Array;
  readonly fellBackCount: Float64Array;
  /** Packets that ended a wait for a grant, and how many of them a predictor had flagged. */
  readonly recallPackets: Float64Array;
  readonly recallFlagged: Float64Array;
  /** Sums over grant occasions of flagged devices and of flagged devices holding data. */
  readonly flaggedSum: Float64Array;
  readonly flaggedWithDataSum: Float64Array;

  // Energy: time (ms) spent transmitting, receiving/monitoring, idle (awake) on counted packets' accesses.
  readonly txMs: Float64Array;
  readonly rxMs: Float64Array;
  readonly idleMs: Float64Array;

  // Packets in the system (any arrival time), integrated over time from warm-up: mean backlog.
  readonly inSystem: Float64Array;
  readonly inSystemArea: Float64Array;
  private readonly inSystemSince: Float64Array;

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
    this.grantsIssued = new Float64Array(g);
    this.grantsUsed = new Float64Array(g);
    this.fellBackCount = new Float64Array(g);
    this.recallPackets = new Float64Array(g);
    this.recallFlagged = new Float64Array(g);
    this.flaggedSum = new Float64Array(g);
    this.flaggedWithDataSum = new Float64Array(g);
    this.txMs = new Float64Array(g);
    this.rxMs = new Float64Array(g);
    this.idleMs = new Float64Array(g);
    this.inSystem = new Float64Array(g);
    this.inSystemArea = new Float64Array(g);
    this.inSystemSince = new Float64Array(g);
  }

  get groupCount(): number {
    return this.groupNames.length;
  }

  /** Integrates the number of packets in the system of `group` up to `t` (from warm-up on). */
  private integrate(group: number, t: number): void {
    const from = Math.max(this.inSystemSince[group] as number, this.warmup);
    if (t > from) this.inSystemArea[group] = (this.inSystemArea[group] as number) + (this.inSystem[group] as number) * (t - from);
    this.inSystemSince[group] = t;
  }

  /** Closes the backlog integral at the end of the run. */
  closeBacklog(end: number): void {
    for (let g = 0; g < this.groupNames.length; g++) this.integrate(g, end);
  }

  /** A packet arrived at time t (ms). */
  arrival(group: number, t: number): void {
    this.integrate(group, t);
    this.inSystem[group] = (this.inSystem[group] as number) + 1;
    if (t < this.warmup) return;
    this.arrived[group] = (this.arrived[group] as number) + 1;
    this.arrivalTimeSum[group] = (this.arrivalTimeSum[group] as number) + t;
    this.arrivalTimeSquares[group] = (this.arrivalTimeSquares[group] as number) + t * t;
  }

  /**
   * A packet that arrived at `arrival` was delivered at `t` after `preambleTx` preamble transmissions
   * (0 when it never contended), the first of them at `firstPreamble` (NaN when none). Its delay counts
   * from `generated` (the arrival, or for generate-at-will traffic the start of its transmission).
   */
  delivered(group: number, arrival: number, t: number, preambleTx: number, firstPreamble: number, generated = arrival): void {
    this.lastOutcomeTime = t;
    this.integrate(group, t);
    this.inSystem[group] = (this.inSystem[group] as number) - 1;
    if (arrival < this.warmup) return;
    const delay = t - generated;
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
    this.integrate(group, t);
    this.inSystem[group] = (this.inSystem[group] as number) - 1;
    if (arrival < this.warmup) return;
    this.dropped[group] = (this.dropped[group] as number) + 1;
  }

  /** A packet that arrived at `arrival` passed access barring after `wait` ms. */
  barringPass(group: number, arrival: number, wait: number): void {
    if (arrival < this.warmup) return;
    this.barringPassed[group] = (this.barringPassed[group] as number) + 1;
    this.barringDelaySum[group] = (this.barringDelaySum[group] as number) + wait;
  }

  /** A grant was issued to a device of `group` at occasion time s. */
  grantIssued(group: number, s: number): void {
    if (s >= this.warmup) this.grantsIssued[group] = (this.grantsIssued[group] as number) + 1;
  }

  /** A grant (or configured opportunity) at time s carried a packet. */
  grantUsed(group: number, s: number): void {
    if (s >= this.warmup) this.grantsUsed[group] = (this.grantsUsed[group] as number) + 1;
  }

  /** Grants counted arithmetically (configured-grant opportunities in the observation window). */
  grantsIssuedArithmetic(group: number, n: number): void {
    this.grantsIssued[group] = (this.grantsIssued[group] as number) + n;
  }

  /** A packet stopped waiting for a grant and contends instead (hybrid access). */
  fellBack(group: number, arrival: number): void {
    if (arrival >= this.warmup) this.fellBackCount[group] = (this.fellBackCount[group] as number) + 1;
  }

  /** A packet ended its wait for a grant; `flagged` when a predictor had flagged its device meanwhile. */
  recallOutcome(group: number, arrival: number, flagged: boolean): void {
    if (arrival < this.warmup) return;
    this.recallPackets[group] = (this.recallPackets[group] as number) + 1;
    if (flagged) this.recallFlagged[group] = (this.recallFlagged[group] as number) + 1;
  }

  /** At a grant occasion at time s: `flagged` devices flagged, `withData` of them holding data. */
  flagSample(group: number, s: number, flagged: number, withData: number): void {
    if (s < this.warmup) return;
    this.flaggedSum[group] = (this.flaggedSum[group] as number) + flagged;
    this.flaggedWithDataSum[group] = (this.flaggedWithDataSum[group] as number) + withData;
  }

  /** Time a counted packet's device spent transmitting, receiving and idle (awake), in ms. */
  energy(group: number, arrival: number, tx: number, rx: number, idle: number): void {
    if (arrival < this.warmup) return;
    this.txMs[group] = (this.txMs[group] as number) + tx;
    this.rxMs[group] = (this.rxMs[group] as number) + rx;
    this.idleMs[group] = (this.idleMs[group] as number) + idle;
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
