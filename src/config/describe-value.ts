/** Short renderings of YAML values and zod expectations for problem reports. */

const MAX = 60;

function clip(text: string): string {
  return text.length <= MAX ? text : `${text.slice(0, MAX - 1)}…`;
}

/** Short rendering of a value: strings quoted, lists and maps as compact JSON, clipped; undefined for a missing value. */
export function renderValue(value: unknown): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value === 'string') return clip(JSON.stringify(value));
  if (typeof value === 'number' || typeof value === 'boolean' || typeof value === 'bigint') return String(value);
  if (value === null) return 'null (empty value)';
  try {
    return clip(JSON.stringify(value) ?? String(value));
  } catch {
    return clip(String(value));
  }
}

/** What kind of value this is, in words ("a string", "a list", "a map", ...). */
export function kindOf(value: unknown): string {
  if (value === null) return 'an empty value';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'number') return Number.isInteger(value) ? 'an integer' : 'a number with a fraction';
  if (typeof value === 'string') return 'a string';
  if (typeof value === 'boolean') return 'true/false';
  if (typeof value === 'object') return 'a map';
  return typeof value;
}

const TYPE_WORDS: Readonly<Record<string, string>> = {
  string: 'a string',
  number: 'a number',
  int: 'an integer',
  boolean: 'true or false',
  object: 'a map',
  record: 'a map',
  array: 'a list',
  tuple: 'a list',
  null: 'an empty value (null)',
  undefined: 'nothing',
  never: 'nothing (the key is not allowed here)',
  nonoptional: 'a value',
};

/** Words for a zod `expected` type name. */
export function typeWords(expected: string): string {
  return TYPE_WORDS[expected] ?? `a ${expected}`;
}

/** "`a`" or "one of `a`, `b`, `c`", at most 15 shown. */
export function oneOf(values: readonly unknown[]): string {
  const shown = values.slice(0, 15).map((v) => `\`${String(v)}\``);
  const more = values.length > 15 ? `, … (${values.length} in all)` : '';
  return values.length === 1 ? (shown[0] ?? '') : `one of ${shown.join(', ')}${more}`;
}
