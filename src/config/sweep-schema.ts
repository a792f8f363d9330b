/**
 * The `sweep:` section: axes that vary config paths. Each axis is a path plus a list of values, a
 * linear range (`from`, `to`, and `step` or `count`) or a log range (`scale: log`, with `count`). Axes
 * combine as a full grid (default) or zipped (all axes the same length, taken together).
 */
import { z } from 'zod';

const axisPath = z
  .string()
  .regex(/^[A-Za-z0-9_-]+(\.[A-Za-z0-9_-]+)*$/, 'a dotted key path such as groups.meters.count')
  .describe('Dotted path of the key to vary, as for --set (e.g. groups.meters.count).');

const rangeSchema = z
  .strictObject({
    from: z.number().describe('First value.'),
    to: z.number().describe('Last value (included when the steps land on it).'),
    step: z.number().positive().optional().describe('Distance between values (linear scale).'),
    count: z.number().int().min(2).max(10_000).optional().describe('Number of values, ends included.'),
    scale: z.enum(['linear', 'log']).default('linear').describe('linear: evenly spaced; log: evenly spaced in log10 (from and to > 0; needs count).'),
    integer: z.boolean().default(false).describe('Round every value to the nearest integer (duplicates removed).'),
  })
  .refine((r) => (r.step === undefined) !== (r.count === undefined), { message: 'give exactly one of step or count', path: ['step'] })
  .refine((r) => r.scale !== 'log' || (r.count !== undefined && r.from > 0 && r.to > 0), {
    message: 'a log range needs count and from, to > 0',
    path: ['scale'],
  })
  .refine((r) => r.step === undefined || (r.to - r.from) / r.step <= 10_000, { message: 'more than 10,000 values', path: ['step'] })
  .describe('A range of numbers.');

const axisSchema = z
  .strictObject({
    path: axisPath,
    values: z.array(z.unknown()).min(1).optional().describe('The values, each written as it would be at that path.'),
    range: rangeSchema.optional(),
    labels: z.array(z.string()).optional().describe('Names for the values in tables and plots (same length as values).'),
  })
  .refine((a) => (a.values === undefined) !== (a.range === undefined), { message: 'give exactly one of values or range', path: ['values'] })
  .refine((a) => a.labels === undefined || a.values === undefined || a.labels.length === a.values.length, {
    message: 'labels must have one entry per value',
    path: ['labels'],
  })
  .describe('One swept key.');

export const sweepSchema = z
  .strictObject({
    combine: z.enum(['grid', 'zip']).default('grid').describe('grid: every combination; zip: the i-th values of all axes together.'),
    axes: z.array(axisSchema).min(1).describe('The swept keys.'),
  })
  .describe('Parameter sweep: every point runs all replications.');

export type SweepSpec = z.output<typeof sweepSchema>;
export type AxisSpec = z.output<typeof axisSchema>;
export type RangeSpec = z.output<typeof rangeSchema>;

/** The numbers of a range, in order. */
export function rangeValues(r: RangeSpec): number[] {
  const out: number[] = [];
  if (r.count !== undefined) {
    for (let k = 0; k < r.count; k++) {
      const f = r.count === 1 ? 0 : k / (r.count - 1);
      out.push(r.scale === 'log' ? 10 ** (Math.log10(r.from) + f * (Math.log10(r.to) - Math.log10(r.from))) : r.from + f * (r.to - r.from));
    }
  } else if (r.step !== undefined) {
    const direction = r.to >= r.from ? 1 : -1;
    const n = Math.floor(Math.abs(r.to - r.from) / r.step + 1e-9);
    for (let k = 0; k <= n; k++) out.push(r.from + direction * k * r.step);
  }
  // Trim floating-point noise (0.1 + 0.2) so values print and compare cleanly.
  const cleaned = out.map((x) => Number.parseFloat(x.toPrecision(12)));
  if (!r.integer) return cleaned;
  return [...new Set(cleaned.map((x) => Math.round(x)))];
}
