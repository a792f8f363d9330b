/**
 * End-of-replication views of the ledger that metrics are computed from: one tally per group and one
 * for the whole cell (sums over groups), plus cell-wide context.
 */
import { LogLinearHistogram } from '../stats/index.js';
import type { Ledger } from './ledger.js';
import type { AgeSummary } from './age.js';

export interface Tally {
  readonly arrived: number;
  readonly completed: number;
  readonly dropped: number;
  /** Counted packets still in the system at the end (waiting, contending or being served). */
  readonly inProgress: number;
  /** Of those, how many had already waited longer than their deadline. */
  readonly inProgressLate: number;
  readonly deadlineMet: number;
  /** Packets whose deadline outcome is known: delivered, dropped, or still waiting past the deadline. */
  readonly deadlineJudged: number;
  readonly hasDeadline: boolean;
  readonly arrivalTimeSum: number;
  readonly arrivalTimeSquares: number;
  readonly completedPreambleTx: number;
  /** completedByTx[k]: completed accesses that needed k preamble transmissions (k = 1 … maxTx). */
  readonly completedByTx: Float64Array;
  readonly delay: LogLinearHistogram;
  readonly delayFromFirstPreamble: LogLinearHistogram;
  readonly barringPassed: number;
  readonly barringDelaySum: number;
  readonly preambleTx: number;
  readonly collidedTx: number;
  readonly devices: number;
  readonly grantsIssued: number;
  readonly grantsUsed: number;
  readonly fellBack: number;
  readonly recallPackets: number;
  readonly recallFlagged: number;
  readonly flaggedSum: number;
  readonly flaggedWithDataSum: number;
  readonly txMs: number;
  readonly rxMs: number;
  readonly idleMs: number;
  /** Integral over the observation window of the number of packets in the system (packet·ms). */
  readonly backlogArea: number;
  readonly age: AgeSummary;
}

/** Device power in each state, mW (cell.energy). */
export interface PowerModel {
  readonly transmit_mw: number;
  readonly receive_mw: number;
  readonly idle_mw: number;
  readonly sleep_mw: number;
}

export interface CellContext {
  /** Length of the observation window (from warm-up to the horizon, or to the last outcome), ms. */
  readonly observationMs: number;
  /** Occasions from the first to the last one in which any preamble was sent (TR 37.868 per-opportunity count). */
  readonly occasionsCounted: number;
  readonly preambles: number;
  readonly singletonPreambles: number;
  readonly collidedPreambles: number;
  readonly usedPreambles: number;
  readonly barring: boolean;
  readonly anyDeadline: boolean;
  /** Kernel events processed in the replication. */
  readonly events: number;
  readonly power: PowerModel;
  /** Some group uses grants / a predictor / contention fallback; the run has a horizon. */
  readonly grants: boolean;
  readonly predictors: boolean;
  readonly fallback: boolean;
  readonly horizon: boolean;
}

export interface InProgressCounts {
  readonly inProgress: Float64Array;
  readonly inProgressLate: Float64Array;
}

export function groupTally(ledger: Ledger, g: number, open: InProgressCounts, devices: number, age: AgeSummary): Tally {
  const width = ledger.maxTx + 1;
  return {
    arrived: ledger.arrived[g] as number,
    completed: ledger.completed[g] as number,
    dropped: ledger.dropped[g] as number,
    inProgress: open.inProgress[g] as number,
    inProgressLate: open.inProgressLate[g] as number,
    deadlineMet: ledger.deadlineMet[g] as number,
    deadlineJudged: Number.isFinite(ledger.deadlines[g] as number)
      ? (ledger.completed[g] as number) + (ledger.dropped[g] as number) + (open.inProgressLate[g] as number)
      : 0,
    hasDeadline: Number.isFinite(ledger.deadlines[g] as number),
    arrivalTimeSum: ledger.arrivalTimeSum[g] as number,
    arrivalTimeSquares: ledger.arrivalTimeSquares[g] as number,
    completedPreambleTx: ledger.completedPreambleTx[g] as number,
    completedByTx: ledger.completedByTx.slice(g * width, (g + 1) * width),
    delay: ledger.delay[g]!,
    delayFromFirstPreamble: ledger.delayFromFirstPreamble[g]!,
    barringPassed: ledger.barringPassed[g] as number,
    barringDelaySum: ledger.barringDelaySum[g] as number,
    preambleTx: ledger.preambleTx[g] as number,
    collidedTx: ledger.collidedTx[g] as number,
    devices,
    grantsIssued: ledger.grantsIssued[g] as number,
    grantsUsed: ledger.grantsUsed[g] as number,
    fellBack: ledger.fellBackCount[g] as number,
    recallPackets: ledger.recallPackets[g] as number,
    recallFlagged: ledger.recallFlagged[g] as number,
    flaggedSum: ledger.flaggedSum[g] as number,
    flaggedWithDataSum: ledger.flaggedWithDataSum[g] as number,
    txMs: ledger.txMs[g] as number,
    rxMs: ledger.rxMs[g] as number,
    idleMs: ledger.idleMs[g] as number,
    backlogArea: ledger.inSystemArea[g] as number,
    age,
  };
}

/** The whole cell: sums of the group tallies (deadline counts only over groups that have one). */
export function cellTally(groups: readonly Tally[]): Tally {
  const sum = (f: (t: Tally) => number): number => groups.reduce((acc, t) => acc + f(t), 0);
  const withDeadline = groups.filter((t) => t.hasDeadline);
  const delay = new LogLinearHistogram();
  const fromFirst = new LogLinearHistogram();
  const width = groups[0]?.completedByTx.length ?? 1;
  const byTx = new Float64Array(width);
  for (const t of groups) {
    delay.merge(t.delay);
    fromFirst.merge(t.delayFromFirstPreamble);
    for (let k = 0; k < width; k++) byTx[k] = (byTx[k] as number) + (t.completedByTx[k] as number);
  }
  return {
    arrived: sum((t) => t.arrived),
    completed: sum((t) => t.completed),
    dropped: sum((t) => t.dropped),
    inProgress: sum((t) => t.inProgress),
    inProgressLate: withDeadline.reduce((a, t) => a + t.inProgressLate, 0),
    deadlineMet: withDeadline.reduce((a, t) => a + t.deadlineMet, 0),
    deadlineJudged: withDeadline.reduce((a, t) => a + t.deadlineJudged, 0),
    hasDeadline: withDeadline.length > 0,
    arrivalTimeSum: sum((t) => t.arrivalTimeSum),
    arrivalTimeSquares: sum((t) => t.arrivalTimeSquares),
    completedPreambleTx: sum((t) => t.completedPreambleTx),
    completedByTx: byTx,
    delay,
    delayFromFirstPreamble: fromFirst,
    barringPassed: sum((t) => t.barringPassed),
    barringDelaySum: sum((t) => t.barringDelaySum),
    preambleTx: sum((t) => t.preambleTx),
    collidedTx: sum((t) => t.collidedTx),
    devices: sum((t) => t.devices),
    grantsIssued: sum((t) => t.grantsIssued),
    grantsUsed: sum((t) => t.grantsUsed),
    fellBack: sum((t) => t.fellBack),
    recallPackets: sum((t) => t.recallPackets),
    recallFlagged: sum((t) => t.recallFlagged),
    flaggedSum: sum((t) => t.flaggedSum),
    flaggedWithDataSum: sum((t) => t.flaggedWithDataSum),
    txMs: sum((t) => t.txMs),
    rxMs: sum((t) => t.rxMs),
    idleMs: sum((t) => t.idleMs),
    backlogArea: sum((t) => t.backlogArea),
    age: {
      ageSum: sum((t) => t.age.ageSum),
      reportingDevices: sum((t) => t.age.reportingDevices),
      peakSum: sum((t) => t.age.peakSum),
      peakCount: sum((t) => t.age.peakCount),
    },
  };
}
