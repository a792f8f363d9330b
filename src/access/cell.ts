/**
 * One cell for one replication: the devices (as typed-array columns), their groups' traffic sources
 * and access policies, the shared contention procedure, the uplink pool and grant scheduler, and the
 * ledger that records outcomes.
 *
 * Packet life cycle: a packet arrives (traffic) → if the device is idle it becomes the head-of-line
 * packet and the group's policy is asked to send it; otherwise it waits in the device's buffer (FIFO).
 * When the packet is delivered or dropped, the next buffered packet (if any) starts at once.
 * Modelling choice: one access carries one packet.
 */
import { Simulator } from '../kernel/index.js';
import type { StreamSet } from '../random/index.js';
import { Ledger } from '../metrics/ledger.js';
import { AgeTracker, type AgeSummary } from '../metrics/age.js';
import type { InProgressCounts } from '../metrics/tally.js';
import type { TrafficParams } from '../traffic/registry.js';
import { trafficModel } from '../traffic/registry.js';
import type { TrafficEnv, TrafficSource } from '../traffic/model.js';
import type { Positions } from '../geometry/positions.js';
import { createLayout, type LayoutParams } from '../geometry/layout.js';
import { ContentionProcedure, type ContentionHost } from './contention/procedure.js';
import type { RandomAccessParams } from './contention/params.js';
import type { AccessPolicy, PolicyHost } from './policy.js';
import { createPolicy, type AccessParams } from './policies/registry.js';
import { UplinkPool } from './grants/pool.js';
import type { UplinkParams } from './grants/params.js';
import { GrantScheduler } from './grants/scheduler.js';
import type { ConfiguredGrants } from './grants/configured.js';
import type { DynamicGrants } from './grants/dynamic.js';

export interface GroupPlan {
  readonly name: string;
  readonly count: number;
  readonly traffic: TrafficParams;
  readonly access: AccessParams;
  /** ms; Infinity when the group has no deadline. */
  readonly deadline: number;
  readonly layout: LayoutParams;
  /** Positions read from a layout CSV at load time (only for `layout.model: csv`). */
  readonly csvPositions?: Positions;
}

export interface CellPlan {
  readonly groups: readonly GroupPlan[];
  readonly randomAccess: RandomAccessParams;
  readonly uplink: UplinkParams;
  /** Cell radius in metres (layouts, alarm epicentres). */
  readonly radius: number;
  /** End of simulated time in ms; Infinity: run until every access is resolved. */
  readonly horizon: number;
  /** Packets arriving before this time (ms) are simulated but not counted. */
  readonly warmup: number;
  /** Safety net against runaway runs (kernel events). */
  readonly eventLimit: number;
}

export interface CellOutcome {
  readonly ledger: Ledger;
  readonly open: InProgressCounts;
  readonly ages: readonly AgeSummary[];
  readonly endTime: number;
  readonly events: number;
  readonly stopReason: string;
}

export class Cell implements ContentionHost, PolicyHost {
  readonly sim: Simulator;
  readonly ledger: Ledger;
  readonly groupOf: Uint16Array;
  readonly holArrival: Float64Array;
  /**
   * When the head-of-line packet's content was generated: its arrival, or for generate-at-will traffic
   * the start of its latest transmission. Delay, deadline and age count from here; the packet counts
   * (warm-up, conservation) by its arrival.
   */
  private readonly holGenerated: Float64Array;
  private readonly busy: Uint8Array;
  /** Packets waiting behind the head-of-line one, per device (rare: a Map keeps idle devices free). */
  private readonly backlog = new Map<number, number[]>();
  private readonly policies: AccessPolicy[] = [];
  private readonly sources: TrafficSource[] = [];
  private readonly fresh: boolean[] = [];
  private readonly plan: CellPlan;
  private readonly deviceCount: number;
  private readonly firsts: number[] = [];
  private readonly ages: AgeTracker;
  private readonly configured: ConfiguredGrants[] = [];
  private readonly scheduler: GrantScheduler;

  constructor(plan: CellPlan, streams: StreamSet) {
    this.plan = plan;
    this.sim = new Simulator({ eventLimit: plan.eventLimit });
    this.deviceCount = plan.groups.reduce((n, g) => n + g.count, 0);
    this.groupOf = new Uint16Array(this.deviceCount);
    this.holArrival = new Float64Array(this.deviceCount);
    this.holGenerated = new Float64Array(this.deviceCount);
    this.busy = new Uint8Array(this.deviceCount);
    this.ledger = new Ledger({
      groupNames: plan.groups.map((g) => g.name),
      deadlines: plan.groups.map((g) => g.deadline),
      warmup: plan.warmup,
      maxPreambleTransmissions: plan.randomAccess.preamble_trans_max,
    });
    this.ages = new AgeTracker(this.groupOf, plan.groups.length, plan.warmup);
    const ra = plan.randomAccess;
    const harq = plan.uplink.harq;
    const poolHorizon =
      plan.uplink.grant_delay +
      harq.max_transmissions * harq.round_trip +
      ra.response_delay +
      ra.response_window +
      ra.msg3_delay +
      ra.msg3.max_transmissions * ra.msg3.round_trip +
      ra.occasion_period;
    const pool = new UplinkPool(plan.uplink.capacity, poolHorizon);
    const shared = plan.uplink.msg3 === 'shared';
    const anyFresh = plan.groups.some((g) => trafficModel(g.traffic.model).freshAtTransmission === true);
    const contention = new ContentionProcedure(ra, this, streams, this.deviceCount, shared ? pool : null, shared ? plan.uplink.reserved_for_grants : 0, anyFresh);

    const dynamic: DynamicGrants[] = [];
    let first = 0;
    plan.groups.forEach((group, g) => {
      this.firsts.push(first);
      this.groupOf.fill(g, first, first + group.count);
      let positions: Positions | null = null;
      const positionsOf = (): Positions => {
        positions ??= createLayout(group.layout, group.count, streams.stream(`layout/${group.name}`), plan.radius, group.csvPositions);
        return positions;
      };
      const built = createPolicy(group.access, {
        host: this,
        streams,
        group: group.name,
        groupIndex: g,
        firstDevice: first,
        deviceCount: group.count,
        contention,
        uplink: plan.uplink,
        pool,
        positions: positionsOf,
      });
      this.policies.push(built.policy);
      if (built.dynamic !== undefined) dynamic.push(built.dynamic);
      if (built.configured !== undefined) this.configured.push(built.configured);
      const model = trafficModel(group.traffic.model);
      this.fresh.push(model.freshAtTransmission === true);
      const env: TrafficEnv = {
        sim: this.sim,
        group: group.name,
        firstDevice: first,
        deviceCount: group.count,
        horizon: plan.horizon,
        cellRadius: plan.radius,
        positions: model.needsPositions?.(group.traffic) === true ? positionsOf() : null,
        stream: (purpose) => streams.stream(`traffic/${group.name}/${purpose}`),
        packetArrives: (device) => this.packetArrives(device),
      };
      first += group.count;
      this.sources.push(model.create(group.traffic, env));
    });
    this.scheduler = new GrantScheduler(this.sim, plan.uplink, pool, dynamic, this.configured);
    if (this.configured.length > 0) contention.reservedAt = (u) => this.scheduler.reservedAt(u);
    for (const source of this.sources) source.start();
    this.scheduler.start();
  }

  run(): CellOutcome {
    const result = this.sim.run(this.plan.horizon);
    const endTime = Number.isFinite(this.plan.horizon) ? this.plan.horizon : Math.max(this.ledger.lastOutcomeTime, this.sim.now);
    this.ledger.closeBacklog(endTime);
    for (const c of this.configured) c.finalize(this.plan.warmup, endTime);
    return {
      ledger: this.ledger,
      open: this.countOpen(endTime),
      ages: this.ages.summarize(this.firsts, this.plan.groups.map((g) => g.count), endTime),
      endTime,
      events: result.events,
      stopReason: result.reason,
    };
  }

  private packetArrives(device: number): void {
    const now = this.sim.now;
    const g = this.groupOf[device] as number;
    this.ledger.arrival(g, now);
    if (this.busy[device] === 1) {
      const queue = this.backlog.get(device);
      if (queue === undefined) this.backlog.set(device, [now]);
      else queue.push(now);
      return;
    }
    this.startPacket(device, now);
  }

  private startPacket(device: number, arrival: number): void {
    this.busy[device] = 1;
    this.holArrival[device] = arrival;
    this.holGenerated[device] = arrival;
    (this.policies[this.groupOf[device] as number] as AccessPolicy).begin(device);
  }

  transmissionStarts(device: number, t: number): void {
    if (this.fresh[this.groupOf[device] as number] === true) this.holGenerated[device] = t;
  }

  delivered(device: number, t: number, preambleTx: number, firstPreamble: number, seenStart: number): void {
    const g = this.groupOf[device] as number;
    const generated = this.holGenerated[device] as number;
    this.ledger.delivered(g, this.holArrival[device] as number, t, preambleTx, firstPreamble, generated);
    this.ages.delivered(device, generated, t);
    (this.policies[g] as AccessPolicy).finished?.(device, t, true, seenStart);
    this.nextPacket(device);
  }

  dropped(device: number, t: number): void {
    const g = this.groupOf[device] as number;
    this.ledger.droppedPacket(g, this.holArrival[device] as number, t);
    (this.policies[g] as AccessPolicy).finished?.(device, t, false, Number.NaN);
    this.nextPacket(device);
  }

  private nextPacket(device: number): void {
    const queue = this.backlog.get(device);
    if (queue === undefined) {
      this.busy[device] = 0;
      (this.sources[this.groupOf[device] as number] as TrafficSource).deviceIdle?.(device);
      return;
    }
    const arrival = queue.shift() as number;
    if (queue.length === 0) this.backlog.delete(device);
    this.startPacket(device, arrival);
  }

  /** Counted packets still in the system at `end`, from device state (independent of the ledger's counters). */
  private countOpen(end: number): InProgressCounts {
    const groups = this.plan.groups.length;
    const inProgress = new Float64Array(groups);
    const inProgressLate = new Float64Array(groups);
    const warmup = this.plan.warmup;
    const note = (g: number, arrival: number): void => {
      if (arrival < warmup) return;
      inProgress[g] = (inProgress[g] as number) + 1;
      if (end - arrival > (this.plan.groups[g] as GroupPlan).deadline) inProgressLate[g] = (inProgressLate[g] as number) + 1;
    };
    for (let d = 0; d < this.deviceCount; d++) {
      if (this.busy[d] === 0) continue;
      const g = this.groupOf[d] as number;
      note(g, this.holArrival[d] as number);
      for (const arrival of this.backlog.get(d) ?? []) note(g, arrival);
    }
    return { inProgress, inProgressLate };
  }
}
