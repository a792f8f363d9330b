/**
 * The grant policies: `random-grant`, `predicted-grant`, `configured-grant`. Each may fall back to
 * contention after `fallback_after` (hybrid access) or give a packet up after `max_wait`.
 */
import { z } from 'zod';
import { duration } from '../../config/duration.js';
import { predictorSchema } from '../../predict/registry.js';

const waiting = {
  fallback_after: duration({ description: 'After waiting this long for a grant, the packet contends on the random-access channel instead (hybrid access).' }).optional(),
  max_wait: duration({ positive: true, description: 'After waiting this long for a grant the packet is given up (not with fallback_after).' }).optional(),
  grant_monitoring: z
    .number()
    .min(0)
    .max(1)
    .default(1)
    .describe('Share of the time spent waiting for a grant that the device listens for one (energy model; 1 = continuous monitoring).'),
};

const budget = z
  .number()
  .int()
  .positive()
  .optional()
  .describe('Most grants this group takes per occasion (default: every free unit left by the groups before it).');

const exclusive = <T extends { fallback_after?: number | undefined; max_wait?: number | undefined }>(p: T): boolean =>
  p.fallback_after === undefined || p.max_wait === undefined;
const exclusiveMessage = { message: 'give either fallback_after or max_wait, not both', path: ['max_wait'] };

export const randomGrantSchema = z
  .strictObject({ policy: z.literal('random-grant'), grants_per_occasion: budget, ...waiting })
  .refine(exclusive, exclusiveMessage)
  .describe('At every grant occasion, grant devices chosen uniformly among all devices of the group.');

export const predictedGrantSchema = z
  .strictObject({ policy: z.literal('predicted-grant'), predictor: predictorSchema, grants_per_occasion: budget, ...waiting })
  .refine(exclusive, exclusiveMessage)
  .describe('At every grant occasion, grant the devices a predictor expects to hold data.');

export const configuredGrantSchema = z
  .strictObject({
    policy: z.literal('configured-grant'),
    period: duration({ positive: true, description: 'Period of each device’s own reserved transmission opportunity (offsets spread the devices over the period).' }).refine(
      Number.isInteger,
      { message: 'must be a whole number of milliseconds (subframes)' },
    ),
    ...waiting,
  })
  .refine(exclusive, exclusiveMessage)
  .describe('Every device owns a periodic reserved transmission opportunity (as NR configured grants).');

export type RandomGrantParams = z.output<typeof randomGrantSchema>;
export type PredictedGrantParams = z.output<typeof predictedGrantSchema>;
export type ConfiguredGrantParams = z.output<typeof configuredGrantSchema>;
