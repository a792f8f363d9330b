/**
 * Samplers. Each takes the Stream to draw from as its first argument and keeps no
 * state between calls. Argument checks are single comparisons; the documented
 * domains are the contract. Draw counts are stated where they are fixed, which keeps
 * common-random-number runs aligned when only a parameter changes.
 */
import type { Stream } from './stream.js';

export { binomial, poisson } from './counts.js';

const TWO_PI = 2 * Math.PI;
/** Above this k, Floyd's membership test uses a Set instead of a linear scan. */
const LINEAR_SCAN_MAX_K = 64;
/** Largest n whose values fit in an Int32Array. */
const INT32_SPAN = 2147483648;

/** Uniform in [a, b) (a <= b, finite). One draw. */
export function uniform(s: Stream, a: number, b: number): number {
  return a + (b - a) * s.next();
}

/**
 * Exponential with the given mean (> 0), by inversion -mean·ln(1-u). One draw.
 * Since u <= 1 - 2^-32 the result is finite, at most mean·32·ln 2 ≈ 22.2·mean.
 */
export function exponential(s: Stream, mean: number): number {
  return -mean * Math.log(1 - s.next());
}

/** True with probability p (p outside [0, 1] acts as clamped). One draw. */
export function bernoulli(s: Stream, p: number): boolean {
  return s.next() < p;
}

/**
 * Normal(mean, sd), sd >= 0, by Box-Muller using the cosine branch only (no cached
 * second value, so nothing is shared between calls). Two draws. Tails are cut at
 * |z| ≈ 6.66 by the 2^-32 resolution of the uniforms.
 */
export function normal(s: Stream, mean = 0, sd = 1): number {
  const r = Math.sqrt(-2 * Math.log(1 - s.next()));
  return mean + sd * r * Math.cos(TWO_PI * s.next());
}

/**
 * Gamma(shape, scale): density x^(shape-1) e^(-x/scale) / (Γ(shape) scale^shape),
 * mean shape·scale. shape > 0, scale > 0 (RangeError otherwise). Marsaglia & Tsang
 * (2000), "A simple method for generating gamma variables", ACM TOMS 26(3), 363-372;
 * for shape < 1 their boost Gamma(shape+1)·U^(1/shape). May underflow to 0 for very
 * small shapes.
 */
export function gamma(s: Stream, shape: number, scale = 1): number {
  if (!(shape > 0 && shape < Infinity)) throw new RangeError(`gamma: shape must be finite and > 0, got ${shape}`);
  if (!(scale > 0 && scale < Infinity)) throw new RangeError(`gamma: scale must be finite and > 0, got ${scale}`);
  if (shape >= 1) return standardGamma(s, shape) * scale;
  const g = standardGamma(s, shape + 1);
  return g * Math.pow(1 - s.next(), 1 / shape) * scale;
}

/** Marsaglia-Tsang for shape >= 1, scale 1. */
function standardGamma(s: Stream, shape: number): number {
  const d = shape - 1 / 3;
  const c = 1 / Math.sqrt(9 * d);
  for (;;) {
    let x: number;
    let v: number;
    do {
      x = normal(s);
      v = 1 + c * x;
    } while (v <= 0);
    v = v * v * v;
    const u = s.next();
    const x2 = x * x;
    if (u < 1 - 0.0331 * x2 * x2) return d * v;
    if (Math.log(u) < 0.5 * x2 + d * (1 - v + Math.log(v))) return d * v;
  }
}

/** ln of a Gamma(shape, 1) variate, shape > 0, safe from underflow for small shapes. */
function logStandardGamma(s: Stream, shape: number): number {
  if (shape >= 1) return Math.log(standardGamma(s, shape));
  const lg = Math.log(standardGamma(s, shape + 1));
  return lg + Math.log(1 - s.next()) / shape;
}

/**
 * Beta(a, b) on [0, 1], a > 0, b > 0 (RangeError otherwise), as X/(X+Y) with
 * X ~ Gamma(a), Y ~ Gamma(b) from this module's gamma sampler (computed in log
 * space when a or b < 1, so tiny shapes do not give 0/0). Mean a/(a+b).
 */
export function beta(s: Stream, a: number, b: number): number {
  if (!(a > 0 && a < Infinity)) throw new RangeError(`beta: a must be finite and > 0, got ${a}`);
  if (!(b > 0 && b < Infinity)) throw new RangeError(`beta: b must be finite and > 0, got ${b}`);
  if (a >= 1 && b >= 1) {
    const x = standardGamma(s, a);
    return x / (x + standardGamma(s, b));
  }
  const lx = logStandardGamma(s, a);
  const ly = logStandardGamma(s, b);
  return 1 / (1 + Math.exp(ly - lx));
}

/**
 * Number of independent trials, each a success with probability p, up to and including
 * the first success: P(K = k) = (1-p)^(k-1) p. Results above `max` are returned as
 * max + 1, meaning "no success within max trials". 0 <= p <= 1, max >= 0 an integer
 * (or Infinity for no cap); RangeError otherwise. Inversion, exactly one draw for
 * every p, so runs with different p stay aligned.
 */
export function geometricTrials(s: Stream, p: number, max: number): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`geometricTrials: p must be in [0, 1], got ${p}`);
  if (!(max >= 0)) throw new RangeError(`geometricTrials: max must be >= 0, got ${max}`);
  const logV = Math.log(1 - s.next()); // 1 - u in (0, 1]
  if (p === 0) return max + 1;
  const k = p === 1 ? 1 : Math.floor(logV / Math.log1p(-p)) + 1;
  return k > max ? max + 1 : k;
}

/**
 * Writes k distinct integers drawn uniformly from [0, n) into out[0..k) and returns k
 * (Floyd's algorithm, k calls to Stream.int). The set is uniform over all k-subsets;
 * the order within out is not a uniform permutation (shuffle it if order matters).
 * 0 <= k <= n <= 2^31, k <= out.length (RangeError otherwise). Allocation-free for
 * k <= 64; larger k use a temporary Set.
 */
export function sampleWithoutReplacement(s: Stream, n: number, k: number, out: Int32Array): number {
  if (!(Number.isInteger(n) && n >= 0 && n <= INT32_SPAN)) {
    throw new RangeError(`sampleWithoutReplacement: n must be an integer in [0, 2^31], got ${n}`);
  }
  if (!(Number.isInteger(k) && k >= 0 && k <= n && k <= out.length)) {
    throw new RangeError(`sampleWithoutReplacement: k must be an integer in [0, min(n, out.length)], got ${k}`);
  }
  return k <= LINEAR_SCAN_MAX_K ? floydLinear(s, n, k, out) : floydSet(s, n, k, out);
}

function floydLinear(s: Stream, n: number, k: number, out: Int32Array): number {
  let count = 0;
  for (let j = n - k; j < n; j++) {
    const t = s.int(j + 1);
    let seen = false;
    for (let i = 0; i < count; i++) {
      if (out[i] === t) {
        seen = true;
        break;
      }
    }
    out[count++] = seen ? j : t;
  }
  return k;
}

function floydSet(s: Stream, n: number, k: number, out: Int32Array): number {
  const chosen = new Set<number>();
  let count = 0;
  for (let j = n - k; j < n; j++) {
    const t = s.int(j + 1);
    const pick = chosen.has(t) ? j : t;
    chosen.add(pick);
    out[count++] = pick;
  }
  return k;
}

/**
 * Fisher-Yates shuffle of a[0..length) in place (length defaults to a.length; an
 * integer in [0, a.length], RangeError otherwise). length - 1 calls to Stream.int.
 */
export function shuffleInPlace(s: Stream, a: Int32Array, length: number = a.length): void {
  if (!(Number.isInteger(length) && length >= 0 && length <= a.length)) {
    throw new RangeError(`shuffleInPlace: length must be an integer in [0, ${a.length}], got ${length}`);
  }
  for (let i = length - 1; i > 0; i--) {
    const j = s.int(i + 1);
    const tmp = a[i] as number;
    a[i] = a[j] as number;
    a[j] = tmp;
  }
}
