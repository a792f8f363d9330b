/** Recursive `Object.freeze` for resolved configuration values. */

/** A deeply readonly view of a plain-data type. */
export type DeepReadonly<T> = T extends (...args: never[]) => unknown
  ? T
  : T extends readonly (infer U)[]
    ? readonly DeepReadonly<U>[]
    : T extends object
      ? { readonly [K in keyof T]: DeepReadonly<T[K]> }
      : T;

function freezeInto(value: unknown, seen: WeakSet<object>): void {
  if (typeof value !== 'object' || value === null || seen.has(value)) return;
  seen.add(value);
  if (ArrayBuffer.isView(value)) return; // typed arrays cannot be frozen while they hold elements
  for (const key of Reflect.ownKeys(value)) {
    freezeInto((value as Record<PropertyKey, unknown>)[key], seen);
  }
  Object.freeze(value);
}

/**
 * Freezes `value` and every object and array reachable from it (cycles are fine; typed arrays are
 * left writable), and returns it. Mutating the result throws in strict mode.
 */
export function deepFreeze<T>(value: T): Readonly<T> {
  freezeInto(value, new WeakSet());
  return value;
}
