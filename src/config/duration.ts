/**
 * Durations with units, stored as milliseconds (a plain `number`).
 *
 * Accepted units (case-sensitive, as SI symbols are): `us` (also `µs`, `μs`) = 0.001 ms,
 * `ms`, `s` = 1000 ms, `min` = 60 s, `h` = 60 min, `d` = 24 h. The number is written in plain
 * decimal (`5ms`, `2.5 s`, `0.5us`; no sign, no exponent); spaces between number and unit are
 * allowed. A plain number is rejected because its unit would be a guess, except `0`, which means
 * zero in every unit. Values are computed exactly from the decimal text (one rounding to double),
 * so `formatDuration` and `parseDuration` round-trip every finite non-negative millisecond value.
 */
import type { z } from 'zod';
import { isQuantitySchema, quantitySchema, type QuantityIssueParams, type QuantityKind, type QuantityOptions } from './quantity.js';

/** Unit symbol → size in microseconds (integers, so decimal arithmetic stays exact). */
const UNIT_US: ReadonlyMap<string, bigint> = new Map([
  ['us', 1n],
  ['µs', 1n], // U+00B5 micro sign
  ['μs', 1n], // U+03BC Greek small letter mu
  ['ms', 1_000n],
  ['s', 1_000_000n],
  ['min', 60_000_000n],
  ['h', 3_600_000_000n],
  ['d', 86_400_000_000n],
]);

/** Units tried by {@link formatDuration}, largest first. */
const FORMAT_UNITS = ['d', 'h', 'min', 's', 'ms', 'us'] as const;

/** The accepted unit symbols, as listed to users. */
export const DURATION_UNITS = 'us, µs, ms, s, min, h, d';

/** What a valid duration looks like, for `expected` lines. */
export const DURATION_EXPECTED = `a number with a unit, e.g. \`10ms\` or \`2.5s\` (units: ${DURATION_UNITS}); or 0`;

/** Regular expression source matching an accepted duration string (also used in the JSON Schema). */
export const DURATION_PATTERN = '^\\s*(0|[0-9]+(\\.[0-9]+)?\\s*(us|µs|μs|ms|s|min|h|d))\\s*$';

/** The same without the bare `0` (for durations that must be positive). */
export const POSITIVE_DURATION_PATTERN = '^\\s*[0-9]+(\\.[0-9]+)?\\s*(us|µs|μs|ms|s|min|h|d)\\s*$';

const DURATION_RE = /^([0-9]+)(?:\.([0-9]+))?\s*(us|µs|μs|ms|s|min|h|d)$/u;

/** Common misspellings of unit symbols → the accepted symbol. */
const UNIT_HINTS: ReadonlyMap<string, string> = new Map([
  ['m', 'min'], ['mins', 'min'], ['minute', 'min'], ['minutes', 'min'],
  ['sec', 's'], ['secs', 's'], ['second', 's'], ['seconds', 's'],
  ['msec', 'ms'], ['msecs', 'ms'], ['millisecond', 'ms'], ['milliseconds', 'ms'],
  ['usec', 'us'], ['usecs', 'us'], ['microsecond', 'us'], ['microseconds', 'us'],
  ['hr', 'h'], ['hrs', 'h'], ['hour', 'h'], ['hours', 'h'],
  ['day', 'd'], ['days', 'd'],
  ['MS', 'ms'], ['Ms', 'ms'], ['S', 's'], ['H', 'h'], ['D', 'd'], ['MIN', 'min'], ['Min', 'min'], ['US', 'us'],
]);

export type DurationResult = { ok: true; ms: number } | { ok: false; reason: string };

/** Exact decimal: value = digits × 10^exp. */
interface Decimal {
  readonly digits: bigint;
  readonly exp: number;
}

function unknownUnitReason(unit: string): string {
  const hint = UNIT_HINTS.get(unit);
  const dym = hint === undefined ? '' : ` (did you mean \`${hint}\`?)`;
  return `unknown unit \`${unit}\`${dym}; accepted units: ${DURATION_UNITS}`;
}

/** Explains why a string that did not match the duration syntax is wrong. */
function diagnose(text: string): string {
  if (text === '') return `empty duration; write a number with a unit (${DURATION_UNITS})`;
  if (/^-/.test(text)) return 'a duration cannot be negative';
  if (/^[0-9]*\.?[0-9]+e[+-]?[0-9]+\s*[^\s0-9]/i.test(text)) return 'write the number without an exponent (e.g. `1000ms`, not `1e3ms`)';
  if (/^\+?[0-9]*\.?[0-9]+(e[+-]?[0-9]+)?$/i.test(text)) {
    return `\`${text}\` has no unit; write e.g. \`${text}ms\` or \`${text}s\` (units: ${DURATION_UNITS})`;
  }
  const m = /^[0-9]*\.?[0-9]+\s*([^\s0-9.][^\s]*)$/u.exec(text);
  if (m?.[1] !== undefined) return unknownUnitReason(m[1]);
  return `\`${text}\` is not a duration; write a number with a unit (${DURATION_UNITS})`;
}

/** Milliseconds from an exact decimal count of microseconds-scaled units, with one rounding. */
function toMs(d: Decimal, unitUs: bigint): number {
  return Number(`${d.digits * unitUs}e${d.exp - 3}`);
}

/**
 * Parses a duration: "5ms", "2.5 s", "10s", "15min", "1h", "1d", "250us", "0".
 * Returns milliseconds, or a one-sentence reason naming the accepted units.
 * Plain numbers (10, "10") are rejected as ambiguous, except exactly 0.
 */
export function parseDuration(text: string | number): DurationResult {
  if (typeof text === 'number') {
    if (text === 0) return { ok: true, ms: 0 };
    return { ok: false, reason: diagnose(String(text)) };
  }
  const t = text.trim();
  if (t === '0') return { ok: true, ms: 0 };
  const m = DURATION_RE.exec(t);
  if (m === null) return { ok: false, reason: diagnose(t) };
  const [, int = '', frac = '', unit = ''] = m;
  const unitUs = UNIT_US.get(unit);
  if (unitUs === undefined) return { ok: false, reason: unknownUnitReason(unit) };
  const ms = toMs({ digits: BigInt(int + frac), exp: -frac.length }, unitUs);
  if (!Number.isFinite(ms)) return { ok: false, reason: `\`${t}\` is too large` };
  return { ok: true, ms };
}

/** Exact decimal of a finite double's shortest round-trip representation (String(x)). */
function decimalOf(x: number): Decimal {
  const [mant = '0', e = '0'] = String(x).split('e');
  const [int = '0', frac = ''] = mant.split('.');
  return { digits: BigInt(int + frac), exp: Number(e) - frac.length };
}

function pow10(n: number): bigint {
  return 10n ** BigInt(n);
}

/** Plain decimal text of num/den if it is a finite decimal, else undefined. */
function finiteDecimal(num: bigint, den: bigint): string | undefined {
  let twos = 0;
  let fives = 0;
  let rest = den;
  while (rest % 2n === 0n) { rest /= 2n; twos++; }
  while (rest % 5n === 0n) { rest /= 5n; fives++; }
  if (num % rest !== 0n) return undefined;
  const k = Math.max(twos, fives);
  const scaled = ((num / rest) * pow10(k)) / (den / rest);
  const s = scaled.toString().padStart(k + 1, '0');
  if (k === 0) return s;
  const text = `${s.slice(0, s.length - k)}.${s.slice(s.length - k)}`;
  return text.replace(/0+$/, '').replace(/\.$/, '');
}

/**
 * Canonical text of a duration in ms: the largest unit in which the value is at least 1 and an
 * exact finite decimal ("5ms", "1.5s", "15min", "1h", "500us"); values below 1 µs use `us`.
 * Zero is "0ms"; negative values get a leading "-" (not parseable); NaN/±Infinity give String(ms).
 */
export function formatDuration(ms: number): string {
  if (!Number.isFinite(ms)) return String(ms);
  if (ms < 0) return `-${formatDuration(-ms)}`;
  if (ms === 0) return '0ms';
  const d = decimalOf(ms);
  const e = d.exp + 3; // value in µs = digits × 10^e
  const num = d.digits * pow10(Math.max(0, e));
  const den0 = pow10(Math.max(0, -e));
  for (const unit of FORMAT_UNITS) {
    const den = den0 * (UNIT_US.get(unit) ?? 1n);
    if (unit !== 'us' && num < den) continue;
    const text = finiteDecimal(num, den);
    if (text !== undefined) return `${text}${unit}`;
  }
  return `${ms}ms`; // unreachable: `us` always gives a finite decimal
}

/** Options of {@link duration}; bounds in ms, inclusive. */
export type DurationOptions = QuantityOptions;

/** Issue params that the validator turns into a Problem code and an `expected` line. */
export type DurationIssueParams = QuantityIssueParams;

const DURATION_KIND: QuantityKind = {
  noun: 'duration',
  units: DURATION_UNITS,
  examples: '10ms or 2.5s',
  expected: DURATION_EXPECTED,
  pattern: DURATION_PATTERN,
  positivePattern: POSITIVE_DURATION_PATTERN,
  parse: (text) => {
    const r = parseDuration(text);
    return r.ok ? { ok: true, value: r.ms } : r;
  },
  format: formatDuration,
  stages: new WeakSet<object>(),
};

/** True for a schema made by {@link duration} or a clone of it (not through wrappers such as `.optional()`). */
export function isDurationSchema(schema: z.core.$ZodType): boolean {
  return isQuantitySchema(DURATION_KIND, schema);
}

/**
 * zod schema of a duration: input a string such as "10ms" (or the number 0), output milliseconds
 * (see quantity.ts). For defaults use `.default(ms)` (the editor schema shows it formatted) or
 * `.prefault('10s')`.
 */
export function duration(options: DurationOptions = {}) {
  return quantitySchema(DURATION_KIND, options);
}

/** The type of a schema made by {@link duration}: input `string | number`, output ms. */
export type DurationSchema = ReturnType<typeof duration>;
