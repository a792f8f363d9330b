/**
 * ln(k!) for non-negative integers k, used by the rejection steps of the Poisson and
 * binomial samplers. Exact sums of logs below TABLE_SIZE (relative error ~1e-15),
 * Stirling's series above (truncation error < 1/(1680 k^7), far below double precision).
 */

const TABLE_SIZE = 256;
const HALF_LOG_TWO_PI = 0.9189385332046728; // ln(2π)/2

const TABLE: Float64Array = buildTable();

function buildTable(): Float64Array {
  const t = new Float64Array(TABLE_SIZE);
  for (let k = 2; k < TABLE_SIZE; k++) t[k] = (t[k - 1] as number) + Math.log(k);
  return t;
}

/** ln(k!) for an integer k >= 0 (not checked). */
export function logFactorial(k: number): number {
  if (k < TABLE_SIZE) return TABLE[k] as number;
  const inv = 1 / k;
  const inv2 = inv * inv;
  // Stirling: k ln k - k + ln(2πk)/2 + 1/(12k) - 1/(360k^3) + 1/(1260k^5)
  const series = inv * (1 / 12 - inv2 * (1 / 360 - inv2 / 1260));
  return k * Math.log(k) - k + HALF_LOG_TWO_PI + 0.5 * Math.log(k) + series;
}
