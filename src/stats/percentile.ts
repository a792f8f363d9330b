/** Exact nearest-rank percentiles of small sorted samples. */

/**
 * Nearest rank r = ⌈q·n⌉ clamped to [1, n] (rank 1 for q = 0). A product q·n within a relative
 * 1e-9 of an integer counts as that integer, so binary rounding (0.95·100 = 95.00000000000001)
 * does not shift the rank.
 */
export function nearestRank(q: number, n: number): number {
  if (!(q >= 0 && q <= 1)) throw new RangeError(`quantile level must be in [0, 1], got ${q}`);
  const x = q * n;
  const r = Math.ceil(x - 1e-9 * Math.max(1, x));
  return Math.min(n, Math.max(1, r));
}

/**
 * Nearest-rank q-quantile of an ascending-sorted sample: the ⌈q·n⌉-th smallest value
 * (the smallest for q = 0). NaN when empty. The caller guarantees the order.
 */
export function percentileExact(sorted: ArrayLike<number>, q: number): number {
  const r = nearestRank(q, sorted.length);
  if (sorted.length === 0) return NaN;
  return sorted[r - 1] as number;
}
