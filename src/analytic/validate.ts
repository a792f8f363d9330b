/** Argument checks shared by the closed forms; each throws a RangeError naming the argument. */

export function requireInteger(name: string, x: number, min: number): void {
  if (!(Number.isInteger(x) && x >= min)) throw new RangeError(`${name} must be an integer ≥ ${min}, got ${x}`);
}

/** p in [0, 1] (or (0, 1] when `open` is set). */
export function requireProbability(name: string, p: number, open = false): void {
  const ok = open ? p > 0 && p <= 1 : p >= 0 && p <= 1;
  if (!ok) throw new RangeError(`${name} must be in ${open ? '(0, 1]' : '[0, 1]'}, got ${p}`);
}

export function requireNonNegative(name: string, x: number): void {
  if (!(x >= 0 && Number.isFinite(x))) throw new RangeError(`${name} must be a finite number ≥ 0, got ${x}`);
}

export function requirePositive(name: string, x: number): void {
  if (!(x > 0 && Number.isFinite(x))) throw new RangeError(`${name} must be a finite number > 0, got ${x}`);
}
