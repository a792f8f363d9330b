/**
 * EventQueue property tests. Oracle: common practice (discrete-event simulation ordering rule:
 * future-event list ordered by (time, insertion number), FIFO on ties) — events leave by smallest time, equal times in push order; a
 * stable sort by time of the push list, or a linear-scan reference queue, gives that order.
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { EventQueue } from '../../src/kernel/index.js';
import { ReferenceQueue, stableOrder } from './reference-queue.js';

/** Wheel spans from tiny (most whole times leave the window) to the default. */
const spanArb = fc.constantFrom(2, 4, 16, 4096);

/** Times with many ties, fractions, whole numbers across many spans, and values past 2^31. */
const timeArb = fc.oneof(
  fc.integer({ min: -50, max: 50 }),
  fc.integer({ min: 0, max: 200 }).map((v) => v / 4),
  fc.integer({ min: 0, max: 100 }).map((v) => v * 16 + 3),
  fc.integer({ min: -20, max: 20 }).map((d) => 2 ** 31 + d),
  fc.integer({ min: 0, max: 20 }).map((d) => 2 ** 40 + d),
  fc.double({ min: 0, max: 1e6, noNaN: true }),
);

describe('EventQueue properties', () => {
  it('(c) delivers N pushed events exactly once, in the order of a stable sort by (time, seq)', () => {
    fc.assert(
      fc.property(spanArb, fc.array(timeArb, { maxLength: 300 }), (span, times) => {
        const q = new EventQueue({ wheelSpan: span, initialCapacity: 1 });
        times.forEach((t, i) => q.push(t, i % 3, i));
        expect(q.size).toBe(times.length);
        const popped: number[] = [];
        while (q.pop()) {
          expect(q.lastTime === times[q.lastSubject]).toBe(true); // numeric equality (-0 === 0)
          expect(q.lastKind).toBe(q.lastSubject % 3);
          popped.push(q.lastSubject);
        }
        expect(popped).toEqual(stableOrder(times));
        expect(q.size).toBe(0);
      }),
      { numRuns: 300 },
    );
  });

  /** One step of an interleaved run: pop, or push at a time relative to the last popped time. */
  type Op = { pop: true } | { peek: true } | { pop: false; mode: 'whole' | 'frac' | 'same' | 'far'; v: number };
  const opArb: fc.Arbitrary<Op> = fc.oneof(
    fc.constant<Op>({ pop: true }),
    fc.constant<Op>({ peek: true }),
    fc.record({
      pop: fc.constant(false as const),
      mode: fc.constantFrom('whole' as const, 'frac' as const, 'same' as const, 'far' as const),
      v: fc.integer({ min: 0, max: 40 }),
    }),
  );

  function timeOf(op: { mode: string; v: number }, last: number, span: number): number {
    if (op.mode === 'whole') return Math.ceil(last) + op.v;
    if (op.mode === 'frac') return last + op.v / 8;
    if (op.mode === 'far') return Math.ceil(last) + span * (1 + op.v);
    return last;
  }

  it('(b, c) matches the (time, seq) reference queue under interleaved pushes and pops, ties across heap and wheel', () => {
    fc.assert(
      fc.property(spanArb, fc.array(opArb, { maxLength: 400 }), (span, ops) => {
        const q = new EventQueue({ wheelSpan: span, initialCapacity: 2 });
        const ref = new ReferenceQueue();
        let last = 0;
        let id = 0;
        for (const op of ops) {
          if ('peek' in op) {
            expect(q.peekTime()).toBe(ref.peekTime()); // a peek may move the wheel's scan cursor
          } else if (op.pop) {
            expect(q.peekTime()).toBe(ref.peekTime());
            const e = ref.pop();
            expect(q.pop()).toBe(e !== undefined);
            if (e === undefined) continue;
            expect([q.lastTime, q.lastSubject]).toEqual([e.time, e.subject]);
            last = e.time;
          } else {
            const t = timeOf(op, last, span);
            q.push(t, 0, id);
            ref.push(t, 0, id++);
          }
          expect(q.size).toBe(ref.size);
        }
        for (let e = ref.pop(); e !== undefined; e = ref.pop()) {
          expect(q.pop()).toBe(true);
          expect([q.lastTime, q.lastSubject]).toEqual([e.time, e.subject]);
        }
        expect(q.pop()).toBe(false);
      }),
      { numRuns: 300 },
    );
  });
});
