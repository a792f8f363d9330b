/**
 * The grant scheduler of the cell: at every grant occasion s (every `grant_period`, from 0) it works out
 * the free units of the transmission subframe u = s + grant_delay — capacity minus configured-grant
 * reservations minus what Msg3 and earlier grants already booked there — and hands them to the groups
 * with dynamic grants, in the order of the experiment file, each up to its own budget.
 */
import type { Simulator } from '../../kernel/index.js';
import type { ConfiguredGrants } from './configured.js';
import type { DynamicGrants } from './dynamic.js';
import type { UplinkPool } from './pool.js';
import type { UplinkParams } from './params.js';

export class GrantScheduler {
  private readonly kind: number;

  constructor(
    private readonly sim: Simulator,
    private readonly uplink: UplinkParams,
    private readonly pool: UplinkPool,
    private readonly dynamic: readonly DynamicGrants[],
    private readonly configured: readonly ConfiguredGrants[],
  ) {
    this.kind = sim.defineEvent('grants/occasion', (_index, s) => this.occasion(s));
  }

  start(): void {
    if (this.dynamic.length > 0) this.sim.at(0, this.kind, 0);
  }

  /** Units reserved by configured grants on subframe u. */
  reservedAt(u: number): number {
    let r = 0;
    for (const c of this.configured) r += c.reservedAt(u);
    return r;
  }

  private occasion(s: number): void {
    this.sim.at(s + this.uplink.grant_period, this.kind, 0);
    const u = s + this.uplink.grant_delay;
    let free = this.pool.freeAt(u, this.reservedAt(u));
    for (const group of this.dynamic) {
      free -= group.occasion(s, u, free);
    }
  }
}
