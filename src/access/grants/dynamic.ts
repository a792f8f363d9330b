/**
 * Dynamic grants (`random-grant`, `predicted-grant`): at every grant occasion the group's selector
 * picks devices, each gets a grant for the transmission subframe `grant_delay` later. The base station
 * learns whether a grant carried a packet only when that subframe has been received, at u + tti: the
 * outcomes of one occasion reach the selector then, in one kernel event, in grant order.
 */
import type { Simulator } from '../../kernel/index.js';
import type { Ledger } from '../../metrics/ledger.js';
import type { GrantedAccess, GrantFrontEnd } from './granted-access.js';
import type { GrantSelector } from './selectors.js';

export class DynamicGrants implements GrantFrontEnd {
  private readonly chosen: Int32Array;
  // Outcomes waiting to be observed, per occasion (a ring indexed by occasion number).
  private readonly ring: number;
  private readonly pendingDevice: Int32Array;
  private readonly pendingUsed: Uint8Array;
  private readonly pendingCount: Int32Array;
  private readonly pendingGrantTime: Float64Array;
  private readonly outcomeKind: number;
  private readonly grantPeriod: number;
  private readonly observeDelay: number;
  private readonly sim: Simulator;

  constructor(
    readonly access: GrantedAccess,
    private readonly selector: GrantSelector,
    private readonly ledger: Ledger,
    /** Most grants per occasion for this group (Infinity: whatever is free). */
    readonly budget: number,
    sim: Simulator,
    group: string,
    timing: { readonly grantPeriod: number; readonly grantDelay: number; readonly tti: number },
  ) {
    const capacity = Math.max(1, Math.min(access.count, Number.isFinite(budget) ? budget : access.count));
    this.chosen = new Int32Array(capacity);
    this.grantPeriod = timing.grantPeriod;
    this.observeDelay = timing.grantDelay + timing.tti;
    let ring = 4;
    while (ring * timing.grantPeriod <= this.observeDelay + timing.grantPeriod) ring *= 2;
    this.ring = ring;
    this.pendingDevice = new Int32Array(ring * capacity);
    this.pendingUsed = new Uint8Array(ring * capacity);
    this.pendingCount = new Int32Array(ring);
    this.pendingGrantTime = new Float64Array(ring);
    this.outcomeKind = sim.defineEvent(`grants/${group}/outcomes`, (occasion, t) => this.observe(occasion, t));
    this.sim = sim;
  }

  /** Grants up to `free` devices at occasion `s` for subframe `u`; returns the grants issued. */
  occasion(s: number, u: number, free: number): number {
    const k = Math.min(free, this.budget, this.chosen.length);
    const access = this.access;
    if (this.selector.predicts) {
      this.selector.advance(s);
      this.ledger.flagSample(access.groupIndex, s, access.flaggedCount, access.flaggedWithData);
    }
    if (k <= 0) return 0;
    const n = this.selector.select(s, k, this.chosen);
    if (this.selector.predicts) this.ledger.flagSample(access.groupIndex, s, this.selector.transientFalseAlarms(), 0);
    if (n === 0) return 0;
    // The outcome event is queued before the grants' transmissions, so a predictor hears "used" before
    // the delivery that follows at the same instant.
    const occasion = Math.round(s / this.grantPeriod);
    const slot = occasion & (this.ring - 1);
    const base = slot * this.chosen.length;
    this.pendingCount[slot] = n;
    this.pendingGrantTime[slot] = s;
    this.sim.at(s + this.observeDelay, this.outcomeKind, occasion);
    for (let j = 0; j < n; j++) {
      const i = this.chosen[j] as number;
      this.pendingDevice[base + j] = i;
      this.pendingUsed[base + j] = access.grant(i, s, u) ? 1 : 0;
    }
    return n;
  }

  private observe(occasion: number, t: number): void {
    const slot = occasion & (this.ring - 1);
    const base = slot * this.chosen.length;
    const grantedAt = this.pendingGrantTime[slot] as number;
    const n = this.pendingCount[slot] as number;
    this.pendingCount[slot] = 0;
    for (let j = 0; j < n; j++) this.selector.observeGrant(this.pendingDevice[base + j] as number, t, this.pendingUsed[base + j] === 1, grantedAt);
  }

  waiting(i: number, again: boolean): void {
    this.selector.truthWaiting(i, again);
  }

  stoppedWaiting(i: number): void {
    this.selector.truthDone(i);
  }

  finished(i: number, t: number, delivered: boolean, seenStart: number): void {
    if (delivered) this.selector.observeDelivery(i, t, seenStart);
  }
}
