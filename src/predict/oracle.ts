/**
 * `oracle`: a what-if predictor that is told the true buffer state (the `truth*` hooks) and errs in
 * two controlled ways. It answers "how good would grants be with a predictor of this quality?".
 *
 * Definitions:
 * - recall = the share of packets foreseen, per packet: when a packet starts waiting for a grant
 *   (`truthWaiting`) it is foreseen with probability `recall` (one draw per packet, stream `recall`).
 *   A foreseen device is flagged until it is selected or its packet is served (`truthDone`).
 * - false alarm = per occasion and per idle device: at each `select`, every device that is not
 *   waiting is flagged by mistake with probability `false_alarm`, independently of other occasions.
 *   Only the count F ~ Binomial(idle, false_alarm) is drawn (stream `false-alarm`, one binomial per
 *   occasion); the mistaken devices are not visited, and F is reported by `transientFalseAlarms()`.
 * - The base station cannot tell foreseen devices from false alarms, so it grants min(k, A + F) of
 *   the A + F flagged devices uniformly at random (A = foreseen waiting devices): each pick is a
 *   foreseen device with probability (foreseen left)/(flagged left), chosen uniformly among them;
 *   otherwise a uniform idle device not yet picked at this occasion (rejection over device indices).
 *   Pick draws use stream `pick`. Selected foreseen devices are unflagged; false alarms never are
 *   flagged through the host (they are transient).
 * The oracle ignores deliveries and grant outcomes.
 */
import { z } from 'zod';
import { binomial } from '../random/index.js';
import type { Stream } from '../random/index.js';
import type { Predictor, PredictorHost } from './predictor.js';

export const oracleSchema = z
  .strictObject({
    model: z.literal('oracle'),
    recall: z
      .number()
      .min(0)
      .max(1)
      .default(1)
      .describe('Share of packets foreseen: each packet waiting for a grant is foreseen with this probability (0 … 1). Default 1.'),
    false_alarm: z
      .number()
      .min(0)
      .max(1)
      .default(0)
      .describe('Probability that an idle device is flagged by mistake, per grant occasion and per idle device (0 … 1). Default 0.'),
  })
  .describe('What-if predictor that knows the buffers: foresees each waiting packet with probability `recall` and flags idle devices by mistake with probability `false_alarm` per occasion.');

export type OracleParams = z.output<typeof oracleSchema>;

export class OraclePredictor implements Predictor {
  private readonly host: PredictorHost;
  private readonly recall: number;
  private readonly falseAlarm: number;
  private readonly recallStream: Stream;
  private readonly falseAlarmStream: Stream;
  private readonly pickStream: Stream;
  /** 1 while the device holds a packet waiting for a grant (truth). */
  private readonly waiting: Uint8Array;
  /** Recall draw of the device's current packet (1: foreseen), kept for its later waits. */
  private readonly foreseenPacket: Uint8Array;
  private waitingCount = 0;
  /** Unordered set of foreseen waiting devices: members[0 … size), slot[d] its index or −1. */
  private readonly members: Int32Array;
  private readonly slot: Int32Array;
  private size = 0;
  /** 1 for idle devices picked at the current occasion (cleared before select returns). */
  private readonly picked: Uint8Array;
  private lastFalseAlarms = 0;

  constructor(params: OracleParams, host: PredictorHost) {
    const n = host.deviceCount;
    this.host = host;
    this.recall = params.recall;
    this.falseAlarm = params.false_alarm;
    this.recallStream = host.stream('recall');
    this.falseAlarmStream = host.stream('false-alarm');
    this.pickStream = host.stream('pick');
    this.waiting = new Uint8Array(n);
    this.foreseenPacket = new Uint8Array(n);
    this.members = new Int32Array(n);
    this.slot = new Int32Array(n).fill(-1);
    this.picked = new Uint8Array(n);
  }

  /** Number of foreseen devices waiting (flagged). */
  get foreseenCount(): number {
    return this.size;
  }

  /** Number of devices waiting for a grant (truth). */
  get waitingDevices(): number {
    return this.waitingCount;
  }

  observeDelivery(): void {}

  observeGrant(): void {}

  /**
   * A packet of `device` starts waiting for a grant: one recall draw per packet. A device waits with at
   * most one packet (its head-of-line one); a repeated call before `truthDone` counts as a new packet.
   * `again`: the same packet waits again after all its HARQ transmissions failed — no new draw; it is
   * flagged again if it was foreseen.
   */
  truthWaiting(device: number, again = false): void {
    if (this.waiting[device] === 0) {
      this.waiting[device] = 1;
      this.waitingCount++;
    }
    if (!again) this.foreseenPacket[device] = this.recallStream.next() < this.recall ? 1 : 0;
    if (this.foreseenPacket[device] === 1 && (this.slot[device] as number) < 0) {
      this.slot[device] = this.size;
      this.members[this.size++] = device;
      this.host.flag(device, true);
    }
  }

  /** The waiting packet of `device` was served or left grant access: unflag it if flagged. */
  truthDone(device: number): void {
    if (this.waiting[device] === 1) {
      this.waiting[device] = 0;
      this.waitingCount--;
    }
    if ((this.slot[device] as number) >= 0) {
      this.removeForeseen(device);
      this.host.flag(device, false);
    }
  }

  select(_now: number, k: number, out: Int32Array): number {
    const idle = this.host.deviceCount - this.waitingCount;
    const f = binomial(this.falseAlarmStream, idle, this.falseAlarm);
    this.lastFalseAlarms = f;
    let leftA = this.size;
    let leftF = f;
    const picks = Math.max(0, Math.min(k, leftA + leftF, out.length));
    const s = this.pickStream;
    for (let i = 0; i < picks; i++) {
      if (s.next() * (leftA + leftF) < leftA) {
        const d = this.members[s.int(leftA)] as number;
        this.removeForeseen(d);
        this.host.flag(d, false);
        out[i] = d;
        leftA--;
      } else {
        const d = this.pickIdle();
        this.picked[d] = 1;
        out[i] = d;
        leftF--;
      }
    }
    for (let i = 0; i < picks; i++) this.picked[out[i] as number] = 0;
    return picks;
  }

  transientFalseAlarms(): number {
    return this.lastFalseAlarms;
  }

  /**
   * A uniform idle device not picked at this occasion, by rejection over device indices. Terminates:
   * idle picks so far < F ≤ idle devices. Expected tries n / (idle − picked idle).
   */
  private pickIdle(): number {
    const n = this.host.deviceCount;
    for (;;) {
      const d = this.pickStream.int(n);
      if (this.waiting[d] === 0 && this.picked[d] === 0) return d;
    }
  }

  /** Swap-remove from the foreseen set (flag not touched). */
  private removeForeseen(device: number): void {
    const i = this.slot[device] as number;
    const last = this.members[--this.size] as number;
    this.members[i] = last;
    this.slot[last] = i;
    this.slot[device] = -1;
  }
}

export function createOracle(params: OracleParams, host: PredictorHost): OraclePredictor {
  return new OraclePredictor(params, host);
}
