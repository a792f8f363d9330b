/**
 * End-of-replication views of the ledger that metrics are computed from: one tally per group and one
 * for the whole cell (sums over groups), plus cell-wide context.
 */
import { LogLinearHistogram } from '../stats/index.js';
import type { Ledger } from './ledger.js';

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
}

export interface InProgressCounts {
  readonly inProgress: Float64Array;
  readonly inProgressLate: Float64Array;
}

export function groupTally(ledger: Ledger, g: number, open: InProgressCounts): Tally {
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
  };
}
