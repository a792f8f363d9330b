/**
 * Lengths with units, stored as metres (a plain `number`). The twin of `duration.ts`.
 *
 * Accepted units (case-sensitive, as SI symbols are): `m` and `km` = 1000 m. The number is written in
 * plain decimal (`500m`, `1.2 km`; no sign, no exponent); spaces between number and unit are allowed.
 * A plain number is rejected because its unit would be a guess, except `0`, which is zero in every
 * unit. Values are computed exactly from the decimal text (one rounding to double), so `formatLength`
 * and `parseLength` round-trip every finite non-negative value in metres.
 */
import type { z } from 'zod';
import { isQuantitySchema, quantitySchema, type QuantityIssueParams, type QuantityKind, type QuantityOptions } from './quantity.js';

/** Unit symbol → size as a power of ten of metres (so decimal arithmetic stays exact). */
const UNIT_EXP: ReadonlyMap<string, number> = new Map([
  ['m', 0],
  ['km', 3],
]);

/** The accepted unit symbols, as listed to users. */
export const LENGTH_UNITS = 'm, km';

/** What a valid length looks like, for `expected` lines. */
export const LENGTH_EXPECTED = `a number with a unit, e.g. \`500m\` or \`1.2km\` (units: ${LENGTH_UNITS}); or 0`;

/** Regular expression source matching an accepted length string (also used in the JSON Schema). */
export const LENGTH_PATTERN = '^\\s*(0|[0-9]+(\\.[0-9]+)?\\s*(m|km))\\s*$';

/** The same without the bare `0` (for lengths that must be positive). */
export const POSITIVE_LENGTH_PATTERN = '^\\s*[0-9]+(\\.[0-9]+)?\\s*(m|km)\\s*$';

const LENGTH_RE = /^([0-9]+)(?:\.([0-9]+))?\s*(m|km)$/u;

/** Common misspellings of unit symbols → the accepted symbol. */
const UNIT_HINTS: ReadonlyMap<string, string> = new Map([
  ['M', 'm'], ['meter', 'm'], ['meters', 'm'], ['metre', 'm'], ['metres', 'm'],
  ['Km', 'km'], ['KM', 'km'], ['kM', 'km'], ['kilometer', 'km'], ['kilometers', 'km'], ['kilometre', 'km'], ['kilometres', 'km'],
]);

export type LengthResult = { ok: true; metres: number } | { ok: false; reason: string };

function unknownUnitReason(unit: string): string {
  const hint = UNIT_HINTS.get(unit);
  const dym = hint === undefined ? '' : ` (did you mean \`${hint}\`?)`;
  return `unknown unit \`${unit}\`${dym}; accepted units: ${LENGTH_UNITS}`;
}

/** Explains why a string that did not match the length syntax is wrong. */
function diagnose(text: string): string {
  if (text === '') return `empty length; write a number with a unit (${LENGTH_UNITS})`;
  if (/^-/.test(text)) return 'a length cannot be negative';
  if (/^[0-9]*\.?[0-9]+e[+-]?[0-9]+\s*[^\s0-9]/i.test(text)) return 'write the number without an exponent (e.g. `1000m`, not `1e3m`)';
  if (/^\+?[0-9]*\.?[0-9]+(e[+-]?[0-9]+)?$/i.test(text)) {
    return `\`${text}\` has no unit; write e.g. \`${text}m\` or \`${text}km\` (units: ${LENGTH_UNITS})`;
  }
  const m = /^[0-9]*\.?[0-9]+\s*([^\s0-9.][^\s]*)$/u.exec(text);
  if (m?.[1] !== undefined) return unknownUnitReason(m[1]);
  return `\`${text}\` is not a length; write a number with a unit (${LENGTH_UNITS})`;
}

/**
 * Parses a length: "500m", "1.2 km", "0". Returns metres, or a one-sentence reason naming the
 * accepted units. Plain numbers (10, "10") are rejected as ambiguous, except exactly 0.
 */
export function parseLength(text: string | number): LengthResult {
  if (typeof text === 'number') {
    if (text === 0) return { ok: true, metres: 0 };
    return { ok: false, reason: diagnose(String(text)) };
  }
  const t = text.trim();
  if (t === '0') return { ok: true, metres: 0 };
  const m = LENGTH_RE.exec(t);
  if (m === null) return { ok: false, reason: diagnose(t) };
  const [, int = '', frac = '', unit = ''] = m;
  const exp = UNIT_EXP.get(unit);
  if (exp === undefined) return { ok: false, reason: unknownUnitReason(unit) };
  const metres = Number(`${BigInt(int + frac)}e${exp - frac.length}`);
  if (!Number.isFinite(metres)) return { ok: false, reason: `\`${t}\` is too large` };
  return { ok: true, metres };
}

/** Plain decimal text (no exponent) of digits × 10^exp, without trailing zeros. */
function plainDecimal(digits: bigint, exp: number): string {
  if (exp >= 0) return (digits * 10n ** BigInt(exp)).toString();
  const k = -exp;
  const s = digits.toString().padStart(k + 1, '0');
  const text = `${s.slice(0, s.length - k)}.${s.slice(s.length - k)}`;
  return text.replace(/0+$/, '').replace(/\.$/, '');
}

/**
 * Canonical text of a length in metres: `km` from 1000 m up ("1.2km"), else `m` ("500m", "0.25m").
 * Every decimal number of metres is a finite decimal of kilometres, so the text is always exact.
 * Zero is "0m"; negative values get a leading "-" (not parseable); NaN/±Infinity give String(metres).
 */
export function formatLength(metres: number): string {
  if (!Number.isFinite(metres)) return String(metres);
  if (metres < 0) return `-${formatLength(-metres)}`;
  if (metres === 0) return '0m';
  const [mant = '0', e = '0'] = String(metres).split('e');
  const [int = '0', frac = ''] = mant.split('.');
  const digits = BigInt(int + frac);
  const exp = Number(e) - frac.length;
  return metres >= 1000 ? `${plainDecimal(digits, exp - 3)}km` : `${plainDecimal(digits, exp)}m`;
}

/** Options of {@link length}; bounds in metres, inclusive. */
export type LengthOptions = QuantityOptions;

/** Issue params that the validator turns into a Problem code and an `expected` line. */
export type LengthIssueParams = QuantityIssueParams;

const LENGTH_KIND: QuantityKind = {
  noun: 'length',
  units: LENGTH_UNITS,
  examples: '500m or 1.2km',
  expected: LENGTH_EXPECTED,
  pattern: LENGTH_PATTERN,
  positivePattern: POSITIVE_LENGTH_PATTERN,
  parse: (text) => {
    const r = parseLength(text);
    return r.ok ? { ok: true, value: r.metres } : r;
  },
  format: formatLength,
  stages: new WeakSet<object>(),
};

/** True for a schema made by {@link length} or a clone of it (not through wrappers such as `.optional()`). */
export function isLengthSchema(schema: z.core.$ZodType): boolean {
  return isQuantitySchema(LENGTH_KIND, schema);
}

/**
 * zod schema of a length: input a string such as "500m" (or the number 0), output metres (see
 * quantity.ts). For defaults use `.prefault('50m')`.
 */
export function length(options: LengthOptions = {}) {
  return quantitySchema(LENGTH_KIND, options);
}

/** The type of a schema made by {@link length}: input `string | number`, output metres. */
export type LengthSchema = ReturnType<typeof length>;
