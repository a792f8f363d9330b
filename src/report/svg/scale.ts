/**
 * Axis ticks, scales and tick labels for the SVG charts.
 *
 * Tick values are produced as exact decimals: a tick k·m·10^e (m ∈ {1, 2, 5}) is parsed from the
 * decimal text "⟨k·m⟩e⟨e⟩", so it is the double nearest to the decimal and prints without noise
 * (0.6, never 0.6000000000000001).
 */

/** Largest magnitude accepted by `niceTicks`; beyond it the width of the range may overflow. */
export const MAX_MAGNITUDE = 1e100;

/** 10^e as the double nearest to the decimal (exact for 0 ≤ e ≤ 22). */
function pow10(e: number): number {
  return Number(`1e${e}`);
}

/** The decimal k·10^e as a double (k an integer). */
function decimal(k: number, e: number): number {
  return Number(`${k}e${e}`);
}

/** A "nice" number m·10^e with m ∈ {1, 2, 5, 10}, normalised to m ∈ {1, 2, 5}. */
interface Nice {
  readonly m: number;
  readonly e: number;
}

/**
 * Heckbert's nicenum: a nice number near x > 0; `round` picks the nearest (thresholds 1.5, 3, 7),
 * otherwise the smallest nice number ≥ x (Heckbert 1990, Graphics Gems, "Nice numbers for graph labels").
 */
function niceNumber(x: number, round: boolean): Nice {
  let e = Math.floor(Math.log10(x));
  if (pow10(e) > x) e -= 1;
  const f = x / pow10(e);
  let m: number;
  if (round) m = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
  else m = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return m === 10 ? { m: 1, e: e + 1 } : { m, e };
}

/** Widens a degenerate interval (width ≤ 1e-10 of its magnitude, or < 1e-100) around its centre. */
function widen(min: number, max: number): [number, number] {
  const magnitude = Math.max(Math.abs(min), Math.abs(max));
  if (max - min > 1e-10 * magnitude && max - min >= 1e-100) return [min, max];
  const centre = min / 2 + max / 2;
  const half = Math.abs(centre) >= 1e-100 ? Math.abs(centre) * 0.1 : 1;
  return [centre - half, centre + half];
}

/**
 * Loose labelling of [min, max] (Heckbert 1990, Graphics Gems, "Nice numbers for graph labels"):
 * about `count` ticks with a step of 1, 2 or 5 × 10^k; the first tick is ≤ min and the last ≥ max,
 * each within one step. min > max is swapped; a degenerate interval is widened (±10 % of its value,
 * or ±1 around 0). Throws RangeError for non-finite input or magnitudes above 1e100.
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) throw new RangeError(`niceTicks: non-finite bound ${min}, ${max}`);
  if (Math.abs(min) > MAX_MAGNITUDE || Math.abs(max) > MAX_MAGNITUDE) throw new RangeError('niceTicks: |bound| > 1e100');
  const n = Math.max(2, Math.round(Number.isFinite(count) ? count : 5));
  const [lo0, hi0] = widen(Math.min(min, max), Math.max(min, max));
  const range = niceNumber(hi0 - lo0, false);
  const step = niceNumber((range.m * pow10(range.e)) / (n - 1), true);
  const tick = (k: number): number => decimal(k * step.m, step.e);
  const d = step.m * pow10(step.e);
  let lo = Math.floor(lo0 / d);
  while (tick(lo + 1) <= lo0) lo += 1;
  while (tick(lo) > lo0) lo -= 1;
  let hi = Math.ceil(hi0 / d);
  while (tick(hi - 1) >= hi0) hi -= 1;
  while (tick(hi) < hi0) hi += 1;
  const ticks: number[] = [];
  for (let k = lo; k <= hi; k++) ticks.push(tick(k));
  return ticks;
}

/** ⌊log10 x⌋ computed exactly for x > 0. */
function floorLog10(x: number): number {
  let e = Math.floor(Math.log10(x));
  if (pow10(e) > x) e -= 1;
  if (pow10(e + 1) <= x) e += 1;
  return e;
}

/** ⌈log10 x⌉ computed exactly for x > 0. */
function ceilLog10(x: number): number {
  const e = floorLog10(x);
  return pow10(e) === x ? e : e + 1;
}

/**
 * Ticks for a logarithmic axis over [min, max] (both > 0, else RangeError): powers of 10 enclosing
 * the range; with at most two decades, 2 and 5 × 10^k in between (trimmed to one tick beyond each
 * end); above ten decades, every s-th power with s = ⌈decades / 8⌉.
 */
export function logTicks(min: number, max: number): number[] {
  if (!(min > 0) || !(max > 0) || !Number.isFinite(min) || !Number.isFinite(max)) {
    throw new RangeError(`logTicks: bounds must be finite and > 0, got ${min}, ${max}`);
  }
  const a = Math.min(min, max);
  const b = Math.max(min, max);
  const lo = floorLog10(a);
  const hi = Math.max(ceilLog10(b), lo + 1);
  const decades = hi - lo;
  if (decades <= 2) {
    const all: number[] = [];
    for (let e = lo; e <= hi; e++) for (const m of [1, 2, 5]) all.push(decimal(m, e));
    const first = all.filter((t) => t <= a).length - 1;
    const start = Math.max(0, first);
    const last = Math.max(all.findIndex((t) => t >= b), start + 1);
    return all.slice(start, last + 1);
  }
  const s = decades <= 10 ? 1 : Math.ceil(decades / 8);
  const ticks: number[] = [];
  for (let e = Math.floor(lo / s) * s; e <= Math.ceil(hi / s) * s; e += s) ticks.push(pow10(e));
  return ticks;
}

/**
 * Affine map from [u0, u1] to [r0, r1], exact at both ends and monotonic: r0 + (u − u0)·k is
 * monotonic under rounding; both ends are returned exactly and r1 is never overshot before u1.
 */
function affine(u0: number, u1: number, r0: number, r1: number): (u: number) => number {
  const k = (r1 - r0) / (u1 - u0);
  const up = r1 > r0;
  const forward = u1 > u0;
  return (u: number): number => {
    if (u === u1) return r1;
    if (u === u0) return r0;
    const v = r0 + (u - u0) * k;
    const before = forward ? u < u1 : u > u1;
    return before === up ? Math.min(v, r1) : Math.max(v, r1);
  };
}

function checkPair(name: string, pair: [number, number]): void {
  if (!Number.isFinite(pair[0]) || !Number.isFinite(pair[1])) throw new RangeError(`${name}: non-finite ${pair.join(', ')}`);
}

/** Linear scale: domain[0] ↦ range[0], domain[1] ↦ range[1] exactly; RangeError for an empty domain. */
export function linearScale(domain: [number, number], range: [number, number]): (x: number) => number {
  checkPair('linearScale domain', domain);
  checkPair('linearScale range', range);
  if (domain[0] === domain[1]) throw new RangeError('linearScale: empty domain');
  return affine(domain[0], domain[1], range[0], range[1]);
}

/**
 * Logarithmic (base 10) scale; the domain must be > 0 (RangeError otherwise). Equal ratios map to
 * equal distances, so decades are evenly spaced. x ≤ 0 maps to NaN: callers drop such points.
 */
export function logScale(domain: [number, number], range: [number, number]): (x: number) => number {
  checkPair('logScale range', range);
  if (!(domain[0] > 0) || !(domain[1] > 0) || !Number.isFinite(domain[0]) || !Number.isFinite(domain[1])) {
    throw new RangeError(`logScale: domain must be finite and > 0, got ${domain.join(', ')}`);
  }
  if (domain[0] === domain[1]) throw new RangeError('logScale: empty domain');
  const map = affine(Math.log10(domain[0]), Math.log10(domain[1]), range[0], range[1]);
  return (x: number): number => (x > 0 ? map(Math.log10(x)) : Number.NaN);
}

/** Up to six significant digits, trailing zeros dropped; exponential form ("2.5e-5") when asked. */
function trimmed(x: number, exponential: boolean): string {
  const s = exponential ? x.toExponential(5) : x.toPrecision(6);
  const [mant = '', exp] = s.split('e');
  const m = mant.includes('.') ? mant.replace(/\.?0+$/, '') : mant;
  return exp === undefined ? m : `${m}e${Number(exp)}`;
}

const SUFFIXES: ReadonlyArray<readonly [number, string]> = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
];

/**
 * Tick label: compact and locale-free. Zero is "0"; 1e-3 ≤ |x| < 1e3 plain ("0.001", "2.5", "500");
 * 1e3 ≤ |x| < 1e12 with the suffixes k, M, G ("1k", "30k", "2.5M"); otherwise powers of ten ("1e-5",
 * "2.5e12"). At most six significant digits; negatives use the minus sign U+2212.
 */
export function formatTick(x: number): string {
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const r = Number(x.toPrecision(6));
  const a = Math.abs(r);
  const sign = r < 0 ? '\u2212' : '';
  if (a < 1e-3 || a >= 1e12) return sign + trimmed(a, true);
  for (const [unit, suffix] of SUFFIXES) {
    if (a >= unit) return sign + trimmed(a / unit, false) + suffix;
  }
  return sign + trimmed(a, false);
}
