import { describe, it, expect } from 'vitest';
import { batchMeans, mser5 } from '../../src/stats/index.js';

describe('batchMeans', () => {
  it('data 1…20 in batches of 5 → 3, 8, 13, 18; grand mean 10.5; half-width 10.271301 (Law & Kelton, 3rd ed., batch means)', () => {
    const data = Array.from({ length: 20 }, (_, i) => i + 1);
    const r = batchMeans(data, 5);
    expect(r.means).toEqual([3, 8, 13, 18]);
    expect(r.grandMean).toBeCloseTo(10.5, 12);
    expect(r.halfWidth).toBeCloseTo(10.271301, 6);
  });

  it('drops a trailing partial batch (exact)', () => {
    const data = Float64Array.from({ length: 23 }, (_, i) => i + 1);
    expect(batchMeans(data, 5).means).toEqual([3, 8, 13, 18]);
    expect(() => batchMeans(data, 0)).toThrow(RangeError);
  });
});

describe('mser5', () => {
  it('25 × 10.0 then 175 values alternating 0, 1 → truncate 25 observations (5 batches), mean 0.497143 (White 1997, MSER-5)', () => {
    const data = [...Array<number>(25).fill(10), ...Array.from({ length: 175 }, (_, i) => i % 2)];
    const r = mser5(data);
    expect(r.truncateObservations).toBe(25);
    expect(r.truncatedBatches).toBe(5);
    expect(r.mean).toBeCloseTo(0.497143, 6);
  });

  it('truncates nothing for a constant series and never more than half the batches (White 1997, MSER-5)', () => {
    expect(mser5(Array<number>(100).fill(3))).toEqual({ truncateObservations: 0, truncatedBatches: 0, mean: 3 });
    // A series that keeps drifting: the truncation is capped at ⌊k/2⌋ = 10 batches.
    const drift = Array.from({ length: 100 }, (_, i) => 1 / (i + 1));
    expect(mser5(drift).truncatedBatches).toBeLessThanOrEqual(10);
  });
});
