/**
 * The device side of granted uplink, shared by every grant policy: a device with a packet waits for a
 * grant; a grant that finds it waiting starts a transmission `grant_delay` later with HARQ; a grant that
 * finds it without a waiting packet is wasted. While waiting, a group may fall back to the contention
 * procedure after `fallback_after` (hybrid access) or give the packet up after `max_wait`.
 *
 * Modelling choices: a packet whose HARQ transmissions all fail goes back to waiting for a grant (its
 * fallback / max-wait clock keeps running from its first wait); one grant carries one packet; a grant
 * to a device that is not waiting (idle, transmitting, or contending after fallback) is wasted.
 */
import type { Stream } from '../../random/index.js';
import type { AccessPolicy, PolicyContext, PolicyHost } from '../policy.js';
import type { ContentionProcedure } from '../contention/procedure.js';
import type { UplinkPool } from './pool.js';
import type { UplinkParams } from './params.js';

const IDLE = 0;
const WAITING = 1;
const IN_FLIGHT = 2;
const CONTENDING = 3;

export interface WaitRules {
  /** ms; Infinity: never fall back. */
  readonly fallbackAfter: number;
  /** ms; Infinity: never give up. */
  readonly maxWait: number;
  /** Share of waiting time spent monitoring for a grant (energy model). */
  readonly monitoring: number;
}

/** Hooks a front-end (dynamic or configured grants) receives. */
export interface GrantFrontEnd {
  /** The packet of group device i started waiting for a grant (`again`: after all HARQ transmissions failed). */
  waiting(i: number, again: boolean): void;
  /** Group device i stopped waiting (granted, fell back, dropped). */
  stoppedWaiting(i: number): void;
  /** A packet of device i ended (any path); seenStart as in AccessPolicy.finished. */
  finished(i: number, t: number, delivered: boolean, seenStart: number): void;
}

export class GrantedAccess implements AccessPolicy {
  readonly first: number;
  readonly count: number;
  readonly groupIndex: number;
  private readonly host: PolicyHost;
  private readonly contention: ContentionProcedure;
  private readonly uplink: UplinkParams;
  readonly pool: UplinkPool;
  private readonly harq: Stream;
  private readonly rules: WaitRules;
  front: GrantFrontEnd | null = null;

  private readonly state: Uint8Array;
  private readonly waitSince: Float64Array;
  private readonly timerAt: Float64Array;
  /** Start of the current stretch of waiting (energy); waitSince keeps the packet's first wait. */
  private readonly monitorSince: Float64Array;
  private readonly grantedAt: Float64Array;
  private readonly outcomeOk: Uint8Array;
  /** Flag bookkeeping for measured precision and recall (predictors only). */
  private readonly flagged: Uint8Array;
  private readonly packetFlagged: Uint8Array;
  private readonly recallCounted: Uint8Array;
  flaggedCount = 0;
  flaggedWithData = 0;

  private readonly timerKind: number;
  private readonly txEndKind: number;

  constructor(ctx: PolicyContext, rules: WaitRules) {
    this.first = ctx.firstDevice;
    this.count = ctx.deviceCount;
    this.groupIndex = ctx.groupIndex;
    this.host = ctx.host;
    this.contention = ctx.contention;
    this.uplink = ctx.uplink;
    this.pool = ctx.pool;
    this.rules = rules;
    this.harq = ctx.streams.stream(`grants/${ctx.group}/harq`);
    this.state = new Uint8Array(ctx.deviceCount);
    this.waitSince = new Float64Array(ctx.deviceCount);
    this.timerAt = new Float64Array(ctx.deviceCount).fill(Number.NaN);
    this.monitorSince = new Float64Array(ctx.deviceCount);
    this.grantedAt = new Float64Array(ctx.deviceCount).fill(Number.NaN);
    this.outcomeOk = new Uint8Array(ctx.deviceCount);
    this.flagged = new Uint8Array(ctx.deviceCount);
    this.packetFlagged = new Uint8Array(ctx.deviceCount);
    this.recallCounted = new Uint8Array(ctx.deviceCount);
    const sim = ctx.host.sim;
    this.timerKind = sim.defineEvent(`grants/${ctx.group}/wait-timer`, (i, t) => this.timerFired(i, t));
    this.txEndKind = sim.defineEvent(`grants/${ctx.group}/transmission-end`, (i, t) => this.transmissionEnded(i, t));
  }

  private get ledger() {
    return this.host.ledger;
  }

  isWaiting(i: number): boolean {
    return this.state[i] === WAITING;
  }

  begin(device: number): void {
    const i = device - this.first;
    const now = this.host.sim.now;
    this.waitSince[i] = now;
    this.grantedAt[i] = Number.NaN;
    this.packetFlagged[i] = this.flagged[i] as number;
    this.recallCounted[i] = 0;
    this.enterWaiting(i, now, false);
  }

  /** `again`: the same packet waits again after all its HARQ transmissions failed. */
  private enterWaiting(i: number, now: number, again: boolean): void {
    this.state[i] = WAITING;
    this.monitorSince[i] = now;
    if (this.flagged[i] === 1) this.flaggedWithData++;
    const deadline = this.waitSince[i] as number + Math.min(this.rules.fallbackAfter, this.rules.maxWait);
    if (Number.isFinite(deadline)) {
      const at = Math.max(deadline, now);
      this.timerAt[i] = at;
      this.host.sim.at(at, this.timerKind, i);
    }
    this.front?.waiting(i, again);
  }

  private leaveWaiting(i: number, now: number, newState: number): void {
    this.state[i] = newState;
    if (this.flagged[i] === 1) this.flaggedWithData--;
    this.timerAt[i] = Number.NaN;
    this.front?.stoppedWaiting(i);
    const device = this.first + i;
    // Energy: waiting for a grant is spent monitoring for it (share `monitoring`), the rest idle.
    const waited = now - (this.monitorSince[i] as number);
    this.ledger.energy(this.groupIndex, this.host.holArrival[device] as number, 0, waited * this.rules.monitoring, waited * (1 - this.rules.monitoring));
  }

  /** A grant issued at occasion `s` for group device i, transmission at subframe `u`. Returns true if used. */
  grant(i: number, s: number, u: number): boolean {
    this.ledger.grantIssued(this.groupIndex, s);
    if (this.state[i] !== WAITING) {
      this.pool.book(u);
      return false;
    }
    this.transmit(i, s, u);
    return true;
  }

  /** Starts the transmission of device i's packet at subframe u (granted at s); the pool unit of u is booked by the caller's rule. */
  transmit(i: number, s: number, u: number, reserved = false): void {
    const device = this.first + i;
    this.ledger.grantUsed(this.groupIndex, s);
    this.recallResolved(i);
    this.leaveWaiting(i, s, IN_FLIGHT);
    this.grantedAt[i] = s;
    this.host.transmissionStarts(device, u);
    const { error_probability: e, max_transmissions: max, round_trip: rtt } = this.uplink.harq;
    let n = 1;
    if (e > 0) while (n <= max && this.harq.next() < e) n++;
    const sent = Math.min(n, max);
    for (let k = reserved ? 1 : 0; k < sent; k++) this.pool.book(u + k * rtt);
    const end = u + (sent - 1) * rtt + this.uplink.tti;
    this.outcomeOk[i] = n <= max ? 1 : 0;
    // Energy: one TTI transmitting and one receiving the HARQ feedback per transmission; idle in
    // between. The last feedback comes after `end`, so [s, end] holds 2·sent − 1 busy TTIs.
    const tti = this.uplink.tti;
    this.ledger.energy(this.groupIndex, this.host.holArrival[device] as number, sent * tti, sent * tti, Math.max(0, end - s - (2 * sent - 1) * tti));
    this.host.sim.at(end, this.txEndKind, i);
  }

  private transmissionEnded(i: number, t: number): void {
    const device = this.first + i;
    if (this.outcomeOk[i] === 1) {
      this.state[i] = IDLE;
      this.host.delivered(device, t, 0, Number.NaN, this.grantedAt[i] as number);
      return;
    }
    // All HARQ transmissions failed: wait for another grant (modelling choice).
    this.enterWaiting(i, t, true);
  }

  private timerFired(i: number, t: number): void {
    if (this.state[i] !== WAITING || this.timerAt[i] !== t) return;
    const device = this.first + i;
    this.recallResolved(i);
    if (Number.isFinite(this.rules.fallbackAfter)) {
      this.leaveWaiting(i, t, CONTENDING);
      this.ledger.fellBack(this.groupIndex, this.host.holArrival[device] as number);
      this.contention.begin(device);
      return;
    }
    this.leaveWaiting(i, t, IDLE);
    this.host.dropped(device, t);
  }

  /**
   * The cell reports the end of every packet of the group. A packet delivered through contention had
   * fallen back: the base station knows its own fallback timer, so it dates the packet's start to the
   * successful preamble's occasion minus `fallback_after` (an estimate it can make; never earlier than
   * the true start).
   */
  finished(device: number, t: number, delivered: boolean, seenStart: number): void {
    const i = device - this.first;
    const start = this.state[i] === CONTENDING ? seenStart - this.rules.fallbackAfter : seenStart;
    this.state[i] = IDLE;
    this.front?.finished(i, t, delivered, start);
  }

  /** Predictor flag changes (precision and recall against the truth). */
  flag(i: number, on: boolean): void {
    const value = on ? 1 : 0;
    if (this.flagged[i] === value) return;
    this.flagged[i] = value;
    const delta = on ? 1 : -1;
    this.flaggedCount += delta;
    if (this.state[i] === WAITING) {
      this.flaggedWithData += delta;
      if (on) this.packetFlagged[i] = 1;
    }
  }

  /** A packet ends its wait for a grant: count it for recall (flagged at least once while waiting?). */
  private recallResolved(i: number): void {
    if (this.recallCounted[i] === 1) return;
    this.recallCounted[i] = 1;
    const device = this.first + i;
    this.ledger.recallOutcome(this.groupIndex, this.host.holArrival[device] as number, this.packetFlagged[i] === 1);
  }
}
