/**
 * EventQueue unit tests. Oracle for every ordering check: common practice (discrete-event
 * simulation ordering rule: future-event list ordered by (time, insertion number), FIFO on ties): smallest time first, equal times in
 * the order they were pushed.
 */
import { describe, it, expect } from 'vitest';
import { EventQueue } from '../../src/kernel/index.js';
import { ReferenceQueue } from './reference-queue.js';

interface Popped {
  time: number;
  kind: number;
  subject: number;
}

function drain(q: EventQueue): Popped[] {
  const out: Popped[] = [];
  while (q.pop()) out.push({ time: q.lastTime, kind: q.lastKind, subject: q.lastSubject });
  return out;
}

describe('EventQueue basics', () => {
  it('is empty at first: pop() false, peekTime() Infinity, size 0', () => {
    const q = new EventQueue();
    expect(q.size).toBe(0);
    expect(q.pop()).toBe(false);
    expect(q.peekTime()).toBe(Infinity);
  });

  it('returns a whole trace in (time, push order) — common practice (future-event list ordered by (time, insertion number), FIFO on ties)', () => {
    const q = new EventQueue({ wheelSpan: 8 });
    q.push(5, 0, 1);
    q.push(2.5, 1, 2);
    q.push(20, 2, 3); // beyond the first window [0, 8): heap
    q.push(5, 3, 4);
    q.push(0, 4, 5);
    expect(q.size).toBe(5);
    expect(q.peekTime()).toBe(0);
    expect(drain(q)).toEqual([
      { time: 0, kind: 4, subject: 5 },
      { time: 2.5, kind: 1, subject: 2 },
      { time: 5, kind: 0, subject: 1 },
      { time: 5, kind: 3, subject: 4 },
      { time: 20, kind: 2, subject: 3 },
    ]);
  });

  it('keeps int32 kinds and subjects intact, negative ones included', () => {
    const q = new EventQueue();
    q.push(1, -2147483648, 2147483647);
    q.push(1.5, 2147483647, -1);
    expect(drain(q)).toEqual([
      { time: 1, kind: -2147483648, subject: 2147483647 },
      { time: 1.5, kind: 2147483647, subject: -1 },
    ]);
  });

  it('runs same-time events FIFO when the earlier ones sit in the heap and later ones in the wheel — common practice (future-event list ordered by (time, insertion number), FIFO on ties)', () => {
    const q = new EventQueue({ wheelSpan: 4 });
    q.push(10, 0, 1); // 10 is outside [0, 4): heap
    q.push(10, 0, 2); // heap
    q.push(9, 0, 0);
    expect(q.pop()).toBe(true); // pops 9: the window is now [9, 13), so 10 goes to the wheel
    q.push(10, 0, 3);
    q.push(10.5, 0, 5);
    q.push(10, 0, 4);
    expect(drain(q).map((e) => [e.time, e.subject])).toEqual([
      [10, 1],
      [10, 2],
      [10, 3],
      [10, 4],
      [10.5, 5],
    ]);
  });

  it('takes a push below a time already found by peekTime() — common practice (future-event list ordered by (time, insertion number), FIFO on ties)', () => {
    const q = new EventQueue({ wheelSpan: 16 });
    q.push(10, 0, 1);
    expect(q.peekTime()).toBe(10);
    q.push(7, 0, 2);
    expect(q.peekTime()).toBe(7);
    expect(drain(q).map((e) => e.time)).toEqual([7, 10]);
  });

  it('orders whole-number times above 2^31 and 2^32 correctly (where `t | 0` would wrap) — common practice (future-event list ordered by (time, insertion number), FIFO on ties)', () => {
    const q = new EventQueue({ wheelSpan: 16 });
    const b = 2 ** 32 + 3;
    q.push(b, 0, 0);
    expect(q.pop()).toBe(true);
    q.push(b + 2, 0, 3);
    q.push(b + 1, 0, 1);
    q.push(b + 1.5, 0, 2);
    q.push(b + 1, 0, 9);
    q.push(2 ** 31 + b, 0, 4);
    expect(drain(q).map((e) => [e.time - b, e.subject])).toEqual([
      [1, 1],
      [1, 9],
      [1.5, 2],
      [2, 3],
      [2 ** 31, 4],
    ]);
  });

  it('grows the heap and the wheel pool from a capacity of 1', () => {
    const q = new EventQueue({ initialCapacity: 1, wheelSpan: 64 });
    const ref = new ReferenceQueue();
    for (let i = 0; i < 500; i++) {
      const time = (i * 37) % 101 + (i % 3 === 0 ? 0.25 : 0); // wheel and heap entries, many ties
      q.push(time, 0, i);
      ref.push(time, 0, i);
    }
    expect(q.size).toBe(500);
    const expected = [];
    for (let e = ref.pop(); e !== undefined; e = ref.pop()) expected.push(e.subject);
    expect(drain(q).map((e) => e.subject)).toEqual(expected);
  });

  it('rejects a wheel span that is not a power of two, and a bad capacity', () => {
    expect(() => new EventQueue({ wheelSpan: 1000 })).toThrow(RangeError);
    expect(() => new EventQueue({ wheelSpan: 1 })).toThrow(RangeError);
    expect(() => new EventQueue({ initialCapacity: 0 })).toThrow(RangeError);
    expect(() => new EventQueue({ wheelSpan: 2 })).not.toThrow();
  });
});

describe('EventQueue wheel wrap-around and clear()', () => {
  it('matches the (time, seq) oracle over 400 wheel spans of a hold model — common practice (future-event list ordered by (time, insertion number), FIFO on ties)', () => {
    const span = 8;
    const q = new EventQueue({ wheelSpan: span, initialCapacity: 2 });
    const ref = new ReferenceQueue();
    const steps = [0, 1, 3, 7, 8, 9, 0.5, 2, 17, 0]; // whole steps < span reuse slots; 8, 9, 17 leave the window
    for (let i = 0; i < 4; i++) {
      q.push(i % 3, 0, i);
      ref.push(i % 3, 0, i);
    }
    let last = -Infinity;
    for (let k = 0; k < 3000; k++) {
      expect(q.peekTime()).toBe(ref.peekTime());
      expect(q.pop()).toBe(true);
      const e = ref.pop()!;
      expect([q.lastTime, q.lastSubject]).toEqual([e.time, e.subject]);
      expect(q.lastTime).toBeGreaterThanOrEqual(last);
      last = q.lastTime;
      const step = steps[k % steps.length]!;
      const time = Math.ceil(last) + step; // whole unless step is 0.5
      q.push(time, 0, 100 + k);
      ref.push(time, 0, 100 + k);
    }
    expect(last).toBeGreaterThan(400 * span);
    expect(q.size).toBe(ref.size);
  });

  it('clear() empties the queue and forgets the past: earlier times and FIFO work again', () => {
    const q = new EventQueue({ wheelSpan: 16 });
    for (let i = 0; i < 40; i++) q.push(100 + (i % 7) + (i % 2) * 0.5, 0, i);
    for (let i = 0; i < 10; i++) q.pop();
    q.clear();
    expect(q.size).toBe(0);
    expect(q.pop()).toBe(false);
    expect(q.peekTime()).toBe(Infinity);
    q.push(3, 1, 1);
    q.push(1, 1, 2);
    q.push(3, 1, 3);
    q.push(1.5, 1, 4);
    expect(q.peekTime()).toBe(1);
    expect(drain(q).map((e) => e.subject)).toEqual([2, 4, 1, 3]);
  });
});
