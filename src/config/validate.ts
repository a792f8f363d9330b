/**
 * Schema validation of a parsed YAML source: every zod issue becomes a positioned {@link Problem};
 * problems at paths set by `--set` are reported against `--set` and the item instead.
 */
import type { z } from 'zod';
import { draftsOf, type Draft } from './issues.js';
import { sortProblems, type Problem } from './problems.js';
import { dottedPath, locatePath, positionOf, type YamlSource } from './yaml-source.js';

export { closestKey } from './closest-key.js';
export { validKeysAt } from './schema-walk.js';

export type ValidateResult<T> = { ok: true; value: T } | { ok: false; problems: Problem[] };

function startsWith(path: readonly (string | number)[], prefix: readonly string[], upTo = prefix.length): boolean {
  if (path.length < upTo || prefix.length < upTo) return false;
  for (let i = 0; i < upTo; i++) if (String(path[i]) !== prefix[i]) return false;
  return true;
}

/**
 * Where a value that did not come from the file as written was put there: a `--set` or `--vary` item
 * of the command line, or a position in the file (the sweep value written into a point).
 */
export type EditOrigin =
  | { readonly option: '--set' | '--vary'; readonly item: string }
  | { readonly line: number; readonly column: number };

/** Key paths (dotted) edited before validation, with their origin. */
export type Edits = ReadonlyMap<string, EditOrigin>;

/**
 * The edit responsible for a problem at `path`: one that set the path or an ancestor, or one that
 * created the (position-less) map the path runs into. Longest match, later edit on ties.
 */
function overrideFor(source: YamlSource, path: readonly (string | number)[], overridden: Edits): EditOrigin | undefined {
  if (overridden.size === 0) return undefined;
  const located = locatePath(source, path);
  let best: EditOrigin | undefined;
  let bestLength = -1;
  for (const [key, item] of overridden) {
    const segs = key.split('.');
    const covers = startsWith(path, segs);
    const created = located.created && startsWith(path, segs, located.depth + 1);
    const length = covers ? segs.length : created ? located.depth + 1 : -1;
    if (length >= 0 && length >= bestLength) {
      best = item;
      bestLength = length;
    }
  }
  return best;
}

function place(d: Draft, source: YamlSource, overridden: Edits): Problem {
  const { preferKey, path, ...fields } = d;
  const origin = overrideFor(source, path, overridden);
  if (origin !== undefined && 'option' in origin) {
    return { ...fields, file: origin.option, line: null, column: null, path: dottedPath(path), found: origin.item };
  }
  // A value written into a point by the file's sweep: no position of its own, report it at the value.
  if (origin !== undefined && locatePath(source, path).created) {
    return { ...fields, file: source.file, line: origin.line, column: origin.column, path: dottedPath(path) };
  }
  const pos = positionOf(source, path, preferKey === true);
  return { ...fields, file: source.file, line: pos?.line ?? null, column: pos?.column ?? null, path: dottedPath(path) };
}

/** Command-line problems (sorted last, no line) in the order the items were given. */
function bySetOrder(problems: Problem[], overridden: Edits): Problem[] {
  const items = [...overridden.values()].flatMap((o) => ('option' in o ? [o.item] : []));
  const order = new Map(items.map((item, i) => [item, i]));
  const rank = (p: Problem) => (p.file === '--set' || p.file === '--vary' ? (order.get(p.found ?? '') ?? order.size) : -1);
  return problems.map((p, i) => ({ p, i })).sort((a, b) => rank(a.p) - rank(b.p) || a.i - b.i).map((x) => x.p);
}

function dedupe(problems: readonly Problem[]): Problem[] {
  const seen = new Set<string>();
  return problems.filter((p) => {
    const key = `${p.code}\u0000${p.path}\u0000${p.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/**
 * Validates `source.doc.toJS()` against `schema`. Returns the parsed (defaulted) value, or every
 * problem with file, line, column, dotted path, found/expected and suggestions, sorted by position
 * (`--set` problems last). Never throws for bad input.
 */
export function validateSource<S extends z.ZodType>(
  source: YamlSource,
  schema: S,
  overridden: Edits = new Map(),
): ValidateResult<z.output<S>> {
  let data: unknown;
  try {
    data = source.doc.toJS({ maxAliasCount: 1000 });
  } catch (err) {
    const message = `the document cannot be expanded: ${(err as Error).message}`;
    return { ok: false, problems: [{ code: 'syntax', file: source.file, line: 1, column: 1, path: '', message }] };
  }
  const result = schema.safeParse(data, { reportInput: true });
  if (result.success) return { ok: true, value: result.data };
  const ctx = { schema, data };
  const problems = result.error.issues.flatMap((issue) => draftsOf(issue, [], ctx)).map((d) => place(d, source, overridden));
  return { ok: false, problems: bySetOrder(sortProblems(dedupe(problems)), overridden) };
}
