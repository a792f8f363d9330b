/** A small experiment-like schema used by the config tests (not the real experiment schema). */
import { z } from 'zod';
import { duration } from '../../src/config/duration.js';

export const groupSchema = z.strictObject({
  count: z.number().int().positive(),
  period: duration({ positive: true }),
  mode: z.enum(['periodic', 'poisson']).default('poisson'),
});

export const backoffSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('uniform'), window: duration({ positive: true }) }),
  z.strictObject({ kind: z.literal('exponential'), base: duration({ positive: true }), factor: z.number().gt(1).default(2) }),
]);

export const demoSchema = z.strictObject({
  name: z.string().describe('Name of the run.'),
  preambles: z.number().int().positive().default(54).describe('Preambles per opportunity.'),
  slot: duration({ positive: true, description: 'Slot length.' }).default(1),
  horizon: duration({ positive: true }),
  backoff: backoffSchema.prefault({ kind: 'uniform', window: '20ms' }),
  groups: z.record(z.string(), groupSchema),
});

export type DemoConfig = z.output<typeof demoSchema>;
