/**
 * Non-overlapping batch means for one long run (Law & Kelton, Simulation Modeling and Analysis,
 * 3rd ed., sec. 9.5.3).
 */
import { summarize } from './summary.js';

export interface BatchMeansResult {
  /** Mean of each full batch, in order. */
  readonly means: number[];
  /** Mean of the batch means. */
  readonly grandMean: number;
  /** Student-t half-width over the batch means (k − 1 degrees of freedom); NaN with k < 2. */
  readonly halfWidth: number;
}

/** Means of consecutive full batches of `batchSize` observations; a trailing partial batch is dropped. */
export function batchMeansOf(data: ArrayLike<number>, batchSize: number): number[] {
  if (!(Number.isInteger(batchSize) && batchSize >= 1)) {
    throw new RangeError(`batch size must be an integer ≥ 1, got ${batchSize}`);
  }
  const k = Math.floor(data.length / batchSize);
  const means = new Array<number>(k);
  for (let b = 0; b < k; b++) {
    let total = 0;
    for (let i = b * batchSize; i < (b + 1) * batchSize; i++) total += data[i] as number;
    means[b] = total / batchSize;
  }
  return means;
}

/**
 * Batch means with a confidence half-width at `level` (default 0.95) treating the k batch means
 * as independent: grandMean ± t_{k−1,1−α/2} · s_means / √k.
 */
export function batchMeans(data: ArrayLike<number>, batchSize: number, level = 0.95): BatchMeansResult {
  const means = batchMeansOf(data, batchSize);
  const s = summarize(means, level);
  return { means, grandMean: s.mean, halfWidth: s.half_width };
}
