/**
 * Walking a zod schema along a key path, alongside the data being validated: which schema
 * applies at `groups.meters`, which keys are valid there, is it a duration. Handles objects
 * (strict, loose, catchall), optional / nullable / default / prefault / catch / readonly /
 * nonoptional / lazy wrappers, pipes (the input side, since the data is input), records, arrays,
 * tuples, intersections, unions and discriminated unions (the branch whose discriminator
 * matches the data; all branches when none does).
 */
import type { z } from 'zod';
import { isDurationSchema } from './duration.js';
import { isLengthSchema } from './length.js';

type Schema = z.core.$ZodType;

/** The def fields this walker reads; zod's defs are a tagged union on `type`. */
interface Def {
  readonly type: string;
  readonly innerType?: Schema;
  readonly in?: Schema;
  readonly out?: Schema;
  readonly shape?: Readonly<Record<string, Schema>>;
  readonly catchall?: Schema;
  readonly keyType?: Schema;
  readonly valueType?: Schema;
  readonly element?: Schema;
  readonly items?: readonly Schema[];
  readonly rest?: Schema | null;
  readonly options?: readonly Schema[];
  readonly discriminator?: string;
  readonly left?: Schema;
  readonly right?: Schema;
  readonly getter?: () => Schema;
}

const defOf = (s: Schema): Def => s._zod.def as unknown as Def;

const WRAPPERS = new Set(['optional', 'nullable', 'default', 'prefault', 'catch', 'readonly', 'nonoptional']);

/** The wrapper chain from `s` down to its core type (first element `s`, last the core). */
export function unwrapChain(s: Schema): Schema[] {
  const chain: Schema[] = [s];
  let cur = s;
  for (let guard = 0; guard < 64; guard++) {
    const def = defOf(cur);
    let next: Schema | undefined;
    if (WRAPPERS.has(def.type)) next = def.innerType;
    else if (def.type === 'lazy') next = def.getter?.();
    else if (def.type === 'pipe' && !isDurationSchema(cur) && !isLengthSchema(cur)) {
      next = def.in !== undefined && defOf(def.in).type === 'transform' ? def.out : def.in;
    }
    if (next === undefined) return chain;
    chain.push(next);
    cur = next;
  }
  return chain;
}

/** The core (unwrapped) type of `s`. */
function coreOf(s: Schema): Schema {
  const chain = unwrapChain(s);
  return chain[chain.length - 1] ?? s;
}

function isRecordLike(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

/** Literal/enum values a schema accepts (its `_zod.values`), if it has a finite set. */
export function valuesOf(s: Schema): readonly unknown[] | undefined {
  const values = coreOf(s)._zod.values;
  return values === undefined ? undefined : [...values];
}

/** Union branches that fit `data`: for a discriminated union, the branch named by the data. */
function unionBranches(s: Schema, data: unknown): readonly Schema[] {
  const def = defOf(s);
  const options = def.options ?? [];
  const disc = def.discriminator;
  if (disc === undefined || !isRecordLike(data)) return options;
  const tag = data[disc];
  const match = options.filter((o) => {
    const field = defOf(coreOf(o)).shape?.[disc];
    return field !== undefined && (valuesOf(field) ?? []).includes(tag);
  });
  return match.length > 0 ? match : options;
}

/** Child schemas one step down along `key` (several when a union is ambiguous). */
function childrenOf(s: Schema, key: string | number, data: unknown): Schema[] {
  const core = coreOf(s);
  const def = defOf(core);
  switch (def.type) {
    case 'object': {
      const field = def.shape?.[String(key)];
      if (field !== undefined) return [field];
      return def.catchall !== undefined && defOf(def.catchall).type !== 'never' ? [def.catchall] : [];
    }
    case 'record':
      return def.valueType === undefined ? [] : [def.valueType];
    case 'array':
      return def.element === undefined ? [] : [def.element];
    case 'tuple': {
      const item = def.items?.[Number(key)] ?? def.rest ?? undefined;
      return item === undefined ? [] : [item];
    }
    case 'intersection':
      return [def.left, def.right].flatMap((x) => (x === undefined ? [] : childrenOf(x, key, data)));
    case 'union':
      return unionBranches(core, data).flatMap((o) => childrenOf(o, key, data));
    default:
      return [];
  }
}

function childData(data: unknown, key: string | number): unknown {
  if (Array.isArray(data)) return data[Number(key)];
  return isRecordLike(data) ? data[String(key)] : undefined;
}

/** Every schema that applies at `path` (several when a union is ambiguous); [] when none. */
export function schemasAt(schema: Schema, path: readonly PropertyKey[], data: unknown): Schema[] {
  let level: Schema[] = [schema];
  let here = data;
  for (const key of path) {
    if (typeof key === 'symbol') return [];
    level = level.flatMap((s) => childrenOf(s, key, here));
    here = childData(here, key);
    if (level.length === 0) return [];
  }
  return level;
}

/** True when the schema at `path` is a duration (through wrappers). */
export function isDurationAt(schema: Schema, path: readonly PropertyKey[], data: unknown): boolean {
  return schemasAt(schema, path, data).some((s) => unwrapChain(s).some(isDurationSchema));
}

/** True when the schema at `path` is a length (through wrappers). */
export function isLengthAt(schema: Schema, path: readonly PropertyKey[], data: unknown): boolean {
  return schemasAt(schema, path, data).some((s) => unwrapChain(s).some(isLengthSchema));
}

/** Keys valid for a map schema `s` given its data (object shape keys, enum record keys, union branches). */
function keysOf(s: Schema, data: unknown): string[] {
  const core = coreOf(s);
  const def = defOf(core);
  switch (def.type) {
    case 'object':
      return Object.keys(def.shape ?? {});
    case 'record': {
      const values = def.keyType === undefined ? undefined : valuesOf(def.keyType);
      return (values ?? []).filter((v): v is string => typeof v === 'string');
    }
    case 'intersection':
      return [def.left, def.right].flatMap((x) => (x === undefined ? [] : keysOf(x, data)));
    case 'union':
      return unionBranches(core, data).flatMap((o) => keysOf(o, data));
    default:
      return [];
  }
}

/** Valid keys of the map at `path` in `data` (the data at the root is the whole document), deduplicated, in schema order. */
export function validKeysAt(schema: Schema, path: readonly (string | number)[], data: unknown): string[] {
  let here = data;
  for (const key of path) here = childData(here, key);
  const keys = schemasAt(schema, path, data).flatMap((s) => keysOf(s, here));
  return [...new Set(keys)];
}
