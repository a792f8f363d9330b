/**
 * Configured grants (`configured-grant`, as NR configured grant type 1): every device owns a periodic
 * transmission opportunity, period `period`, offset (device index mod period) ms, reserved whether used
 * or not. A waiting packet is sent at its device's next opportunity; opportunities that find no waiting
 * packet are wasted. Only devices with data cost events: the wasted opportunities are counted
 * arithmetically at the end.
 */
import type { Ledger } from '../../metrics/ledger.js';
import type { GrantedAccess, GrantFrontEnd } from './granted-access.js';

export class ConfiguredGrants implements GrantFrontEnd {
  private readonly kind: number;

  constructor(
    readonly access: GrantedAccess,
    /** Period in whole ms. */
    readonly period: number,
    private readonly ledger: Ledger,
    private readonly sim: { at(time: number, kind: number, subject: number): void; defineEvent(name: string, h: (s: number, t: number) => void): number; readonly now: number },
    group: string,
  ) {
    this.kind = sim.defineEvent(`grants/${group}/configured-occasion`, (i, t) => this.opportunity(i, t));
  }

  offset(i: number): number {
    return i % this.period;
  }

  /** Reserved opportunities on subframe u (ms). */
  reservedAt(u: number): number {
    const n = this.access.count;
    const p = this.period;
    const full = Math.floor(n / p);
    const rest = n - full * p;
    const phase = ((u % p) + p) % p;
    return full + (phase < rest ? 1 : 0);
  }

  waiting(i: number, _again = false): void {
    const now = this.sim.now;
    const off = this.offset(i);
    const u = off + Math.ceil((now - off) / this.period) * this.period;
    this.sim.at(u, this.kind, i);
  }

  private opportunity(i: number, u: number): void {
    if (!this.access.isWaiting(i)) return;
    this.access.transmit(i, u, u, true);
  }

  stoppedWaiting(): void {}
  finished(): void {}

  /**
   * Opportunities of the whole group in [from, to] (ms), for the wasted-grant count. Both ends are
   * included, as the simulation processes events at exactly the horizon and the ledger counts grants at
   * or after the warm-up: an opportunity used at the horizon is also counted as issued.
   */
  opportunitiesBetween(from: number, to: number): number {
    let total = 0;
    const p = this.period;
    const n = this.access.count;
    // Opportunities of offset o in [from, to]: count of k with from ≤ o + kp ≤ to.
    const countFor = (o: number): number => Math.max(0, Math.floor((to - o) / p) - Math.ceil((from - o) / p) + 1);
    const full = Math.floor(n / p);
    const rest = n - full * p;
    for (let o = 0; o < Math.min(p, n); o++) total += countFor(o) * (full + (o < rest ? 1 : 0));
    return total;
  }

  finalize(from: number, to: number): void {
    this.ledger.grantsIssuedArithmetic(this.access.groupIndex, this.opportunitiesBetween(from, to));
  }
}
