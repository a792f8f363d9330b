/**
 * Simulator: a clock, named event kinds with one handler each, and the run loop.
 * Events run in (time, scheduling order): equal times run first scheduled, first run
 * (see event-queue.ts). Time is in milliseconds by project convention; the kernel itself
 * only needs it to be a number.
 */
import { EventQueue } from './event-queue.js';

/** Called for each event of its kind with the event's subject (int32) and time (ms). */
export type Handler = (subject: number, time: number) => void;

/** Why run() returned. */
export type StopReason = 'drained' | 'until' | 'stopped' | 'event-limit';

/** Outcome of one run() call. */
export interface RunResult {
  readonly reason: StopReason;
  /** Events processed by this run() call. */
  readonly events: number;
  /** Simulated time (ms) when the call returned, i.e. `now`. */
  readonly time: number;
  /** The text given to stop(), or a note on the event limit. */
  readonly detail?: string;
}

/** Options of a Simulator; all optional. */
export interface SimulatorOptions {
  /** Width of the queue's timing wheel in ms; a power of two. Default 4096. */
  wheelSpan?: number;
  /** Most events one run() call may process; Infinity (default) or an integer >= 0. */
  eventLimit?: number;
}

/** Discrete-event run loop over an EventQueue; all state lives in the instance. */
export class Simulator {
  private readonly queue: EventQueue;
  private readonly handlers: Handler[] = [];
  private readonly names: string[] = [];
  private readonly eventLimit: number;
  private clock = 0;
  private processed = 0;
  private stopRequested = false;
  private running = false;
  private stopDetail: string | undefined = undefined;

  constructor(options: SimulatorOptions = {}) {
    const limit = options.eventLimit ?? Infinity;
    if (!(limit === Infinity || (Number.isInteger(limit) && limit >= 0))) {
      throw new RangeError(`Simulator: eventLimit must be Infinity or an integer >= 0, got ${limit}`);
    }
    this.eventLimit = limit;
    this.queue = options.wheelSpan === undefined ? new EventQueue() : new EventQueue({ wheelSpan: options.wheelSpan });
  }

  /** Simulated time in ms; starts at 0. Inside a handler, the time of the running event. */
  get now(): number {
    return this.clock;
  }

  /** Events processed since construction, over all run() calls. */
  get eventsProcessed(): number {
    return this.processed;
  }

  /** Events scheduled and not yet processed. */
  get pending(): number {
    return this.queue.size;
  }

  /** Registers an event kind; returns its id (0, 1, 2, ... in order). Names must be unique. */
  defineEvent(name: string, handler: Handler): number {
    if (this.names.includes(name)) throw new Error(`Simulator.defineEvent: event kind '${name}' is already defined`);
    this.names.push(name);
    this.handlers.push(handler);
    return this.handlers.length - 1;
  }

  /** Name of an event kind; RangeError if the kind is unknown. */
  kindName(kind: number): string {
    const name = this.names[kind];
    if (name === undefined) {
      throw new RangeError(`Simulator: unknown event kind ${kind} (${this.names.length} defined)`);
    }
    return name;
  }

  /**
   * Schedules an event of `kind` for `subject` (int32) at absolute time (ms). RangeError naming
   * the kind, the time and now if time is NaN, infinite or earlier than now; also if the kind is
   * unknown or the subject is not an int32.
   */
  at(time: number, kind: number, subject: number): void {
    if (!(time >= this.clock) || time === Infinity || !(kind >= 0 && kind < this.handlers.length) || (subject | 0) !== subject) this.rejectEvent(time, kind, subject);
    this.queue.push(time, kind, subject);
  }

  /** Throws the RangeError describing why at() refused an event (kept off the hot path). */
  private rejectEvent(time: number, kind: number, subject: number): never {
    const name = this.kindName(kind);
    if ((subject | 0) !== subject) {
      throw new RangeError(`Simulator.at: event '${name}' (kind ${kind}) has subject ${subject}, not an int32`);
    }
    throw new RangeError(`Simulator.at: event '${name}' (kind ${kind}) at time ${time} ms is not a finite time >= now (${this.clock} ms)`);
  }

  /** Schedules an event `delay` ms after now; same checks as at(). */
  after(delay: number, kind: number, subject: number): void {
    this.at(this.clock + delay, kind, subject);
  }

  /**
   * Runs events in (time, scheduling order) until: the queue is empty ('drained', now stays at
   * the last event's time); the next event is later than `until` ('until', now := until; events
   * at exactly `until` are processed); a handler called stop() ('stopped'); or this call processed
   * eventLimit events ('event-limit'). May be called again to continue. A stop() request made
   * before this call is forgotten. RangeError if until is NaN or earlier than now; Error if
   * called from a handler.
   */
  run(until = Infinity): RunResult {
    if (!(until >= this.clock)) {
      throw new RangeError(`Simulator.run: until ${until} ms is not >= now (${this.clock} ms)`);
    }
    if (this.running) throw new Error('Simulator.run: called from a handler while running');
    this.running = true;
    this.stopRequested = false;
    this.stopDetail = undefined;
    try {
      return this.loop(until);
    } finally {
      this.running = false;
    }
  }

  /** Asks the running run() call to return ('stopped') once the current handler returns. */
  stop(detail?: string): void {
    this.stopRequested = true;
    this.stopDetail = detail;
  }

  /** The hot loop: no allocation per event. */
  private loop(until: number): RunResult {
    const queue = this.queue;
    const handlers = this.handlers;
    const checkUntil = until !== Infinity;
    const limit = this.eventLimit;
    let events = 0;
    for (;;) {
      if (this.stopRequested) return this.result('stopped', events, this.stopDetail);
      if (queue.size === 0) return this.result('drained', events, undefined);
      if (checkUntil && queue.peekTime() > until) {
        this.clock = until;
        return this.result('until', events, undefined);
      }
      if (events >= limit) return this.result('event-limit', events, `event limit ${limit} reached`);
      queue.pop();
      const time = queue.lastTime;
      this.clock = time;
      this.processed++;
      events++;
      handlers[queue.lastKind]!(queue.lastSubject, time);
    }
  }

  private result(reason: StopReason, events: number, detail: string | undefined): RunResult {
    const time = this.clock;
    return detail === undefined ? { reason, events, time } : { reason, events, time, detail };
  }
}
