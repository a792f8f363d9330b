/**
 * CandidateQueue property tests against a direct reference of its documented rules (common
 * practice: a model-based test). Reference: per device a state (absent / pending / ready),
 * eligibleAt, priority, expiresAt and one clock; take() sorts the ready devices by (−priority, index).
 * The host must see exactly one flag change per change of readiness, never a redundant one.
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { CandidateQueue } from '../../src/predict/candidates.js';
import { FakeHost } from './fake-host.js';

const N = 16;

interface RefEntry {
  state: 'pending' | 'ready';
  eligibleAt: number;
  priority: number;
  expiresAt: number;
}

class Reference {
  clock = -Infinity;
  readonly entries = new Map<number, RefEntry>();

  schedule(d: number, e: number, p: number, x: number): void {
    this.entries.delete(d);
    if (x <= this.clock || x <= e) return;
    this.entries.set(d, { state: e <= this.clock ? 'ready' : 'pending', eligibleAt: e, priority: p, expiresAt: x });
  }

  advance(now: number): void {
    if (now < this.clock) return;
    this.clock = now;
    for (const [d, en] of this.entries) {
      if (en.state === 'pending' && en.eligibleAt <= now) en.state = 'ready';
      if (en.state === 'ready' && en.expiresAt <= now) this.entries.delete(d);
    }
  }

  take(k: number): number[] {
    const ready = [...this.entries.entries()].filter(([, e]) => e.state === 'ready');
    ready.sort((a, b) => (a[1].priority > b[1].priority ? -1 : a[1].priority < b[1].priority ? 1 : a[0] - b[0]));
    const out = ready.slice(0, k).map(([d]) => d);
    for (const d of out) this.entries.delete(d);
    return out;
  }
}

type Op =
  | { op: 'schedule'; d: number; e: number; p: number; x: number }
  | { op: 'remove'; d: number }
  | { op: 'advance'; dt: number }
  | { op: 'take'; k: number };

const timeArb = fc.integer({ min: 0, max: 30 });
const opArb: fc.Arbitrary<Op> = fc.oneof(
  fc.record({
    op: fc.constant('schedule' as const),
    d: fc.integer({ min: 0, max: N - 1 }),
    e: timeArb,
    p: fc.integer({ min: -3, max: 3 }),
    x: fc.oneof(timeArb, fc.constant(Infinity)),
  }),
  fc.record({ op: fc.constant('remove' as const), d: fc.integer({ min: 0, max: N - 1 }) }),
  fc.record({ op: fc.constant('advance' as const), dt: fc.integer({ min: -2, max: 5 }) }),
  fc.record({ op: fc.constant('take' as const), k: fc.integer({ min: 0, max: 5 }) }),
);

describe('CandidateQueue', () => {
  it('follows the reference rules; flags track readiness with no redundant calls', () => {
    fc.assert(
      fc.property(fc.array(opArb, { minLength: 20, maxLength: 150, size: 'max' }), (ops) => {
        const host = new FakeHost(N);
        const q = new CandidateQueue(N, host);
        const ref = new Reference();
        let t = 0;
        const out = new Int32Array(N);
        for (const o of ops) {
          if (o.op === 'schedule') {
            q.schedule(o.d, o.e, o.p, o.x);
            ref.schedule(o.d, o.e, o.p, o.x);
          } else if (o.op === 'remove') {
            expect(q.remove(o.d)).toBe(ref.entries.delete(o.d));
          } else if (o.op === 'advance') {
            t += o.dt; // a negative step must be ignored by both
            q.advance(t);
            ref.advance(t);
          } else {
            const n = q.take(o.k, out);
            expect([...out.subarray(0, n)]).toEqual(ref.take(o.k));
          }
          let ready = 0;
          for (let d = 0; d < N; d++) {
            const r = ref.entries.get(d)?.state === 'ready';
            if (r) ready++;
            const same = q.isReady(d) === r && q.isPending(d) === (ref.entries.get(d)?.state === 'pending') && host.flagged[d] === (r ? 1 : 0);
            if (!same) expect({ device: d, ready: q.isReady(d), pending: q.isPending(d), flag: host.flagged[d] }).toEqual({ device: d, ref: ref.entries.get(d) });
          }
          if (q.readyCount !== ready) expect(q.readyCount).toBe(ready);
        }
        expect(host.redundant).toBe(0);
      }),
      { numRuns: 200 },
    );
  });

  it('scalePriorities keeps the ranking of distinct priorities', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), { minLength: 1, maxLength: N }),
        fc.double({ min: 1e-200, max: 1e200, noNaN: true }).filter((f) => f > 0),
        (prios, factor) => {
          const host = new FakeHost(N);
          const q = new CandidateQueue(N, host);
          q.advance(0);
          prios.forEach((p, d) => q.schedule(d, 0, p, Infinity));
          q.scalePriorities(factor);
          const out = new Int32Array(N);
          const n = q.take(N, out);
          const expected = prios.map((p, d) => [p, d] as const).sort((a, b) => b[0] - a[0] || a[1] - b[1]).map((e) => e[1]);
          // Scaling by a positive factor is monotone; rounding can only merge neighbours into ties.
          const got = [...out.subarray(0, n)];
          for (let i = 1; i < got.length; i++) {
            const a = prios[got[i - 1] as number] as number, b = prios[got[i] as number] as number;
            if (a < b) expect((a * factor) === (b * factor)).toBe(true);
          }
          expect(new Set(got)).toEqual(new Set(expected));
        },
      ),
      { numRuns: 200 },
    );
  });
});
