// Tests of src/random/distributions.ts: sampleWithoutReplacement (Floyd) and shuffleInPlace (Fisher-Yates).
import { describe, expect, it } from 'vitest';
import { sampleWithoutReplacement, shuffleInPlace } from '../../src/random/index.js';
import { testStream, Z } from './helpers.js';

/**
 * Runs `reps` samples of k from n and returns inclusion counts per element; counts a
 * violation when a sample holds a value out of range or twice.
 */
function inclusionCounts(n: number, k: number, reps: number): { counts: Float64Array; violations: number } {
  const s = testStream(`floyd/${n}/${k}`);
  const out = new Int32Array(k);
  const counts = new Float64Array(n);
  const seen = new Uint8Array(n);
  let violations = 0;
  for (let r = 0; r < reps; r++) {
    if (sampleWithoutReplacement(s, n, k, out) !== k) violations++;
    for (let i = 0; i < k; i++) {
      const v = out[i] as number;
      if (!(v >= 0 && v < n) || seen[v] === 1) {
        violations++;
        continue;
      }
      seen[v] = 1;
      counts[v]! += 1;
    }
    seen.fill(0);
  }
  return { counts, violations };
}

describe('sampleWithoutReplacement', () => {
  // exact: each element is included with probability k/n; frequency SE sqrt(pi(1-pi)/R).
  const cases: [n: number, k: number, reps: number][] = [[54, 5, 20_000], [10, 10, 200], [300, 100, 3000]];
  for (const [n, k, reps] of cases) {
    it(`n = ${n}, k = ${k}: distinct, in range, inclusion frequency ≈ k/n`, () => {
      const { counts, violations } = inclusionCounts(n, k, reps);
      expect(violations).toBe(0);
      const pi = k / n;
      const tol = Z * Math.sqrt((pi * (1 - pi)) / reps) + 1e-12;
      const worst = counts.reduce((w, c) => Math.max(w, Math.abs(c / reps - pi)), 0);
      expect(worst).toBeLessThanOrEqual(tol);
    });
  }

  it('k = 0 writes nothing; bad arguments throw RangeError', () => {
    const s = testStream('floyd-edges');
    const out = new Int32Array(3);
    expect(sampleWithoutReplacement(s, 0, 0, out)).toBe(0);
    expect(() => sampleWithoutReplacement(s, 5, 6, new Int32Array(6))).toThrow(RangeError);
    expect(() => sampleWithoutReplacement(s, 5, 4, out)).toThrow(RangeError);
    expect(() => sampleWithoutReplacement(s, 5.5, 1, out)).toThrow(RangeError);
  });
});

describe('shuffleInPlace', () => {
  it('keeps the multiset and puts each value in each position with frequency 1/len (exact)', () => {
    const len = 6;
    const reps = 30_000;
    const s = testStream('shuffle');
    const a = new Int32Array(len);
    const atPos = new Float64Array(len * len);
    let broken = 0;
    for (let r = 0; r < reps; r++) {
      for (let i = 0; i < len; i++) a[i] = i;
      shuffleInPlace(s, a);
      if (Array.from(a).sort().join() !== '0,1,2,3,4,5') broken++;
      for (let i = 0; i < len; i++) atPos[i * len + (a[i] as number)]! += 1;
    }
    expect(broken).toBe(0);
    const tol = Z * Math.sqrt(((1 / len) * (1 - 1 / len)) / reps);
    const worst = atPos.reduce((w, c) => Math.max(w, Math.abs(c / reps - 1 / len)), 0);
    expect(worst).toBeLessThan(tol);
  });

  it('shuffles only the prefix when length is given', () => {
    const s = testStream('shuffle-prefix');
    const a = Int32Array.from([0, 1, 2, 3, 4, 5, 6, 7]);
    shuffleInPlace(s, a, 4);
    expect(Array.from(a.subarray(4))).toEqual([4, 5, 6, 7]);
    expect(Array.from(a.subarray(0, 4)).sort()).toEqual([0, 1, 2, 3]);
    expect(() => shuffleInPlace(s, a, 9)).toThrow(RangeError);
  });
});
