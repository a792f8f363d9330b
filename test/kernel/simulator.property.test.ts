/**
 * Simulator property tests. Oracle: common practice (discrete-event simulation ordering rule:
 * future-event list ordered by (time, insertion number), FIFO on ties): time never decreases, equal times run in scheduling order, and
 * every scheduled event runs exactly once.
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { Simulator } from '../../src/kernel/index.js';

const spanArb = fc.constantFrom(2, 8, 64, 4096);

/** Delays: zero, whole, fractional, and far beyond any wheel span used here. */
const delayArb = fc.oneof(
  fc.constant(0),
  fc.integer({ min: 1, max: 20 }),
  fc.integer({ min: 1, max: 80 }).map((v) => v / 8),
  fc.integer({ min: 5000, max: 20000 }),
  fc.double({ min: 0, max: 100, noNaN: true }),
);

describe('Simulator properties', () => {
  it('(a) time never decreases and each scheduled event runs once, with handlers scheduling more', () => {
    fc.assert(
      fc.property(
        spanArb,
        fc.array(delayArb, { minLength: 1, maxLength: 40 }),
        fc.array(fc.integer({ min: 0, max: 2 }), { minLength: 1, maxLength: 40 }),
        fc.integer({ min: 1, max: 200 }),
        (span, delays, fanOut, budget) => {
          const sim = new Simulator({ wheelSpan: span });
          const times: number[] = [];
          const seen = new Set<number>();
          let scheduled = 0;
          let d = 0;
          const schedule = (kind: number): void => {
            sim.after(delays[d++ % delays.length]!, kind, scheduled++);
          };
          const handler = (subject: number, time: number): void => {
            expect(time).toBe(sim.now);
            expect(seen.has(subject)).toBe(false);
            seen.add(subject);
            times.push(time);
            const n = fanOut[subject % fanOut.length]!;
            for (let i = 0; i < n && scheduled < budget; i++) schedule(subject % 2);
          };
          sim.defineEvent('even', handler);
          sim.defineEvent('odd', handler);
          for (let i = 0; i < 3; i++) schedule(i % 2);
          const r = sim.run();
          expect(r.reason).toBe('drained');
          expect(r.events).toBe(scheduled);
          expect(seen.size).toBe(scheduled);
          for (let i = 1; i < times.length; i++) expect(times[i]!).toBeGreaterThanOrEqual(times[i - 1]!);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('(b) same-time events run in scheduling order, whether scheduled from beyond the wheel span or inside it', () => {
    // A ticker runs at every whole time 0..99 and, per the plan, schedules events at fixed
    // absolute targets: first while a target is far beyond the wheel window, later inside it.
    const targets = [40, 40.5, 64, 64, 80, 99];
    const planArb = fc.array(fc.array(fc.integer({ min: 0, max: 9 }), { maxLength: 3 }), { minLength: 100, maxLength: 100 });
    fc.assert(
      fc.property(fc.constantFrom(2, 8, 16), planArb, (span, plan) => {
        const sim = new Simulator({ wheelSpan: span });
        const log: [number, number][] = [];
        const scheduled: [number, number][] = [];
        let order = 0;
        const mark = sim.defineEvent('mark', (s, t) => log.push([t, s]));
        const tick = sim.defineEvent('tick', (k, t) => {
          for (const choice of plan[k]!) {
            const target = choice < targets.length ? targets[choice]! : t + (choice - targets.length); // t, t+1, t+2, t+3
            if (target < t) continue;
            scheduled.push([target, order]);
            sim.at(target, mark, order++);
          }
          if (k < 99) sim.after(1, tick, k + 1);
        });
        sim.at(0, tick, 0);
        sim.run();
        expect(log).toEqual([...scheduled].sort((x, y) => x[0] - y[0])); // stable sort = (time, order)
        for (let i = 1; i < log.length; i++) {
          const [t0, s0] = log[i - 1]!;
          const [t1, s1] = log[i]!;
          expect(t1).toBeGreaterThanOrEqual(t0);
          if (t1 === t0) expect(s1).toBeGreaterThan(s0);
        }
      }),
      { numRuns: 200 },
    );
  });
});
