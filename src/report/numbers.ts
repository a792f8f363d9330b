/** Number formatting for people: a mean is shown to the precision its confidence interval supports. */

/** Decimal places that show `halfWidth` with two significant digits (0 … 10). */
function decimalsFor(halfWidth: number): number {
  if (!Number.isFinite(halfWidth) || halfWidth <= 0) return -1;
  const d = 1 - Math.floor(Math.log10(halfWidth));
  return Math.min(10, Math.max(0, d));
}

/** Four significant digits, no exponent for ordinary magnitudes. */
export function significant(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(x)));
  if (magnitude >= 6 || magnitude <= -5) return x.toExponential(digits - 1);
  const decimals = Math.max(0, digits - 1 - magnitude);
  return x.toFixed(decimals);
}

/** "mean ± half-width" with matching precision; the half-width alone decides the decimals. */
export function withInterval(mean: number, halfWidth: number): { mean: string; halfWidth: string } {
  if (!Number.isFinite(mean)) return { mean: '—', halfWidth: '' };
  // A half-width at the level of floating-point noise is zero.
  const d = halfWidth <= 1e-9 * Math.abs(mean) ? -1 : decimalsFor(halfWidth);
  if (d < 0) return { mean: significant(mean), halfWidth: Number.isFinite(halfWidth) ? '0' : 'n/a' };
  return { mean: mean.toFixed(d), halfWidth: halfWidth.toFixed(d) };
}

/** "mean ± half-width" as one text; "—" for no value; the mean alone when there is no interval. */
export function intervalText(mean: number | null | undefined, halfWidth: number | null | undefined): string {
  if (mean === null || mean === undefined) return '—';
  const f = withInterval(mean, halfWidth ?? Number.NaN);
  return f.halfWidth === '' || f.halfWidth === 'n/a' ? f.mean : `${f.mean} ± ${f.halfWidth}`;
}
