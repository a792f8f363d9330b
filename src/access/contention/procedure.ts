/**
 * The 4-step contention procedure (LTE random access, 3GPP TS 36.321 clause 5.1) as evaluated in
 * 3GPP TR 37.868: occasions, uniform preamble choice, detection with power ramping, response window
 * with a per-subframe answer limit, Msg3/Msg4 with HARQ, the contention-resolution timer, uniform
 * backoff and the preamble transmission limit, with optional access class barring.
 *
 * Cost model: devices waiting for an occasion sit in a per-occasion bucket (a linked list through a
 * typed array), so an occasion is one kernel event however many devices use it; a device's whole
 * attempt (response, Msg3, Msg4) is resolved at the occasion from its own draws and ends in one
 * kernel event at the time its fate is known. Modelling choices are marked (modelling choice).
 */
import type { Simulator } from '../../kernel/index.js';
import type { Stream, StreamSet } from '../../random/index.js';
import type { Ledger } from '../../metrics/ledger.js';
import type { UplinkPool } from '../grants/pool.js';
import { Barring } from './barring.js';
import type { RandomAccessParams } from './params.js';

/** What the procedure needs from the cell around it. */
export interface ContentionHost {
  readonly sim: Simulator;
  readonly ledger: Ledger;
  /** Device → group index. */
  readonly groupOf: Uint16Array;
  /** Arrival time (ms) of the packet each device is currently trying to send. */
  readonly holArrival: Float64Array;
  /** The access completed at `t` (Msg4 received); `seenStart` is the occasion of the successful preamble. */
  delivered(device: number, t: number, preambleTx: number, firstPreamble: number, seenStart: number): void;
  /** The access was dropped at `t` (preamble transmission limit reached). */
  dropped(device: number, t: number): void;
  /** Generate-at-will traffic: the packet's content is taken when a transmission starts. */
  transmissionStarts(device: number, t: number): void;
}

const NONE = -1;
const SUCCESS = 1;
const FAILURE = 2;

export class ContentionProcedure {
  private readonly host: ContentionHost;
  private readonly sim: Simulator;
  private readonly ledger: Ledger;
  private readonly p: RandomAccessParams;

  // Per device.
  private readonly attempt: Uint8Array;
  private readonly outcome: Uint8Array;
  private readonly nextInBucket: Int32Array;
  private readonly nextOnPreamble: Int32Array;
  private readonly firstPreamble: Float64Array;
  /** Occasion of the device's current attempt, and since when it has been waiting awake for it. */
  private readonly attemptOccasion: Float64Array;
  private readonly idleFrom: Float64Array;
  /** When Msg3 shares the uplink pool with grants (cell.uplink.msg3: shared), the pool; else null. */
  private readonly sharedPool: UplinkPool | null;
  /** Units per subframe Msg3 may not use (kept for grants). */
  private readonly keptForGrants: number;
  /** Units reserved by configured grants on subframe u (set by the cell once its scheduler exists). */
  reservedAt: (u: number) => number = () => 0;

  // Per occasion: a ring of bucket heads indexed by occasion number.
  private readonly bucketHead: Int32Array;
  private readonly ringMask: number;
  private lastResolved = -1;

  // Per preamble (scratch for one occasion).
  private readonly preambleHead: Int32Array;
  private readonly preambleCount: Int32Array;

  private readonly preambleStream: Stream;
  private readonly detectionStream: Stream;
  private readonly harqStream: Stream;
  private readonly backoffStream: Stream;
  private readonly barring: Barring | null;

  private readonly occasionKind: number;
  private readonly attemptEndKind: number;
  private readonly wakeKind: number;

  /**
   * Devices whose attempt fails when an occasion's response window ends, per occasion (a ring of
   * FIFO lists): one kernel event ends them all, in the order their failures were decided — the
   * order separate events would have had.
   */
  private readonly windowHead: Int32Array;
  private readonly windowTail: Int32Array;
  private readonly windowMask: number;
  private readonly nextEnding: Int32Array;
  private readonly windowEndKind: number;

  // Hot parameters as plain fields (ms or counts).
  private readonly period: number;
  private readonly offset: number;
  private readonly preambles: number;
  private readonly responseDelay: number;
  private readonly windowLength: number;
  private readonly backoffIndicator: number;
  private readonly maxAttempts: number;
  private readonly collidedAnswered: boolean;
  private readonly warmup: number;
  private readonly groupOf: Uint16Array;
  private readonly holArrival: Float64Array;

  /** P(detected) for a lone preamble at attempt k (index k), 1 − e^(−k) or 1. */
  private readonly detectProbability: Float64Array;
  private readonly answersPerOccasion: number;
  private readonly answersPerSubframe: number;

  constructor(
    params: RandomAccessParams,
    host: ContentionHost,
    streams: StreamSet,
    deviceCount: number,
    sharedPool: UplinkPool | null = null,
    keptForGrants = 0,
    /** Some group's traffic is generate-at-will: stamp its packets at each preamble. */
    private readonly stampFresh = false,
  ) {
    this.p = params;
    this.host = host;
    this.sim = host.sim;
    this.ledger = host.ledger;
    this.attempt = new Uint8Array(deviceCount);
    this.outcome = new Uint8Array(deviceCount);
    this.nextInBucket = new Int32Array(deviceCount);
    this.nextOnPreamble = new Int32Array(deviceCount);
    this.firstPreamble = new Float64Array(deviceCount);
    this.attemptOccasion = new Float64Array(deviceCount);
    this.idleFrom = new Float64Array(deviceCount);
    this.sharedPool = sharedPool;
    this.keptForGrants = keptForGrants;

    // Bucket lookahead: a failed attempt joins the occasion after its backoff, a new one the next occasion.
    const lookahead = Math.ceil(params.backoff_indicator / params.occasion_period) + 3;
    let ring = 8;
    while (ring < lookahead) ring *= 2;
    this.bucketHead = new Int32Array(ring).fill(NONE);
    this.ringMask = ring - 1;

    this.preambleHead = new Int32Array(params.preambles).fill(NONE);
    this.preambleCount = new Int32Array(params.preambles);

    this.preambleStream = streams.stream('contention/preamble');
    this.detectionStream = streams.stream('contention/detection');
    this.harqStream = streams.stream('contention/harq');
    this.backoffStream = streams.stream('contention/backoff');
    this.barring = params.barring === undefined ? null : new Barring(params.barring, streams.stream('contention/barring'));

    this.detectProbability = new Float64Array(params.preamble_trans_max + 1);
    for (let k = 1; k <= params.preamble_trans_max; k++) {
      this.detectProbability[k] = params.detection === 'perfect' ? 1 : 1 - Math.exp(-k);
    }
    this.answersPerSubframe = params.answers_per_subframe === 'unlimited' ? Infinity : params.answers_per_subframe;
    this.answersPerOccasion = this.answersPerSubframe * params.response_window;

    this.period = params.occasion_period;
    this.offset = params.occasion_offset;
    this.preambles = params.preambles;
    this.responseDelay = params.response_delay;
    this.windowLength = params.response_window;
    this.backoffIndicator = params.backoff_indicator;
    this.maxAttempts = params.preamble_trans_max;
    this.collidedAnswered = params.collided_preambles === 'answered';
    this.warmup = host.ledger.warmup;
    this.groupOf = host.groupOf;
    this.holArrival = host.holArrival;
    let windowRing = 8;
    while (windowRing * params.occasion_period <= params.response_delay + params.response_window + 2 * params.occasion_period) windowRing *= 2;
    this.windowHead = new Int32Array(windowRing).fill(NONE);
    this.windowTail = new Int32Array(windowRing).fill(NONE);
    this.windowMask = windowRing - 1;
    this.nextEnding = new Int32Array(deviceCount);

    this.occasionKind = this.sim.defineEvent('contention/occasion', (index, t) => this.resolveOccasion(index, t));
    this.windowEndKind = this.sim.defineEvent('contention/window-end', (index, t) => this.windowEnded(index, t));
    this.attemptEndKind = this.sim.defineEvent('contention/attempt-end', (device, t) => this.attemptEnded(device, t));
    this.wakeKind = this.sim.defineEvent('contention/wake', (device, t) => this.join(device, t));
  }

  /** Device `device` starts contending for its head-of-line packet now. */
  begin(device: number): void {
    const now = this.sim.now;
    this.attempt[device] = 1;
    this.firstPreamble[device] = Number.NaN;
    this.idleFrom[device] = now;
    let ready = now;
    if (this.barring !== null) {
      ready = this.barring.passTime(now);
      this.ledger.barringPass(this.host.groupOf[device] as number, this.host.holArrival[device] as number, ready - now);
    }
    this.scheduleJoin(device, ready);
  }

  /** Time (ms) of occasion number `index`. */
  occasionTime(index: number): number {
    return this.offset + index * this.period;
  }

  /** Puts the device in the bucket of the first occasion at or after `t`, now or via a wake-up event. */
  private scheduleJoin(device: number, t: number): void {
    const index = this.firstOccasionAtOrAfter(t);
    if (index - Math.max(this.lastResolved, 0) < this.ringMask) this.enqueue(device, index);
    else this.sim.at(t, this.wakeKind, device);
  }

  private join(device: number, t: number): void {
    this.enqueue(device, this.firstOccasionAtOrAfter(t));
  }

  private firstOccasionAtOrAfter(t: number): number {
    let index = Math.ceil((t - this.offset) / this.period);
    if (index < 0) index = 0;
    if (index <= this.lastResolved) index = this.lastResolved + 1;
    return index;
  }

  private enqueue(device: number, index: number): void {
    const slot = index & this.ringMask;
    const head = this.bucketHead[slot] as number;
    if (head === NONE) this.sim.at(this.occasionTime(index), this.occasionKind, index);
    this.nextInBucket[device] = head;
    this.bucketHead[slot] = device;
  }

  /** All devices of the occasion's bucket send their preambles; resolve every attempt. */
  private resolveOccasion(index: number, t: number): void {
    this.lastResolved = index;
    const slot = index & this.ringMask;
    let device = this.bucketHead[slot] as number;
    this.bucketHead[slot] = NONE;
    const m = this.preambles;
    const counted = t >= this.warmup;
    const heads = this.preambleHead;
    const counts = this.preambleCount;
    const choose = this.preambleStream;

    while (device !== NONE) {
      const next = this.nextInBucket[device] as number;
      const preamble = (choose.next() * m) | 0;
      counts[preamble] = (counts[preamble] as number) + 1;
      this.nextOnPreamble[device] = heads[preamble] as number;
      heads[preamble] = device;
      if (this.attempt[device] === 1) this.firstPreamble[device] = t;
      this.attemptOccasion[device] = t;
      if (this.stampFresh) this.host.transmissionStarts(device, t);
      device = next;
    }

    // Preambles are served in ascending index. Because every device picks its preamble uniformly, this
    // is a uniformly random order of the devices (modelling choice: random service order).
    let answered = 0;
    let used = 0;
    let singletons = 0;
    const windowEnd = t + this.responseDelay + this.windowLength;
    for (let preamble = 0; preamble < m; preamble++) {
      const n = counts[preamble] as number;
      if (n === 0) continue;
      const first = heads[preamble] as number;
      counts[preamble] = 0;
      heads[preamble] = NONE;
      used++;
      if (n === 1) {
        singletons++;
        if (counted) this.ledger.preamble(this.groupOf[first] as number, false);
        const detected = this.detectionStream.next() < (this.detectProbability[this.attempt[first] as number] as number);
        const responseAt = t + this.responseDelay + Math.floor(answered / this.answersPerSubframe);
        if (detected && answered < this.answersPerOccasion && this.msg3ResourceFree(responseAt)) {
          answered++;
          this.resolveLoneAttempt(first, t, responseAt);
        } else {
          this.spend(first, t, 1, windowEnd - t - 1);
          this.failAtWindowEnd(first, index, windowEnd);
        }
      } else {
        answered += this.resolveCollision(first, t, index, windowEnd, answered, counted);
      }
    }
    if (counted) this.ledger.occasion(index, used, singletons);
  }

  /**
   * Devices that chose the same preamble. `unanswered`: no response, all fail when the window ends.
   * `answered`: the preamble is detected if any transmission is, takes a response (capacity allowing),
   * and all its devices send Msg3 on the same grant, which is never decoded; each fails when the
   * contention-resolution timer expires after its last Msg3 transmission. Returns responses used (0/1).
   */
  private resolveCollision(first: number, t: number, index: number, windowEnd: number, answered: number, counted: boolean): number {
    let detected = false;
    for (let d = first; d !== NONE; d = this.nextOnPreamble[d] as number) {
      if (counted) this.ledger.preamble(this.groupOf[d] as number, true);
      if (this.collidedAnswered) {
        if (this.detectionStream.next() < (this.detectProbability[this.attempt[d] as number] as number)) detected = true;
      }
    }
    let failAt = windowEnd;
    let used = 0;
    let tx = 1;
    let rx = windowEnd - t - 1;
    const responseAt = t + this.responseDelay + Math.floor(answered / this.answersPerSubframe);
    if (detected && answered < this.answersPerOccasion && this.msg3ResourceFree(responseAt)) {
      const msg3 = this.p.msg3;
      const firstMsg3 = responseAt + this.p.msg3_delay;
      failAt = firstMsg3 + (msg3.max_transmissions - 1) * msg3.round_trip + this.p.contention_resolution_timer;
      this.bookMsg3(firstMsg3, msg3.max_transmissions);
      used = 1;
      tx = 1 + msg3.max_transmissions;
      rx = responseAt - t + (failAt - firstMsg3) - msg3.max_transmissions;
    }
    if (used === 0) {
      for (let d = first; d !== NONE; d = this.nextOnPreamble[d] as number) {
        this.spend(d, t, tx, rx);
        this.failAtWindowEnd(d, index, windowEnd);
      }
      return 0;
    }
    for (let d = first; d !== NONE; d = this.nextOnPreamble[d] as number) {
      this.spend(d, t, tx, rx);
      this.endAttempt(d, failAt, FAILURE);
    }
    return used;
  }

  /** A lone, answered device: Msg3 with HARQ, then Msg4 with HARQ, under the contention-resolution timer. */
  private resolveLoneAttempt(device: number, t: number, responseAt: number): void {
    const { msg3, msg4 } = this.p;
    const timer = this.p.contention_resolution_timer;
    const firstMsg3 = responseAt + this.p.msg3_delay;
    const n3 = this.transmissionsNeeded(msg3.error_probability, msg3.max_transmissions);
    const sent3 = Math.min(n3, msg3.max_transmissions);
    this.bookMsg3(firstMsg3, sent3);
    let end: number;
    let outcome = FAILURE;
    if (n3 > msg3.max_transmissions) {
      end = firstMsg3 + (msg3.max_transmissions - 1) * msg3.round_trip + timer;
    } else {
      const decodedMsg3 = firstMsg3 + (n3 - 1) * msg3.round_trip;
      const n4 = this.transmissionsNeeded(msg4.error_probability, msg4.max_transmissions);
      const received = decodedMsg3 + this.p.msg4_delay + (n4 - 1) * msg4.round_trip;
      if (n4 > msg4.max_transmissions || received > decodedMsg3 + timer) {
        end = decodedMsg3 + timer;
      } else {
        end = received;
        outcome = SUCCESS;
      }
    }
    // Energy: the preamble and each Msg3 transmit for 1 ms; the device listens from the preamble to the
    // response and from the first Msg3 to the end of the attempt (minus its Msg3 transmissions).
    this.spend(device, t, 1 + sent3, responseAt - t + (end - firstMsg3) - sent3);
    this.endAttempt(device, end, outcome);
  }

  /** With a shared uplink pool, a response can only be sent when its Msg3 subframe has a free unit. */
  private msg3ResourceFree(responseAt: number): boolean {
    if (this.sharedPool === null) return true;
    const u = responseAt + this.p.msg3_delay;
    return this.sharedPool.freeAt(u, this.keptForGrants + this.reservedAt(u)) > 0;
  }

  private bookMsg3(firstMsg3: number, transmissions: number): void {
    const pool = this.sharedPool;
    if (pool === null) return;
    for (let k = 0; k < transmissions; k++) pool.book(firstMsg3 + k * this.p.msg3.round_trip);
  }

  /** Energy of one attempt: `tx` and `rx` ms, and the idle wait since the device was last active. */
  private spend(device: number, t: number, tx: number, rx: number): void {
    this.ledger.energy(this.groupOf[device] as number, this.holArrival[device] as number, tx, rx, t - (this.idleFrom[device] as number));
  }

  /** Transmissions until the first success; max + 1 when all `max` fail. */
  private transmissionsNeeded(errorProbability: number, max: number): number {
    if (errorProbability === 0) return 1;
    let n = 1;
    while (n <= max && this.harqStream.next() < errorProbability) n++;
    return n;
  }

  private endAttempt(device: number, t: number, outcome: number): void {
    this.outcome[device] = outcome;
    this.sim.at(t, this.attemptEndKind, device);
  }

  /** The attempt fails when occasion `index`'s response window ends (batched: see windowHead). */
  private failAtWindowEnd(device: number, index: number, windowEnd: number): void {
    this.outcome[device] = FAILURE;
    this.nextEnding[device] = NONE;
    const slot = index & this.windowMask;
    const tail = this.windowTail[slot] as number;
    if (tail === NONE) {
      this.windowHead[slot] = device;
      this.sim.at(windowEnd, this.windowEndKind, index);
    } else {
      this.nextEnding[tail] = device;
    }
    this.windowTail[slot] = device;
  }

  private windowEnded(index: number, t: number): void {
    const slot = index & this.windowMask;
    let device = this.windowHead[slot] as number;
    this.windowHead[slot] = NONE;
    this.windowTail[slot] = NONE;
    while (device !== NONE) {
      const next = this.nextEnding[device] as number;
      this.attemptEnded(device, t);
      device = next;
    }
  }

  private attemptEnded(device: number, t: number): void {
    const k = this.attempt[device] as number;
    if (this.outcome[device] === SUCCESS) {
      this.host.delivered(device, t, k, this.firstPreamble[device] as number, this.attemptOccasion[device] as number);
      return;
    }
    this.idleFrom[device] = t;
    if (k >= this.maxAttempts) {
      this.host.dropped(device, t);
      return;
    }
    this.attempt[device] = k + 1;
    // Backoff uniform in [0, backoff_indicator] (TS 36.321 5.1.4), continuous (modelling choice).
    let ready = t + this.backoffStream.next() * this.backoffIndicator;
    if (this.barring !== null && this.barring.everyAttempt) ready = this.barring.passTime(ready);
    this.scheduleJoin(device, ready);
  }
}
