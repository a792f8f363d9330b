/**
 * MSER-5 warm-up truncation (White 1997; White, Cobb & Spratt 2000): batch the series in batches
 * of 5 and choose the truncation d (in batches, 0 ≤ d ≤ ⌊k/2⌋) that minimises
 * MSER(d) = Σ_{j>d} (Z_j − Z̄_d)² / (k − d)², where Z_j are the k batch means and Z̄_d is the mean
 * of those kept. Ties go to the smallest d.
 */
import { batchMeansOf } from './batch-means.js';

export interface MserResult {
  /** Observations to discard from the start (5 · truncatedBatches). */
  readonly truncateObservations: number;
  /** Batches of 5 to discard. */
  readonly truncatedBatches: number;
  /** Mean of the kept batch means (a trailing partial batch is ignored). */
  readonly mean: number;
}

const BATCH = 5;

/**
 * MSER-5 truncation point of `data`. With fewer than two full batches nothing is truncated and
 * `mean` is the plain mean of the data (NaN when empty). O(k) in the number of batches k.
 */
export function mser5(data: ArrayLike<number>): MserResult {
  const z = batchMeansOf(data, BATCH);
  const k = z.length;
  if (k < 2) {
    let total = 0;
    for (let i = 0; i < data.length; i++) total += data[i] as number;
    return { truncateObservations: 0, truncatedBatches: 0, mean: data.length > 0 ? total / data.length : NaN };
  }
  // Welford's update, adding batch means from the end backwards: O(k) and numerically stable.
  let bestD = 0;
  let bestStat = Infinity;
  let bestMean = NaN;
  let m = 0;
  let mean = 0;
  let squares = 0;
  for (let d = k - 1; d >= 0; d--) {
    const x = z[d] as number;
    m++;
    const delta = x - mean;
    mean += delta / m;
    squares += delta * (x - mean);
    if (d > Math.floor(k / 2)) continue;
    const stat = squares / (m * m);
    if (stat <= bestStat) {
      bestStat = stat;
      bestD = d;
      bestMean = mean;
    }
  }
  return { truncateObservations: bestD * BATCH, truncatedBatches: bestD, mean: bestMean };
}
