/** Conversion of an exact non-negative rational (BigInt numerator and denominator) to the nearest double. */

function bitLength(x: bigint): number {
  return x.toString(16).length * 4;
}

/**
 * num/den as a double with about one ulp of error: forms a quotient of ~64 significant bits by
 * shifting, converts it, then scales by a power of two in steps (no intermediate overflow/underflow).
 */
export function ratioToNumber(num: bigint, den: bigint): number {
  if (den <= 0n || num < 0n) throw new RangeError('ratioToNumber expects num ≥ 0 and den > 0');
  if (num === 0n) return 0;
  const shift = 64 + bitLength(den) - bitLength(num);
  const q = shift >= 0 ? (num << BigInt(shift)) / den : num / (den << BigInt(-shift));
  let value = Number(q);
  let remaining = -shift;
  while (remaining !== 0 && value !== 0 && Number.isFinite(value)) {
    const step = Math.max(-1000, Math.min(1000, remaining));
    value *= 2 ** step;
    remaining -= step;
  }
  return value;
}
