/**
 * Streaming quantiles with bounded memory for non-negative values (delays in ms, ages, counts).
 *
 * Layout: values in [0, 1) fall in `subBuckets` linear buckets of width 1/subBuckets; values in
 * [2^e, 2^(e+1)) fall in `subBuckets` equal buckets of width 2^e/subBuckets, for e = 0 … ⌊log2 maxValue⌋.
 * Bucketing is exact (divisions by powers of two), so a bucket's midpoint is within half a bucket
 * width of any value in it: relative error ≤ 1/(2·subBuckets) at or above 1, absolute error
 * ≤ 1/(2·subBuckets) below 1. Each power of two's block is allocated on first use, so memory is at
 * most (⌊log2 maxValue⌋ + 2) · subBuckets counters whatever the number of values added.
 */
import { nearestRank } from './percentile.js';

export interface HistogramOptions {
  /** Buckets per power of two (and in [0, 1)); a power of two, default 1024. */
  readonly subBuckets?: number;
  /** Largest value accepted, ≥ 1; default 2^40. */
  readonly maxValue?: number;
}

/** 2^0 … 2^1023, exact. */
const POW2 = Float64Array.from({ length: 1024 }, (_, i) => 2 ** i);

/** ⌊log2 v⌋ for v ≥ 1, corrected for rounding of Math.log2 near powers of two. */
function exponentOf(v: number): number {
  let e = Math.floor(Math.log2(v));
  if ((POW2[e] as number) > v) e--;
  else if (e + 1 < POW2.length && (POW2[e + 1] as number) <= v) e++;
  return e;
}

export class LogLinearHistogram {
  readonly subBuckets: number;
  readonly maxValue: number;
  /** Block 0: [0, 1); block b ≥ 1: [2^(b−1), 2^b). */
  readonly #blocks: Array<Float64Array | undefined>;
  #count = 0;
  #sum = 0;
  /** Neumaier compensation term of the sum. */
  #sumError = 0;
  #min = Infinity;
  #max = -Infinity;

  constructor(options: HistogramOptions = {}) {
    const subBuckets = options.subBuckets ?? 1024;
    const maxValue = options.maxValue ?? 2 ** 40;
    if (!(Number.isInteger(subBuckets) && subBuckets >= 1 && subBuckets <= 2 ** 20 && (subBuckets & (subBuckets - 1)) === 0)) {
      throw new RangeError(`subBuckets must be a power of two in [1, 2^20], got ${subBuckets}`);
    }
    if (!(maxValue >= 1 && maxValue < 2 ** 1023)) {
      throw new RangeError(`maxValue must be in [1, 2^1023), got ${maxValue}`);
    }
    this.subBuckets = subBuckets;
    this.maxValue = maxValue;
    this.#blocks = new Array<Float64Array | undefined>(exponentOf(maxValue) + 2).fill(undefined);
  }

  /** Records one value (hot path: no allocation except the first value in a new power of two). */
  add(value: number): void {
    if (!(value >= 0 && value <= this.maxValue)) {
      throw new RangeError(`histogram value must be in [0, ${this.maxValue}], got ${value}`);
    }
    const s = this.subBuckets;
    let block = 0;
    let sub: number;
    if (value < 1) {
      sub = Math.floor(value * s);
    } else {
      const e = exponentOf(value);
      block = e + 1;
      sub = Math.floor((value / (POW2[e] as number) - 1) * s);
    }
    const counts = this.#blocks[block] ?? this.#allocate(block);
    counts[sub] = (counts[sub] as number) + 1;
    this.#count++;
    this.#addToSum(value);
    if (value < this.#min) this.#min = value;
    if (value > this.#max) this.#max = value;
  }

  /** Records every value of `values`. */
  addMany(values: ArrayLike<number>): void {
    for (let i = 0; i < values.length; i++) this.add(values[i] as number);
  }

  get count(): number {
    return this.#count;
  }
  /** Sum of the values (compensated summation). */
  get sum(): number {
    return this.#sum + this.#sumError;
  }
  /** Smallest value added; NaN when empty. */
  get min(): number {
    return this.#count > 0 ? this.#min : NaN;
  }
  /** Largest value added; NaN when empty. */
  get max(): number {
    return this.#count > 0 ? this.#max : NaN;
  }
  /** Counters allocated so far (bounded by `bucketCapacity`). */
  get allocatedBuckets(): number {
    return this.#blocks.reduce((n, b) => n + (b === undefined ? 0 : b.length), 0);
  }
  /** Largest number of counters this histogram can ever hold. */
  get bucketCapacity(): number {
    return this.#blocks.length * this.subBuckets;
  }

  /** Mean of the values; NaN when empty. */
  mean(): number {
    return this.#count > 0 ? this.sum / this.#count : NaN;
  }

  /**
   * Nearest-rank q-quantile (q in [0, 1]) on the bucketed values: the midpoint of the bucket holding
   * the ⌈q·count⌉-th smallest value, clamped to [min, max]. NaN when empty.
   */
  quantile(q: number): number {
    const rank = nearestRank(q, this.#count);
    if (this.#count === 0) return NaN;
    let cumulative = 0;
    for (let b = 0; b < this.#blocks.length; b++) {
      const counts = this.#blocks[b];
      if (counts === undefined) continue;
      for (let i = 0; i < counts.length; i++) {
        cumulative += counts[i] as number;
        if (cumulative >= rank) return this.#clamp(this.#lower(b, i) + this.#width(b) / 2);
      }
    }
    return this.#max;
  }

  /** Fraction of values ≤ x at bucket resolution (the whole bucket holding x counts); NaN when empty. */
  cdfAt(x: number): number {
    if (this.#count === 0) return NaN;
    if (x < this.#min) return 0;
    if (x >= this.#max) return 1;
    const block = x < 1 ? 0 : exponentOf(x) + 1;
    const sub = x < 1 ? Math.floor(x * this.subBuckets) : Math.floor((x / (POW2[block - 1] as number) - 1) * this.subBuckets);
    let cumulative = 0;
    for (let b = 0; b <= block; b++) {
      const counts = this.#blocks[b];
      if (counts === undefined) continue;
      const end = b === block ? sub + 1 : counts.length;
      for (let i = 0; i < end; i++) cumulative += counts[i] as number;
    }
    return cumulative / this.#count;
  }

  /**
   * Points of the empirical CDF for plots: [value, fraction of values below it], one per non-empty
   * bucket (value = the bucket's upper edge, the maximum for the last), thinned evenly to at most
   * `maxPoints` (≥ 2, default 256) keeping the first and last. Empty histogram → [].
   */
  cdfPoints(maxPoints = 256): Array<[number, number]> {
    if (!(Number.isInteger(maxPoints) && maxPoints >= 2)) {
      throw new RangeError(`maxPoints must be an integer ≥ 2, got ${maxPoints}`);
    }
    const points: Array<[number, number]> = [];
    let cumulative = 0;
    for (let b = 0; b < this.#blocks.length; b++) {
      const counts = this.#blocks[b];
      if (counts === undefined) continue;
      for (let i = 0; i < counts.length; i++) {
        const c = counts[i] as number;
        if (c === 0) continue;
        cumulative += c;
        points.push([this.#clamp(this.#lower(b, i) + this.#width(b)), cumulative / this.#count]);
      }
    }
    if (points.length <= maxPoints) return points;
    const thinned: Array<[number, number]> = [];
    for (let j = 0; j < maxPoints; j++) {
      thinned.push(points[Math.round((j * (points.length - 1)) / (maxPoints - 1))] as [number, number]);
    }
    return thinned;
  }

  /** Adds every value of `other` (same subBuckets and maxValue) into this histogram. */
  merge(other: LogLinearHistogram): void {
    if (other.subBuckets !== this.subBuckets || other.maxValue !== this.maxValue) {
      throw new RangeError(
        `cannot merge histograms with different layouts (subBuckets ${other.subBuckets} vs ${this.subBuckets}, maxValue ${other.maxValue} vs ${this.maxValue})`,
      );
    }
    if (other.#count === 0) return;
    other.#blocks.forEach((theirs, b) => {
      if (theirs === undefined) return;
      const ours = this.#blocks[b] ?? this.#allocate(b);
      for (let i = 0; i < theirs.length; i++) ours[i] = (ours[i] as number) + (theirs[i] as number);
    });
    this.#count += other.#count;
    this.#addToSum(other.#sum);
    this.#addToSum(other.#sumError);
    this.#min = Math.min(this.#min, other.#min);
    this.#max = Math.max(this.#max, other.#max);
  }

  /** Forgets every value (allocated blocks are kept and zeroed). */
  clear(): void {
    for (const counts of this.#blocks) counts?.fill(0);
    this.#count = 0;
    this.#sum = 0;
    this.#sumError = 0;
    this.#min = Infinity;
    this.#max = -Infinity;
  }

  #allocate(block: number): Float64Array {
    const counts = new Float64Array(this.subBuckets);
    this.#blocks[block] = counts;
    return counts;
  }

  /** Neumaier's compensated addition. */
  #addToSum(x: number): void {
    const t = this.#sum + x;
    this.#sumError += Math.abs(this.#sum) >= Math.abs(x) ? this.#sum - t + x : x - t + this.#sum;
    this.#sum = t;
  }

  #lower(block: number, sub: number): number {
    return block === 0 ? sub / this.subBuckets : (POW2[block - 1] as number) * (1 + sub / this.subBuckets);
  }

  #width(block: number): number {
    return block === 0 ? 1 / this.subBuckets : (POW2[block - 1] as number) / this.subBuckets;
  }

  #clamp(x: number): number {
    return Math.min(this.#max, Math.max(this.#min, x));
  }
}
