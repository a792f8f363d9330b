/** Statistics over samples: pure functions and a bounded-memory histogram. */
export type { Summary } from './summary.js';
export { summarize, tQuantile, tHalfWidth } from './summary.js';
export { relativePrecisionReached, replicationsNeeded, adjustedPrecision } from './sequential.js';
export type { HistogramOptions } from './histogram.js';
export { LogLinearHistogram } from './histogram.js';
export type { BatchMeansResult } from './batch-means.js';
export { batchMeans, batchMeansOf } from './batch-means.js';
export type { MserResult } from './mser.js';
export { mser5 } from './mser.js';
export { percentileExact, nearestRank } from './percentile.js';
