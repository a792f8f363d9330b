/**
 * Simulator unit tests. Ordering oracle: common practice (discrete-event simulation ordering
 * rule: future-event list ordered by (time, insertion number), FIFO on ties). The run/stop/limit semantics checked here are the
 * kernel's documented contract (simulator.ts), asserted as whole traces.
 */
import { describe, it, expect } from 'vitest';
import { Simulator } from '../../src/kernel/index.js';

/** A simulator with kinds 'a' and 'b' that log [name, subject, time, now]. */
function logged(options: ConstructorParameters<typeof Simulator>[0] = {}) {
  const sim = new Simulator(options);
  const log: [string, number, number, number][] = [];
  const a = sim.defineEvent('a', (s, t) => log.push(['a', s, t, sim.now]));
  const b = sim.defineEvent('b', (s, t) => log.push(['b', s, t, sim.now]));
  return { sim, log, a, b };
}

describe('Simulator definitions', () => {
  it('numbers kinds 0, 1, 2 in order and names them', () => {
    const sim = new Simulator();
    expect(sim.defineEvent('arrive', () => {})).toBe(0);
    expect(sim.defineEvent('leave', () => {})).toBe(1);
    expect(sim.defineEvent('tick', () => {})).toBe(2);
    expect([sim.kindName(0), sim.kindName(1), sim.kindName(2)]).toEqual(['arrive', 'leave', 'tick']);
    expect(() => sim.kindName(3)).toThrow(RangeError);
    expect(() => sim.defineEvent('leave', () => {})).toThrow(/leave/);
  });

  it('starts at time 0 with nothing pending', () => {
    const sim = new Simulator();
    expect([sim.now, sim.pending, sim.eventsProcessed]).toEqual([0, 0, 0]);
    expect(sim.run()).toEqual({ reason: 'drained', events: 0, time: 0 });
  });
});

describe('Simulator ordering', () => {
  it('runs a whole trace by (time, scheduling order), with now = event time — common practice (future-event list ordered by (time, insertion number), FIFO on ties)', () => {
    const { sim, log, a, b } = logged();
    sim.at(3, b, 1);
    sim.at(1.5, a, 2);
    sim.at(3, a, 3);
    sim.after(0, b, 4);
    expect(sim.run()).toEqual({ reason: 'drained', events: 4, time: 3 });
    expect(log).toEqual([
      ['b', 4, 0, 0],
      ['a', 2, 1.5, 1.5],
      ['b', 1, 3, 3],
      ['a', 3, 3, 3],
    ]);
  });

  it('puts a zero-delay event behind events already scheduled for now — common practice (future-event list ordered by (time, insertion number), FIFO on ties)', () => {
    const sim = new Simulator();
    const log: number[] = [];
    const later = sim.defineEvent('later', (s) => log.push(s));
    sim.defineEvent('spawn', (s) => {
      log.push(s);
      sim.after(0, later, 99);
    });
    sim.at(5, 1, 1);
    sim.at(5, later, 2);
    sim.at(5, later, 3);
    sim.run();
    expect(log).toEqual([1, 2, 3, 99]);
  });
});

describe('Simulator.run(until)', () => {
  it('processes events at exactly until, keeps later ones, sets now = until, then continues', () => {
    const { sim, log, a } = logged();
    for (const t of [5, 10, 10, 15]) sim.at(t, a, t);
    expect(sim.run(10)).toEqual({ reason: 'until', events: 3, time: 10 });
    expect(log.map((e) => e[2])).toEqual([5, 10, 10]);
    expect([sim.now, sim.pending]).toEqual([10, 1]);
    expect(sim.run(12)).toEqual({ reason: 'until', events: 0, time: 12 });
    expect(sim.now).toBe(12);
    expect(sim.run()).toEqual({ reason: 'drained', events: 1, time: 15 });
    expect(sim.eventsProcessed).toBe(4);
  });

  it('leaves now at the last event when the queue drains before until', () => {
    const { sim, a } = logged();
    sim.at(2, a, 0);
    expect(sim.run(100)).toEqual({ reason: 'drained', events: 1, time: 2 });
    expect(sim.now).toBe(2);
  });

  it('allows scheduling at until after a stop at until', () => {
    const { sim, log, a } = logged();
    sim.at(20, a, 1);
    sim.run(7.5);
    sim.after(0, a, 2);
    sim.run();
    expect(log.map((e) => [e[1], e[2]])).toEqual([
      [2, 7.5],
      [1, 20],
    ]);
  });

  it('runs a whole-number event scheduled after a stop at until before the event that stopped the run', () => {
    const { sim, log, a } = logged({ wheelSpan: 64 });
    sim.at(10, a, 1);
    expect(sim.run(7)).toMatchObject({ reason: 'until', events: 0, time: 7 });
    sim.at(8, a, 2);
    sim.at(7, a, 3);
    sim.run();
    expect(log.map((e) => [e[1], e[2]])).toEqual([
      [3, 7],
      [2, 8],
      [1, 10],
    ]);
  });

  it('rejects until earlier than now or NaN', () => {
    const { sim, a } = logged();
    sim.at(4, a, 0);
    sim.run();
    expect(() => sim.run(3)).toThrow(RangeError);
    expect(() => sim.run(Number.NaN)).toThrow(RangeError);
  });
});

describe('Simulator stop() and event limit', () => {
  it('stop() from a handler ends the run after that handler, with its detail; run() continues', () => {
    const sim = new Simulator();
    const seen: number[] = [];
    const k = sim.defineEvent('step', (s) => {
      seen.push(s);
      if (s === 2) sim.stop('reached 2');
    });
    for (let i = 0; i < 5; i++) sim.at(i, k, i);
    expect(sim.run()).toEqual({ reason: 'stopped', events: 3, time: 2, detail: 'reached 2' });
    expect(sim.pending).toBe(2);
    expect(sim.run()).toEqual({ reason: 'drained', events: 2, time: 4 });
    expect(seen).toEqual([0, 1, 2, 3, 4]);
  });

  it('stops a self-rescheduling process at the event limit of each run() call', () => {
    const sim = new Simulator({ eventLimit: 5 });
    const k = sim.defineEvent('tick', (s) => sim.after(1, k, s + 1));
    sim.at(0, k, 0);
    const r = sim.run();
    expect([r.reason, r.events, r.time]).toEqual(['event-limit', 5, 4]);
    expect(r.detail).toMatch(/5/);
    expect([sim.pending, sim.eventsProcessed]).toEqual([1, 5]);
    expect(sim.run()).toMatchObject({ reason: 'event-limit', events: 5, time: 9 });
    expect(() => new Simulator({ eventLimit: -1 })).toThrow(RangeError);
  });
});

describe('Simulator scheduling errors', () => {
  it('throws RangeError naming the kind, the time and now for a past time', () => {
    const { sim, a, b } = logged();
    sim.at(10, a, 0);
    sim.run();
    expect(() => sim.at(9.5, b, 0)).toThrow(RangeError);
    expect(() => sim.at(9.5, b, 0)).toThrow(/'b'.*9\.5.*10/);
    expect(() => sim.after(-1, a, 0)).toThrow(/'a'.*9.*10/);
  });

  it('refuses run() from inside a handler, and runs again afterwards', () => {
    const sim = new Simulator();
    let caught: unknown;
    const k = sim.defineEvent('nested', () => {
      try {
        sim.run();
      } catch (e) {
        caught = e;
      }
    });
    sim.at(1, k, 0);
    sim.at(2, k, 0);
    expect(sim.run(1)).toMatchObject({ reason: 'until', events: 1 });
    expect(caught).toBeInstanceOf(Error);
    expect(sim.run()).toMatchObject({ reason: 'drained', events: 1, time: 2 });
  });

  it('throws RangeError for NaN and infinite times, unknown kinds and non-int32 subjects', () => {
    const { sim, a } = logged();
    expect(() => sim.at(Number.NaN, a, 0)).toThrow(/'a'.*NaN/);
    expect(() => sim.at(Infinity, a, 0)).toThrow(RangeError);
    expect(() => sim.at(1, 7, 0)).toThrow(RangeError);
    expect(() => sim.at(1, 7, 0)).toThrow(/kind 7/);
    expect(() => sim.at(1, -1, 0)).toThrow(RangeError);
    expect(() => sim.at(1, a, 0.5)).toThrow(RangeError);
    expect(() => sim.at(1, a, 2 ** 31)).toThrow(RangeError);
    expect(sim.pending).toBe(0);
  });
});
