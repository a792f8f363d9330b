/**
 * How a dynamic grant policy picks the devices to grant at an occasion. Indices are within the group.
 * `random-grant` draws uniformly among all devices of the group; `predicted-grant` asks a predictor.
 */
import type { Stream } from '../../random/index.js';
import { sampleWithoutReplacement } from '../../random/index.js';
import type { Predictor } from '../../predict/predictor.js';

export interface GrantSelector {
  select(now: number, k: number, out: Int32Array): number;
  /** Devices flagged by mistake at the last occasion and not held as candidates (precision denominator). */
  transientFalseAlarms(): number;
  /** Brings the selector's candidates up to time `now` (before flags are sampled for precision). */
  advance(now: number): void;
  /** Truth hooks (used by the oracle only). */
  truthWaiting(i: number, again: boolean): void;
  truthDone(i: number): void;
  observeDelivery(i: number, t: number, seenStart: number): void;
  /** The base station learns at `t` whether the grant it gave device i at `grantedAt` carried a packet. */
  observeGrant(i: number, t: number, used: boolean, grantedAt: number): void;
  /** Whether the selector flags devices (predictors) — precision and recall are reported only then. */
  readonly predicts: boolean;
}

export class RandomSelector implements GrantSelector {
  readonly predicts = false;
  constructor(
    private readonly stream: Stream,
    private readonly deviceCount: number,
  ) {}

  select(_now: number, k: number, out: Int32Array): number {
    return sampleWithoutReplacement(this.stream, this.deviceCount, Math.min(k, this.deviceCount, out.length), out);
  }

  transientFalseAlarms(): number {
    return 0;
  }
  advance(): void {}
  truthWaiting(): void {}
  truthDone(): void {}
  observeDelivery(): void {}
  observeGrant(): void {}
}

export class PredictorSelector implements GrantSelector {
  readonly predicts = true;
  constructor(private readonly predictor: Predictor) {}

  select(now: number, k: number, out: Int32Array): number {
    return this.predictor.select(now, k, out);
  }
  transientFalseAlarms(): number {
    return this.predictor.transientFalseAlarms();
  }
  advance(now: number): void {
    this.predictor.advance?.(now);
  }
  truthWaiting(i: number, again: boolean): void {
    this.predictor.truthWaiting?.(i, again);
  }
  truthDone(i: number): void {
    this.predictor.truthDone?.(i);
  }
  observeDelivery(i: number, t: number, seenStart: number): void {
    this.predictor.observeDelivery(i, t, seenStart);
  }
  observeGrant(i: number, t: number, used: boolean, grantedAt: number): void {
    this.predictor.observeGrant(i, t, used, grantedAt);
  }
}
