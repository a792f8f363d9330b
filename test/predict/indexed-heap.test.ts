/**
 * IndexedHeap property tests. Oracle: common practice (a priority queue returns its items in the
 * order of a sort by (key, index)); the reference is a plain Map of device → key, sorted on demand.
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { IndexedHeap } from '../../src/predict/indexed-heap.js';

const CAP = 24;

type Op =
  | { op: 'insert' | 'update' | 'set'; d: number; key: number }
  | { op: 'remove'; d: number }
  | { op: 'pop' }
  | { op: 'scale'; f: number };

/** Keys with many ties, infinities and fractions. */
const keyArb = fc.oneof(
  fc.integer({ min: -5, max: 5 }),
  fc.double({ min: -1e6, max: 1e6, noNaN: true }),
  fc.constantFrom(Infinity, -Infinity, 0, -0),
);
const deviceArb = fc.integer({ min: 0, max: CAP - 1 });
const opArb: fc.Arbitrary<Op> = fc.oneof(
  fc.record({ op: fc.constantFrom('insert' as const, 'update' as const, 'set' as const), d: deviceArb, key: keyArb }),
  fc.record({ op: fc.constant('remove' as const), d: deviceArb }),
  fc.record({ op: fc.constant('pop' as const) }),
  fc.record({ op: fc.constant('scale' as const), f: fc.constantFrom(0.5, 3, 1e-100, 7.25) }),
);

/** The reference order: ascending key, ties by device index. */
function sorted(ref: Map<number, number>): number[] {
  return [...ref.entries()].sort((a, b) => (a[1] < b[1] ? -1 : a[1] > b[1] ? 1 : a[0] - b[0])).map((e) => e[0]);
}

function apply(h: IndexedHeap, ref: Map<number, number>, o: Op): void {
  if (o.op === 'insert') {
    if (ref.has(o.d)) expect(() => h.insert(o.d, o.key)).toThrow(RangeError);
    else { h.insert(o.d, o.key); ref.set(o.d, o.key); }
  } else if (o.op === 'update') {
    if (!ref.has(o.d)) expect(() => h.update(o.d, o.key)).toThrow(RangeError);
    else { h.update(o.d, o.key); ref.set(o.d, o.key); }
  } else if (o.op === 'set') {
    h.set(o.d, o.key);
    ref.set(o.d, o.key);
  } else if (o.op === 'remove') {
    expect(h.remove(o.d)).toBe(ref.delete(o.d));
  } else if (o.op === 'pop') {
    const expected = sorted(ref)[0] ?? -1;
    expect(h.pop()).toBe(expected);
    ref.delete(expected);
  } else if (o.op === 'scale') {
    h.scaleKeys(o.f);
    for (const [d, k] of ref) ref.set(d, k * o.f);
  }
}

describe('IndexedHeap', () => {
  it('matches a sorted reference under any sequence of operations', () => {
    fc.assert(
      fc.property(fc.array(opArb, { maxLength: 200, size: 'max' }), (ops) => {
        const h = new IndexedHeap(CAP);
        const ref = new Map<number, number>();
        for (const o of ops) {
          apply(h, ref, o);
          const order = sorted(ref);
          const top = order[0] ?? -1;
          const topKey = top < 0 ? Infinity : ref.get(top);
          let members = true;
          for (let d = 0; d < CAP; d++) members &&= h.has(d) === ref.has(d);
          if (h.size !== ref.size || h.peek() !== top || h.peekKey() !== topKey || !members) {
            expect({ size: h.size, peek: h.peek(), key: h.peekKey(), members }).toEqual({ size: ref.size, peek: top, key: topKey, members: true });
          }
        }
        const drained: number[] = [];
        for (let d = h.pop(); d >= 0; d = h.pop()) drained.push(d);
        expect(drained).toEqual(sorted(ref));
      }),
      { numRuns: 200 },
    );
  });

  it('clear empties it and leaves it reusable', () => {
    const h = new IndexedHeap(4);
    h.insert(2, 1);
    h.insert(0, 1);
    h.clear();
    expect(h.size).toBe(0);
    expect(h.has(2)).toBe(false);
    h.insert(2, 5);
    expect(h.pop()).toBe(2);
  });

  it('rejects NaN keys and devices out of range', () => {
    const h = new IndexedHeap(3);
    expect(() => h.insert(0, NaN)).toThrow(RangeError);
    expect(() => h.insert(3, 1)).toThrow(RangeError);
    expect(() => h.insert(-1, 1)).toThrow(RangeError);
    expect(h.remove(7)).toBe(false);
  });
});
