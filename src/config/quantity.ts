/**
 * The zod schema shared by quantities written with a unit (durations, lengths): input a string such
 * as "10ms" or "500m" (or the number 0 where zero is allowed), output a plain number in the base unit.
 * Bounds (base unit, inclusive) and `positive` are checked after parsing. Issues are `custom` with
 * {@link QuantityIssueParams}; a value that is neither string nor number fails the input union. The
 * input JSON Schema is `anyOf: [string with pattern, const 0]` (a number branch matching nothing when 0
 * is not allowed) with a description.
 */
import { z } from 'zod';

/** Options of a quantity schema; bounds in the base unit, inclusive. */
export interface QuantityOptions {
  readonly min?: number;
  readonly max?: number;
  /** Require a value greater than 0. */
  readonly positive?: boolean;
  readonly description?: string;
}

/** Issue params that the validator turns into a Problem code and an `expected` line. */
export interface QuantityIssueParams {
  readonly problem: 'bad-unit' | 'invalid-value';
  readonly expected: string;
}

/** What distinguishes one kind of quantity from another. */
export interface QuantityKind {
  /** "duration", "length". */
  readonly noun: string;
  /** The accepted unit symbols, as listed to users. */
  readonly units: string;
  /** Two examples for descriptions, e.g. "10ms or 2.5s". */
  readonly examples: string;
  /** The `expected` line of a malformed value. */
  readonly expected: string;
  /** JSON Schema patterns with and without a bare 0. */
  readonly pattern: string;
  readonly positivePattern: string;
  parse(text: string | number): { ok: true; value: number } | { ok: false; reason: string };
  format(value: number): string;
  /** The transform stages of every schema of this kind (see {@link isQuantitySchema}). */
  readonly stages: WeakSet<object>;
}

function boundsText(kind: QuantityKind, o: QuantityOptions): string {
  const parts: string[] = [];
  if (o.positive === true) parts.push('greater than 0');
  if (o.min !== undefined) parts.push(`at least ${kind.format(o.min)}`);
  if (o.max !== undefined) parts.push(`at most ${kind.format(o.max)}`);
  return parts.join(' and ');
}

/** Range check after parsing; returns a reason, or undefined when in range. */
function outOfRange(kind: QuantityKind, value: number, o: QuantityOptions): string | undefined {
  const bad = (o.positive === true && value <= 0) || (o.min !== undefined && value < o.min) || (o.max !== undefined && value > o.max);
  return bad ? `must be ${boundsText(kind, o)}` : undefined;
}

function describe(kind: QuantityKind, o: QuantityOptions): string {
  const range = boundsText(kind, o);
  const noun = kind.noun.charAt(0).toUpperCase() + kind.noun.slice(1);
  const zero = o.positive !== true && (o.min === undefined || o.min <= 0) ? ', or 0' : '';
  const what = `${noun}: a number with a unit (${kind.units}), e.g. ${kind.examples}${zero}${range === '' ? '' : `; ${range}`}.`;
  return o.description === undefined ? what : `${o.description.trim()} ${what}`;
}

/** True for a schema made for `kind` or a clone of it (not through wrappers such as `.optional()`). */
export function isQuantitySchema(kind: QuantityKind, schema: z.core.$ZodType): boolean {
  const def = schema._zod.def;
  return def.type === 'pipe' && kind.stages.has((def as z.core.$ZodPipeDef).out);
}

export function quantitySchema(kind: QuantityKind, options: QuantityOptions) {
  if (options.min !== undefined && options.max !== undefined && options.min > options.max) {
    throw new RangeError(`${kind.noun}(): min ${options.min} > max ${options.max}`);
  }
  const zeroAllowed = options.positive !== true && (options.min === undefined || options.min <= 0);
  // Numbers are let through to the parser even where 0 is not allowed, so that `radius: 500` is told
  // to write a unit (and `0` that it must be greater than 0) rather than that it has the wrong type.
  // For editors the number branch then matches nothing (JSON Schema `not: {}`).
  const input = z.union(
    zeroAllowed ? [z.string().meta({ pattern: kind.pattern }), z.number().meta({ const: 0 })] : [z.string().meta({ pattern: kind.positivePattern }), z.number().meta({ not: {} })],
    { error: () => `expected a ${kind.noun}: a number with a unit (${kind.units})` },
  );
  const schema = input
    .transform((value, ctx): number => {
      const r = kind.parse(value);
      const reason = r.ok ? outOfRange(kind, r.value, options) : r.reason;
      if (r.ok && reason === undefined) return r.value;
      const params: QuantityIssueParams = r.ok
        ? { problem: 'invalid-value', expected: `a ${kind.noun} ${boundsText(kind, options)}` }
        : { problem: 'bad-unit', expected: zeroAllowed ? kind.expected : kind.expected.replace(/; or 0$/, '') };
      ctx.issues.push({ code: 'custom', message: reason ?? `invalid ${kind.noun}`, input: value, params: { ...params } });
      return z.NEVER;
    })
    .meta({ description: describe(kind, options) });
  kind.stages.add(schema._zod.def.out);
  return schema;
}
