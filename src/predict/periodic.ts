/**
 * `periodic`: learns each device's period and phase from the deliveries the base station observes,
 * and grants the device when its next report is due.
 *
 * Period estimate P̂ per device, from the times `seenStart` at which the base station first saw each
 * access (all in ms), over a growing baseline: P̂ = (last − anchor) / periods, where `anchor` is the
 * first seenStart since the estimate (re)started and `periods` counts the periods since then.
 * - the first estimate is the difference of the first two seenStarts;
 * - a later difference `diff` close to a whole number m ≥ 1 of periods, |diff − m·P̂| ≤
 *   `reset_tolerance`·P̂, adds m periods (a report that was missed or lost counts as such);
 * - any other difference (a changed schedule) restarts the estimate from the last two seenStarts;
 * - the first delivery that came through one of the predictor's own grants (whose seenStart — the
 *   grant time — lags the report by at most the last retry spacing, unlike a delivery through
 *   contention) becomes the new anchor, keeping the current estimate until the next one;
 * - a difference ≤ 0 (two accesses seen at the same instant) is ignored.
 * The error of a baseline estimate shrinks like 1/periods, so the grant time stops drifting from
 * the reports: with strictly periodic reports every grant eventually finds data.
 * A used grant only proves the report was there by the grant: when it was the first grant of the
 * prediction (no empty one before it), the report is dated no later than the prediction itself, so a
 * grant delayed by a full occasion or by rounding to the grant grid never pushes the estimate later
 * (which would make every later grant later still).
 * After each delivery with a known P̂ the device becomes a candidate at predicted + `margin` − `lead`, where
 * predicted = seenStart + P̂, with priority −predicted (earliest due first), until predicted +
 * `patience`. A grant that comes back empty means the report was not there when the grant was given:
 * the device is re-armed `retry_after` after that grant — or when the base station learns that the grant
 * came back empty (the granted subframe received), if that is later — then twice that, four times
 * that… (same priority and expiry), at most `max_retries` times per prediction, so an early prediction
 * is caught within a window that doubles with each empty grant; then it waits for its next delivery.
 * A used grant changes nothing: the delivery that follows re-predicts.
 *
 * Known limitation: a used grant bounds the report only from above, so the predictor cannot see that
 * it aims late. The anchor of a retry-found report is dated up to one retry spacing late (at least the
 * time to learn a grant's outcome, grant_delay + tti), and later grants keep that lateness. On strictly
 * periodic reports the grant lags the report by 1 … 5 ms rather than by `margin` (measured; see
 * test/grants/periodic-predictor.test.ts). A predictor that probes early on purpose would remove it at
 * the price of wasted grants; `lead` is the manual form of that.
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import { CandidateQueue } from './candidates.js';
import type { Predictor, PredictorHost } from './predictor.js';

export const periodicPredictorSchema = z
  .strictObject({
    model: z.literal('periodic'),
    reset_tolerance: z
      .number()
      .positive()
      .lt(0.5)
      .default(0.25)
      .describe('An inter-access time farther than this fraction of the period from a whole number of periods restarts the estimate. Default 0.25.'),
    lead: duration({ description: 'A device becomes a grant candidate this long before its predicted access. Default 0.' }).default(0),
    margin: duration({
      description:
        'Grants aim this long after the predicted report (default 1ms): a grant one occasion late costs a millisecond, an early one a wasted grant. Deliveries through our grants are dated back by it for the period estimate.',
    }).default(1),
    patience: duration({ positive: true, description: 'A device stays a candidate until this long after its predicted access. Default 1s.' }).default(1000),
    retry_after: duration({
      positive: true,
      description: 'After an empty grant the device is a candidate again this much later, doubling with each further empty grant. Default 2ms.',
    }).default(2),
    max_retries: z
      .number()
      .int()
      .min(0)
      .max(20)
      .default(5)
      .describe('Empty grants re-armed per prediction; after that the device waits for its next delivery. Default 5 (2 + 4 + … + 32 ms: a 62 ms window).'),
  })
  .describe('Learns each device\'s period and phase from observed deliveries and grants it when its next report is due.');

export type PeriodicPredictorParams = z.output<typeof periodicPredictorSchema>;

export class PeriodicPredictor implements Predictor {
  private readonly params: PeriodicPredictorParams;
  private readonly queue: CandidateQueue;
  /** Last seenStart per device (ms), NaN before the first delivery. */
  private readonly lastSeen: Float64Array;
  /** Period estimate per device (ms), NaN while unknown. */
  private readonly period: Float64Array;
  /** Start of the estimate's baseline and the whole periods it spans. */
  private readonly anchor: Float64Array;
  private readonly periods: Int32Array;
  /** 1 when the anchor came through a grant of ours (precise). */
  private readonly anchorPrecise: Uint8Array;
  /** Time of the last grant of ours that carried a packet of the device (ms), NaN if none. */
  private readonly lastUsedGrant: Float64Array;
  /** Predicted access time of the current prediction (ms), NaN if none. */
  private readonly predicted: Float64Array;
  /** Empty grants re-armed for the current prediction. */
  private readonly retries: Int32Array;

  constructor(params: PeriodicPredictorParams, host: PredictorHost) {
    const n = host.deviceCount;
    this.params = params;
    this.queue = new CandidateQueue(n, host);
    this.lastSeen = new Float64Array(n).fill(NaN);
    this.period = new Float64Array(n).fill(NaN);
    this.anchor = new Float64Array(n).fill(NaN);
    this.periods = new Int32Array(n);
    this.anchorPrecise = new Uint8Array(n);
    this.lastUsedGrant = new Float64Array(n).fill(NaN);
    this.predicted = new Float64Array(n).fill(NaN);
    this.retries = new Int32Array(n);
  }

  /** The period estimate of `device` in ms (NaN while unknown). */
  periodEstimate(device: number): number {
    return this.period[device] as number;
  }

  /** The predicted time of the device's next access in ms (NaN if none). */
  predictedAccess(device: number): number {
    return this.predicted[device] as number;
  }

  /** True while `device` is a grant candidate (flagged). */
  isCandidate(device: number): boolean {
    return this.queue.isReady(device);
  }

  observeDelivery(device: number, t: number, seenStart: number): void {
    this.queue.advance(t);
    // Through one of our grants exactly when the access was first seen at a grant of ours that came
    // back used (grant outcomes are observed no later than the delivery they carried).
    const precise = seenStart === this.lastUsedGrant[device];
    if (Number.isNaN(seenStart)) return;
    // A grant of ours was aimed `margin` after the predicted report: date the report back by it, and
    // never later than the prediction when the first grant already found it.
    if (precise) {
      seenStart -= this.params.margin;
      const predicted = this.predicted[device] as number;
      if (this.retries[device] === 0 && seenStart > predicted) seenStart = predicted;
    }
    const last = this.lastSeen[device] as number;
    if (!Number.isNaN(last) && !(seenStart > last)) return;
    this.lastSeen[device] = seenStart;
    if (Number.isNaN(last)) return;
    const p = this.updatePeriod(device, last, seenStart, precise);
    const predicted = seenStart + p;
    this.predicted[device] = predicted;
    this.retries[device] = 0;
    this.queue.schedule(device, predicted + this.params.margin - this.params.lead, -predicted, predicted + this.params.patience);
  }

  advance(now: number): void {
    this.queue.advance(now);
  }

  /** The base station learns at `t` that the grant given at `grantedAt` was used or came back empty. */
  observeGrant(device: number, t: number, used: boolean, grantedAt: number): void {
    this.queue.advance(t);
    if (used) {
      this.lastUsedGrant[device] = grantedAt;
      return;
    }
    const predicted = this.predicted[device] as number;
    if (Number.isNaN(predicted) || (this.retries[device] as number) >= this.params.max_retries) return;
    const retries = this.retries[device] as number;
    this.retries[device] = retries + 1;
    // The report was not there at grantedAt: look again retry_after·2^j after that grant, but not before
    // the base station knows the grant came back empty.
    this.queue.schedule(device, Math.max(t, grantedAt + this.params.retry_after * 2 ** retries), -predicted, predicted + this.params.patience);
  }

  select(now: number, k: number, out: Int32Array): number {
    this.queue.advance(now);
    return this.queue.take(k, out);
  }

  transientFalseAlarms(): number {
    return 0;
  }

  /** Adds the access seen at `seen` (after one at `last`) to the baseline; returns the new estimate. */
  private updatePeriod(device: number, last: number, seen: number, precise: boolean): number {
    const old = this.period[device] as number;
    if (precise && this.anchorPrecise[device] === 0 && !Number.isNaN(old)) {
      this.anchor[device] = seen;
      this.periods[device] = 0;
      this.anchorPrecise[device] = 1;
      return old;
    }
    const diff = seen - last;
    const m = Number.isNaN(old) ? 0 : Math.round(diff / old);
    if (m >= 1 && Math.abs(diff - m * old) <= this.params.reset_tolerance * old) {
      this.periods[device] = (this.periods[device] as number) + m;
    } else {
      this.anchor[device] = last;
      this.periods[device] = 1;
      this.anchorPrecise[device] = 0;
    }
    const next = (seen - (this.anchor[device] as number)) / (this.periods[device] as number);
    this.period[device] = next;
    return next;
  }
}

export function createPeriodicPredictor(params: PeriodicPredictorParams, host: PredictorHost): PeriodicPredictor {
  return new PeriodicPredictor(params, host);
}
