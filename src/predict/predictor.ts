/**
 * Predictors guess which devices of a group hold data, so that the base station can grant them
 * uplink resources before they contend (the `predicted-grant` policy).
 *
 * A predictor sees only what a base station could see: deliveries (which device, when, and when the
 * base station first saw that access), the outcome of its own grants (used or empty), and device
 * positions. The one exception is `oracle`, a what-if tool that is told the true buffer state through
 * the `truth*` hooks (documented as such).
 *
 * Flags: a device is *flagged* while the predictor holds it as a candidate for a grant. The predictor
 * reports every change with `host.flag(device, on)`; the policy uses these to measure precision and
 * recall against the truth (the predictor itself never reads the truth, except `oracle`).
 */
import type { Simulator } from '../kernel/index.js';
import type { Stream } from '../random/index.js';
import type { Positions } from '../geometry/positions.js';

export interface PredictorHost {
  readonly sim: Simulator;
  /** Number of devices in the group; device indices are 0 … deviceCount − 1 (within the group). */
  readonly deviceCount: number;
  /** Positions of the group's devices, or null when the group has no layout. */
  readonly positions: Positions | null;
  /** Named random stream of this predictor. */
  stream(purpose: string): Stream;
  /** The predictor starts (on = true) or stops (false) holding `device` as a grant candidate. */
  flag(device: number, on: boolean): void;
}

export interface Predictor {
  /**
   * The base station received a packet from `device` at time `t`; it first saw that access at
   * `seenStart` (the grant it issued, or the occasion of the successful preamble).
   */
  observeDelivery(device: number, t: number, seenStart: number): void;
  /**
   * The grant given to `device` at `grantedAt` carried data (used) or was empty (wasted); the base
   * station learns it at `t`, when the granted subframe has been received.
   */
  observeGrant(device: number, t: number, used: boolean, grantedAt: number): void;
  /** Brings the candidate set up to time `now` (flags of devices that became due by now). */
  advance?(now: number): void;
  /**
   * Chooses up to `k` devices to grant at time `now`, best first, writing their indices into `out`;
   * returns how many were chosen. Chosen devices stop being flagged (call host.flag(d, false)). A
   * predictor may also choose devices that are not flagged (e.g. the oracle's false alarms).
   */
  select(now: number, k: number, out: Int32Array): number;
  /**
   * Devices flagged by mistake at this occasion that are not held as candidates (transient false
   * alarms, oracle only); counted in the precision denominator. 0 for other predictors.
   */
  transientFalseAlarms(): number;
  /**
   * Oracle only: the device now holds a packet waiting for a grant (truth); `again` when it is the same
   * packet waiting again after all its HARQ transmissions failed (no new recall draw).
   */
  truthWaiting?(device: number, again?: boolean): void;
  /** Oracle only: the device's waiting packet was served or left grant access (truth). */
  truthDone?(device: number): void;
}
