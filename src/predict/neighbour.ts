/**
 * `neighbour`: for correlated alarms. A delivery from device j at time t is taken as an alarm report;
 * each of the `neighbours` devices nearest to j (within 3σ) gains score k(d) = exp(−d²/(2σ²))
 * (d = distance i–j in metres) — a bounded number per report, so the cost of a report does not grow
 * with the device density — and scores decay with time constant τ = `decay`:
 *   score_i(t) = Σ_reports k(d_r)·e^{−(t − t_r)/τ}.
 * Stored as B_i = Σ k(d_r)·e^{(t_r − t_ref)/τ}, so score_i(t) = B_i·e^{−(t − t_ref)/τ}: ordering by B
 * is the ordering by score at any instant, and a score only changes at reports. A device is a grant
 * candidate while score ≥ `threshold`, i.e. until t_ref + τ·ln(B_i/threshold), with priority B_i.
 * When (t − t_ref)/τ exceeds 500, t_ref moves to t and every B (and candidate priority) is multiplied
 * by e^{(t_ref,old − t)/τ}; expiry times are unchanged by this, and rankings too (up to rounding).
 *
 * The reporter itself is not a candidate: its report resets its own score to 0 (the event it would
 * predict has happened) and holds it back for `quiet_after_report` (alarm devices report once per
 * event); later reports of others can make it a candidate again after that. A selected device is
 * not re-flagged until its grant outcome is known. After an empty grant the device is held back
 * `retry_after` and is a candidate again then if its score is still ≥ threshold.
 *
 * σ is `sigma` metres, or with `sigma: auto` estimated from the data (see pair-sigma.ts), starting
 * from `initial_sigma` until 20 pairs were seen; each report uses the σ of its time (earlier
 * contributions are not recomputed).
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import { length } from '../config/length.js';
import { PointGrid } from '../geometry/grid.js';
import type { Positions } from '../geometry/positions.js';
import { CandidateQueue } from './candidates.js';
import { PairSigmaEstimator } from './pair-sigma.js';
import type { Predictor, PredictorHost } from './predictor.js';

/** Renormalise t_ref when the growth exponent (t − t_ref)/τ passes this (e^500 ≈ 1.4e217). */
export const MAX_EXPONENT = 500;
/** Reports within this many σ of the reporter add to scores (k(3σ) = e^{−4.5} ≈ 0.011). */
const RADIUS_SIGMAS = 3;
/** The grid cell is at least the layout's extent / this (at most ~1M cells, whatever σ is). */
const MAX_GRID_SIDE = 1024;
/** Pairs needed before the automatic σ replaces `initial_sigma`. */
const MIN_PAIRS = 20;

export const neighbourSchema = z
  .strictObject({
    model: z.literal('neighbour'),
    sigma: z
      .union([z.literal('auto'), length({ positive: true })])
      .prefault('100m')
      .describe('Spatial scale σ of the score kernel exp(−d²/(2σ²)): a length (e.g. 100m), or `auto` to estimate it from consecutive reports. Default 100m.'),
    initial_sigma: length({ positive: true, description: 'With `sigma: auto`, σ used until 20 pairs of reports were seen. Default 100m.' }).prefault('100m'),
    pair_window: duration({ positive: true, description: 'With `sigma: auto`, two consecutive reports form a pair only if less than this apart. Default 1s.' }).default(1000),
    decay: duration({ positive: true, description: 'Time constant τ of the exponential decay of scores. Default 5s.' }).default(5000),
    threshold: z
      .number()
      .positive()
      .default(0.2)
      .describe('A device is a grant candidate while its score is at least this (a report at distance 0 adds 1). Default 0.2.'),
    retry_after: duration({
      positive: true,
      description: 'After an empty grant the device is held back this long, doubling with each further empty grant until its own report. Default 20ms.',
    }).default(20),
    quiet_after_report: duration({ description: 'After its own report a device is not a candidate for this long. Default 1min.' }).default(60_000),
    neighbours: z
      .number()
      .int()
      .min(1)
      .max(4096)
      .default(32)
      .describe('How many of the devices nearest to a report (within 3σ) gain score from it. Default 32.'),
  })
  .describe('Grants the neighbours of devices that just reported (correlated alarms); needs device positions.');

export type NeighbourParams = z.output<typeof neighbourSchema>;

/** Tuning that is not part of the experiment file. */
export interface NeighbourOptions {
  /** Renormalise when (t − t_ref)/τ exceeds this; default MAX_EXPONENT (tests use small values). */
  readonly maxExponent?: number;
}

export class NeighbourPredictor implements Predictor {
  private readonly p: NeighbourParams;
  private readonly tau: number;
  private readonly positions: Positions;
  private readonly queue: CandidateQueue;
  private readonly estimator: PairSigmaEstimator | null;
  private readonly b: Float64Array;
  private readonly heldUntil: Float64Array;
  /** 1 from selection until the grant outcome (or a delivery) is observed. */
  private readonly outstanding: Uint8Array;
  /** Empty grants since the device's last own report (the hold doubles with each). */
  private readonly emptyGrants: Uint8Array;
  private grid: PointGrid;
  private gridCell: number;
  /** Smallest grid cell (metres): the layout's larger extent / MAX_GRID_SIDE. */
  private readonly minCell: number;
  private readonly maxExponent: number;
  private tRef = 0;
  // Context of the report being spread (avoids a closure per report).
  private curReporter = -1;
  private curTime = 0;
  private curGrowth = 1;
  private curInv2s2 = 0;
  private readonly nearIndex: Int32Array;
  private readonly nearD2: Float64Array;

  constructor(params: NeighbourParams, host: PredictorHost, options: NeighbourOptions = {}) {
    if (host.positions === null) {
      throw new Error('the `neighbour` predictor needs device positions: give the group a layout');
    }
    const n = host.deviceCount;
    this.p = params;
    this.tau = params.decay;
    this.maxExponent = options.maxExponent ?? MAX_EXPONENT;
    this.positions = host.positions;
    this.queue = new CandidateQueue(n, host);
    this.estimator = params.sigma === 'auto' ? new PairSigmaEstimator(host.positions, params.pair_window, params.initial_sigma, MIN_PAIRS) : null;
    this.b = new Float64Array(n);
    this.heldUntil = new Float64Array(n).fill(-Infinity);
    this.outstanding = new Uint8Array(n);
    this.emptyGrants = new Uint8Array(n);
    this.minCell = extentOf(host.positions) / MAX_GRID_SIDE;
    this.gridCell = Math.max(this.sigma, this.minCell);
    this.grid = new PointGrid(host.positions, this.gridCell);
    this.nearIndex = new Int32Array(params.neighbours + 1);
    this.nearD2 = new Float64Array(params.neighbours + 1);
  }

  /** σ in metres now in use (the fixed value, or the current automatic estimate). */
  get sigma(): number {
    return this.estimator === null ? (this.p.sigma as number) : this.estimator.sigma;
  }

  /** score_i(now) = B_i·e^{−(now − t_ref)/τ}. */
  scoreOf(device: number, now: number): number {
    return (this.b[device] as number) * Math.exp((this.tRef - now) / this.tau);
  }

  /** True while `device` is a grant candidate (flagged). */
  isCandidate(device: number): boolean {
    return this.queue.isReady(device);
  }

  /** The reference time t_ref (ms) of the stored B values. */
  get referenceTime(): number {
    return this.tRef;
  }

  /** A report from `device` at `t` (the delivery time is the report time; `seenStart` is not used). */
  observeDelivery(device: number, t: number, _seenStart?: number): void {
    this.queue.advance(t);
    this.estimator?.observe(device, t);
    this.renormalise(t);
    this.outstanding[device] = 0;
    this.emptyGrants[device] = 0;
    this.b[device] = 0;
    this.heldUntil[device] = Math.max(this.heldUntil[device] as number, t + this.p.quiet_after_report);
    this.queue.remove(device);
    const sigma = this.sigma;
    this.refreshGrid(sigma);
    this.curReporter = device;
    this.curTime = t;
    this.curGrowth = Math.exp((t - this.tRef) / this.tau);
    this.curInv2s2 = 1 / (2 * sigma * sigma);
    const { x, y } = this.positions;
    // The reporter is its own nearest point: ask for one more and skip it.
    const n = this.grid.nearestWithin(x[device] as number, y[device] as number, this.p.neighbours + 1, RADIUS_SIGMAS * sigma, this.nearIndex, this.nearD2);
    for (let k = 0; k < n; k++) this.addReport(this.nearIndex[k] as number, this.nearD2[k] as number);
  }

  advance(now: number): void {
    this.queue.advance(now);
  }

  /** The outcome of a grant, learnt at `t` (the granted subframe received); empty grants hold back from `t`. */
  observeGrant(device: number, t: number, used: boolean, _grantedAt?: number): void {
    this.queue.advance(t);
    this.outstanding[device] = 0;
    if (used) return;
    const empty = this.emptyGrants[device] as number;
    this.emptyGrants[device] = Math.min(empty + 1, 16);
    this.heldUntil[device] = t + this.p.retry_after * 2 ** empty;
    this.renormalise(t);
    this.reconsider(device, t, Math.exp((t - this.tRef) / this.tau));
  }

  select(now: number, k: number, out: Int32Array): number {
    this.queue.advance(now);
    const taken = this.queue.take(k, out);
    for (let i = 0; i < taken; i++) this.outstanding[out[i] as number] = 1;
    return taken;
  }

  transientFalseAlarms(): number {
    return 0;
  }

  private addReport(i: number, d2: number): void {
    if (i === this.curReporter) return;
    this.b[i] = (this.b[i] as number) + Math.exp(-d2 * this.curInv2s2) * this.curGrowth;
    this.reconsider(i, this.curTime, this.curGrowth);
  }

  /** (Re)schedules device i as a candidate if its score at t is ≥ threshold; growth = e^{(t − t_ref)/τ}. */
  private reconsider(i: number, t: number, growth: number): void {
    if (this.outstanding[i] === 1) return;
    const bi = this.b[i] as number;
    const theta = this.p.threshold;
    if (!(bi >= theta * growth)) return;
    const expires = this.tRef + this.tau * Math.log(bi / theta);
    this.queue.schedule(i, Math.max(t, this.heldUntil[i] as number), bi, expires);
  }

  /** Moves t_ref to t when the growth exponent passes maxExponent, rescaling every B. */
  private renormalise(t: number): void {
    if ((t - this.tRef) / this.tau <= this.maxExponent) return;
    const factor = Math.exp((this.tRef - t) / this.tau);
    const b = this.b;
    for (let i = 0; i < b.length; i++) b[i] = (b[i] as number) * factor;
    // A factor that underflows to 0 means every old score is below e^{-745}: reset them.
    if (factor > 0) this.queue.scalePriorities(factor);
    this.tRef = t;
  }

  /**
   * Rebuilds the grid when σ has moved by more than a factor 2 from its cell size (queries are
   * correct with any cell size; this only keeps them fast).
   */
  private refreshGrid(sigma: number): void {
    const cell = Math.max(sigma, this.minCell);
    if (cell <= 2 * this.gridCell && cell >= 0.5 * this.gridCell) return;
    this.gridCell = cell;
    this.grid = new PointGrid(this.positions, cell);
  }
}

/** The larger side of the bounding box of the positions (metres; 0 for fewer than two points). */
function extentOf(p: Positions): number {
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  for (let i = 0; i < p.x.length; i++) {
    const x = p.x[i] as number, y = p.y[i] as number;
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  return p.x.length < 2 ? 0 : Math.max(maxX - minX, maxY - minY);
}

export function createNeighbourPredictor(params: NeighbourParams, host: PredictorHost): NeighbourPredictor {
  return new NeighbourPredictor(params, host);
}
