/**
 * One cell for one replication: the devices (as typed-array columns), their groups' traffic sources
 * and access policies, the shared contention procedure, and the ledger that records outcomes.
 *
 * Packet life cycle: a packet arrives (traffic) → if the device is idle it becomes the head-of-line
 * packet and the group's policy is asked to send it; otherwise it waits in the device's buffer (FIFO).
 * When the policy reports it delivered or dropped, the next buffered packet (if any) starts at once.
 * Modelling choice: one access carries one packet.
 */
import { Simulator } from '../kernel/index.js';
import type { StreamSet } from '../random/index.js';
import { Ledger } from '../metrics/ledger.js';
import type { InProgressCounts } from '../metrics/tally.js';
import type { TrafficParams } from '../traffic/registry.js';
import { trafficModel } from '../traffic/registry.js';
import type { TrafficEnv } from '../traffic/model.js';
import { ContentionProcedure, type ContentionHost } from './contention/procedure.js';
import type { RandomAccessParams } from './contention/params.js';
import type { AccessPolicy } from './policy.js';
import { createPolicy, type AccessParams } from './policies/registry.js';

export interface GroupPlan {
  readonly name: string;
  readonly count: number;
  readonly traffic: TrafficParams;
  readonly access: AccessParams;
  /** ms; Infinity when the group has no deadline. */
  readonly deadline: number;
}

export interface CellPlan {
  readonly groups: readonly GroupPlan[];
  readonly randomAccess: RandomAccessParams;
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
  readonly endTime: number;
  readonly events: number;
  readonly stopReason: string;
}

export class Cell implements ContentionHost {
  readonly sim: Simulator;
  readonly ledger: Ledger;
  readonly groupOf: Uint16Array;
  readonly holArrival: Float64Array;
  private readonly busy: Uint8Array;
  /** Packets waiting behind the head-of-line one, per device (rare: a Map keeps idle devices free). */
  private readonly backlog = new Map<number, number[]>();
  private readonly policies: AccessPolicy[] = [];
  private readonly plan: CellPlan;
  private readonly deviceCount: number;

  constructor(plan: CellPlan, streams: StreamSet) {
    this.plan = plan;
    this.sim = new Simulator({ eventLimit: plan.eventLimit });
    this.deviceCount = plan.groups.reduce((n, g) => n + g.count, 0);
    this.groupOf = new Uint16Array(this.deviceCount);
    this.holArrival = new Float64Array(this.deviceCount);
    this.busy = new Uint8Array(this.deviceCount);
    this.ledger = new Ledger({
      groupNames: plan.groups.map((g) => g.name),
      deadlines: plan.groups.map((g) => g.deadline),
      warmup: plan.warmup,
      maxPreambleTransmissions: plan.randomAccess.preamble_trans_max,
    });
    const contention = new ContentionProcedure(plan.randomAccess, this, streams, this.deviceCount);

    let first = 0;
    const sources = plan.groups.map((group, g) => {
      this.groupOf.fill(g, first, first + group.count);
      this.policies.push(
        createPolicy(group.access, {
          sim: this.sim,
          ledger: this.ledger,
          streams,
          group: group.name,
          groupIndex: g,
          firstDevice: first,
          deviceCount: group.count,
          contention,
        }),
      );
      const env: TrafficEnv = {
        sim: this.sim,
        group: group.name,
        firstDevice: first,
        deviceCount: group.count,
        horizon: plan.horizon,
        stream: (purpose) => streams.stream(`traffic/${group.name}/${purpose}`),
        packetArrives: (device) => this.packetArrives(device),
      };
      first += group.count;
      return trafficModel(group.traffic.model).create(group.traffic, env);
    });
    for (const source of sources) source.start();
  }

  run(): CellOutcome {
    const result = this.sim.run(this.plan.horizon);
    const endTime = Number.isFinite(this.plan.horizon) ? this.plan.horizon : Math.max(this.ledger.lastOutcomeTime, this.sim.now);
    return {
      ledger: this.ledger,
      open: this.countOpen(endTime),
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
    (this.policies[this.groupOf[device] as number] as AccessPolicy).begin(device);
  }

  delivered(device: number, t: number, preambleTx: number, firstPreamble: number): void {
    this.ledger.delivered(this.groupOf[device] as number, this.holArrival[device] as number, t, preambleTx, firstPreamble);
    this.nextPacket(device);
  }

  dropped(device: number, t: number): void {
    this.ledger.droppedPacket(this.groupOf[device] as number, this.holArrival[device] as number, t);
    this.nextPacket(device);
  }

  private nextPacket(device: number): void {
    const queue = this.backlog.get(device);
    if (queue === undefined) {
      this.busy[device] = 0;
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
