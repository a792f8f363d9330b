/**
 * zod issues → problem drafts (code, absolute path, message, found, expected, suggestion),
 * before positions are attached. One draft per unknown key; unions are resolved to the branch
 * that fits best; durations get `bad-unit` for anything but a range violation.
 */
import { z } from 'zod';
import { closestKey } from './closest-key.js';
import { kindOf, oneOf, renderValue, typeWords } from './describe-value.js';
import { DURATION_EXPECTED } from './duration.js';
import type { ProblemCode } from './problems.js';
import { isDurationAt, isLengthAt, schemasAt, validKeysAt, valuesOf } from './schema-walk.js';
import { LENGTH_EXPECTED } from './length.js';

type Issue = z.core.$ZodIssue;
type Path = (string | number)[];

/** A problem before its file position is known. */
export interface Draft {
  readonly code: ProblemCode;
  readonly path: Path;
  readonly message: string;
  readonly found?: string;
  readonly expected?: string;
  readonly suggestion?: string;
  /** Point at the key node rather than the value (unknown keys). */
  readonly preferKey?: boolean;
}

/** What the mapping needs besides the issue: the root schema and the validated data. */
export interface IssueContext {
  readonly schema: z.core.$ZodType;
  readonly data: unknown;
}

const CODES: ReadonlySet<string> = new Set<ProblemCode>([
  'syntax', 'unknown-key', 'invalid-type', 'invalid-value', 'missing-key', 'bad-unit', 'bad-override', 'file-not-found', 'unreadable',
]);

function toPath(keys: readonly PropertyKey[]): Path {
  return keys.map((k) => (typeof k === 'number' ? k : String(k)));
}

function valueAt(data: unknown, path: readonly (string | number)[]): unknown {
  let here = data;
  for (const key of path) {
    if (typeof here !== 'object' || here === null) return undefined;
    here = (here as Record<string, unknown>)[String(key)];
  }
  return here;
}

function isMissing(ctx: IssueContext, path: Path): boolean {
  if (path.length === 0) return false;
  const parent = valueAt(ctx.data, path.slice(0, -1));
  const last = String(path[path.length - 1]);
  return typeof parent === 'object' && parent !== null && !Array.isArray(parent) && !(last in parent);
}

/** The issue's message when the schema author wrote it (differs from zod's default wording). */
function authorMessage(issue: Issue): string | undefined {
  const localeError = z.config().localeError;
  try {
    const made = localeError?.(issue as unknown as Parameters<typeof localeError>[0]);
    const fallback = typeof made === 'string' ? made : made?.message;
    return issue.message !== fallback ? issue.message : undefined;
  } catch {
    return undefined;
  }
}

function bound(issue: Issue & { code: 'too_small' | 'too_big' }): string {
  const small = issue.code === 'too_small';
  const limit = String(small ? issue.minimum : issue.maximum);
  const unit = issue.origin === 'array' || issue.origin === 'set' ? ' items' : issue.origin === 'string' ? ' characters' : '';
  if (issue.exact === true) return `exactly ${limit}${unit}`;
  if (issue.inclusive === false) return `${small ? 'greater than' : 'less than'} ${limit}${unit}`;
  return `${small ? 'at least' : 'at most'} ${limit}${unit}`;
}

function formatExpected(issue: Issue & { code: 'invalid_format' }): string {
  if (issue.format === 'regex') return `text matching ${issue.pattern ?? 'the pattern'}`;
  if (issue.format === 'starts_with' && 'prefix' in issue) return `text starting with \`${String(issue.prefix)}\``;
  return `a valid ${issue.format}`;
}

/** Unknown keys: one draft per key, with the closest valid key as suggestion. */
function unknownKeys(issue: Issue & { code: 'unrecognized_keys' }, at: Path, ctx: IssueContext): Draft[] {
  const valid = validKeysAt(ctx.schema, at, ctx.data);
  return issue.keys.map((key) => {
    const close = closestKey(key, valid);
    return {
      code: 'unknown-key',
      path: [...at, key],
      message: `unknown key \`${key}\``,
      found: key,
      ...(valid.length > 0 ? { expected: oneOf(valid) } : {}),
      ...(close !== undefined ? { suggestion: `did you mean \`${close}\`?` } : {}),
      preferKey: true,
    };
  });
}

/** A record key that its key schema rejects. */
function badRecordKey(issue: Issue & { code: 'invalid_key' }, path: Path, ctx: IssueContext): Draft {
  const key = String(path[path.length - 1]);
  const keySchemas = schemasAt(ctx.schema, path.slice(0, -1), ctx.data);
  const allowed = keySchemas.flatMap((s) => {
    const def = s._zod.def as unknown as { keyType?: z.core.$ZodType };
    return def.keyType === undefined ? [] : (valuesOf(def.keyType) ?? []);
  });
  const inner = issue.issues[0];
  const note = inner === undefined ? undefined : authorMessage(inner);
  const close = closestKey(key, allowed.map(String));
  const expected = allowed.length > 0 ? oneOf(allowed) : inner?.code === 'invalid_format' ? formatExpected(inner) : undefined;
  return {
    code: allowed.length > 0 ? 'unknown-key' : 'invalid-value',
    path,
    message: note ?? `\`${key}\` is not allowed as a key here`,
    found: JSON.stringify(key),
    ...(expected !== undefined ? { expected } : {}),
    ...(close !== undefined ? { suggestion: `did you mean \`${close}\`?` } : {}),
    preferKey: true,
  };
}

function discriminator(issue: Issue & { code: 'invalid_union' }, path: Path, ctx: IssueContext): Draft {
  const options = ('options' in issue ? issue.options : undefined) ?? [];
  const value = valueAt(ctx.data, path);
  const name = String(path[path.length - 1] ?? '');
  const expected = oneOf(options);
  if (value === undefined) return { code: 'missing-key', path, message: `missing required key \`${name}\``, expected };
  const close = typeof value === 'string' ? closestKey(value, options.map(String)) : undefined;
  return {
    code: 'invalid-value',
    path,
    message: `unknown ${name} ${renderValue(value) ?? ''}`.trim(),
    ...withFound(value),
    expected,
    ...(close !== undefined ? { suggestion: `did you mean \`${close}\`?` } : {}),
  };
}

function withFound(value: unknown): { found?: string } {
  const found = renderValue(value);
  return found === undefined ? {} : { found };
}

/** A plain union with no matching branch: report the best branch, or one type problem. */
function union(issue: Issue & { code: 'invalid_union' }, path: Path, ctx: IssueContext): Draft[] {
  const branches = issue.errors;
  const typeMiss = (b: readonly Issue[]) => b.some((i) => i.path.length === 0 && i.code === 'invalid_type');
  const fitting = branches.filter((b) => !typeMiss(b));
  if (fitting.length === 0) {
    const types = [...new Set(branches.flat().filter((i) => i.code === 'invalid_type').map((i) => typeWords(i.expected)))];
    const value = valueAt(ctx.data, path);
    const expected = types.length > 0 ? types.join(' or ') : 'a different value';
    if (value === undefined && isMissing(ctx, path)) {
      return [{ code: 'missing-key', path, message: `missing required key \`${String(path[path.length - 1])}\``, expected }];
    }
    return [{ code: 'invalid-type', path, message: `wrong type: found ${kindOf(value)}`, ...withFound(value), expected }];
  }
  const best = fitting.reduce((a, b) => (b.length < a.length ? b : a));
  return best.flatMap((i) => draftsOf(i, path, ctx));
}

function typed(issue: Issue & { code: 'invalid_type' }, path: Path, ctx: IssueContext): Draft {
  const expected = typeWords(issue.expected);
  const value = valueAt(ctx.data, path);
  if (value === undefined && isMissing(ctx, path)) {
    return { code: 'missing-key', path, message: `missing required key \`${String(path[path.length - 1])}\``, expected };
  }
  return { code: 'invalid-type', path, message: `wrong type: found ${kindOf(value)}`, ...withFound(value), expected };
}

function custom(issue: Issue & { code: 'custom' }, path: Path, ctx: IssueContext): Draft {
  const params = issue.params ?? {};
  const code = typeof params['problem'] === 'string' && CODES.has(params['problem']) ? (params['problem'] as ProblemCode) : 'invalid-value';
  const expected = typeof params['expected'] === 'string' ? params['expected'] : undefined;
  return { code, path, message: issue.message, ...withFound(valueAt(ctx.data, path)), ...(expected !== undefined ? { expected } : {}) };
}

function defaultValueMessage(issue: Issue, expected: string | undefined): string {
  if (issue.code === 'invalid_value') return 'not an accepted value';
  if (issue.code === 'invalid_format') return 'does not have the required form';
  return expected === undefined ? 'value not accepted' : `out of range: must be ${expected}`;
}

/** Range, enum, format and multiple-of issues: the value is of the right type but not accepted. */
function valueProblem(issue: Issue, path: Path, ctx: IssueContext): Draft {
  const value = valueAt(ctx.data, path);
  let expected: string | undefined;
  if (issue.code === 'too_small' || issue.code === 'too_big') expected = bound(issue);
  else if (issue.code === 'not_multiple_of') expected = `a multiple of ${issue.divisor}`;
  else if (issue.code === 'invalid_value') expected = oneOf(issue.values);
  else if (issue.code === 'invalid_format') expected = formatExpected(issue);
  if (issue.code === 'invalid_value' && value === undefined && isMissing(ctx, path)) {
    return { code: 'missing-key', path, message: `missing required key \`${String(path[path.length - 1])}\``, ...(expected !== undefined ? { expected } : {}) };
  }
  const close = issue.code === 'invalid_value' && typeof value === 'string' ? closestKey(value, issue.values.map(String)) : undefined;
  const message = authorMessage(issue) ?? defaultValueMessage(issue, expected);
  return {
    code: 'invalid-value',
    path,
    message,
    ...withFound(value),
    ...(expected !== undefined ? { expected } : {}),
    ...(close !== undefined ? { suggestion: `did you mean \`${close}\`?` } : {}),
  };
}

function baseDrafts(issue: Issue, path: Path, ctx: IssueContext): Draft[] {
  switch (issue.code) {
    case 'unrecognized_keys':
      return unknownKeys(issue, path, ctx);
    case 'invalid_key':
      return [badRecordKey(issue, path, ctx)];
    case 'invalid_union':
      return 'discriminator' in issue && issue.discriminator !== undefined ? [discriminator(issue, path, ctx)] : union(issue, path, ctx);
    case 'invalid_type':
      return [typed(issue, path, ctx)];
    case 'custom':
      return [custom(issue, path, ctx)];
    default:
      return [valueProblem(issue, path, ctx)];
  }
}

/** A value that is not even a string or number where a duration belongs is a `bad-unit` problem too. */
function asDuration(d: Draft, ctx: IssueContext): Draft {
  if (d.code !== 'invalid-type' && d.code !== 'missing-key') return d;
  const expected = isDurationAt(ctx.schema, d.path, ctx.data) ? DURATION_EXPECTED : isLengthAt(ctx.schema, d.path, ctx.data) ? LENGTH_EXPECTED : undefined;
  if (expected === undefined) return d;
  return { ...d, code: d.code === 'missing-key' ? d.code : 'bad-unit', expected };
}

/** Drafts for one zod issue whose path is relative to `prefix` (non-empty inside unions). */
export function draftsOf(issue: Issue, prefix: Path, ctx: IssueContext): Draft[] {
  const path = [...prefix, ...toPath(issue.path)];
  return baseDrafts(issue, path, ctx).map((d) => asDuration(d, ctx));
}
