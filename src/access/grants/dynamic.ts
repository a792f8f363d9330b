/**
 * Dynamic grants (`random-grant`, `predicted-grant`): at every grant occasion the group's selector
 * picks devices, each gets a grant for the transmission subframe `grant_delay` later.
 */
import type { Ledger } from '../../metrics/ledger.js';
import type { GrantedAccess, GrantFrontEnd } from './granted-access.js';
import type { GrantSelector } from './selectors.js';

export class DynamicGrants implements GrantFrontEnd {
  private readonly chosen: Int32Array;

  constructor(
    readonly access: GrantedAccess,
    private readonly selector: GrantSelector,
    private readonly ledger: Ledger,
    /** Most grants per occasion for this group (Infinity: whatever is free). */
    readonly budget: number,
  ) {
    this.chosen = new Int32Array(Math.max(1, Math.min(access.count, Number.isFinite(budget) ? budget : access.count)));
  }

  /** Grants up to `free` devices at occasion `s` for subframe `u`; returns the grants issued. */
  occasion(s: number, u: number, free: number): number {
    const k = Math.min(free, this.budget, this.chosen.length);
    const access = this.access;
    if (this.selector.predicts) this.ledger.flagSample(access.groupIndex, s, access.flaggedCount, access.flaggedWithData);
    if (k <= 0) return 0;
    const n = this.selector.select(s, k, this.chosen);
    if (this.selector.predicts) this.ledger.flagSample(access.groupIndex, s, this.selector.transientFalseAlarms(), 0);
    for (let j = 0; j < n; j++) {
      const i = this.chosen[j] as number;
      const used = access.grant(i, s, u);
      this.selector.observeGrant(i, s, used);
    }
    return n;
  }

  waiting(i: number): void {
    this.selector.truthWaiting(i);
  }

  stoppedWaiting(i: number): void {
    this.selector.truthDone(i);
  }

  finished(i: number, t: number, delivered: boolean, seenStart: number): void {
    if (delivered) this.selector.observeDelivery(i, t, seenStart);
  }
}
