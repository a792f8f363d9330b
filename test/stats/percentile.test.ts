import { describe, it, expect } from 'vitest';
import { percentileExact } from '../../src/stats/index.js';

describe('percentileExact (nearest rank)', () => {
  // from memory: the common nearest-rank worked example 15, 20, 35, 40, 50.
  const sorted = [15, 20, 35, 40, 50];
  it.each([
    [0.05, 15],
    [0.3, 20],
    [0.4, 20],
    [0.5, 35],
    [1, 50],
  ])('q = %f → %f (from memory: nearest-rank example)', (q, expected) => {
    expect(percentileExact(sorted, q)).toBe(expected);
  });

  it('q·n that is an integer up to rounding keeps its rank (exact: ⌈0.95·100⌉ = 95)', () => {
    const values = Array.from({ length: 100 }, (_, i) => i + 1);
    expect(percentileExact(values, 0.95)).toBe(95);
    expect(percentileExact(values, 0)).toBe(1);
    expect(Number.isNaN(percentileExact([], 0.5))).toBe(true);
    expect(() => percentileExact(values, 1.5)).toThrow(RangeError);
  });
});
