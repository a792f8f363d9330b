/** `contention`: the device uses the cell's 4-step random-access procedure for every packet. */
import { z } from 'zod';
import type { AccessPolicy, PolicyContext } from '../policy.js';

export const contentionPolicySchema = z
  .strictObject({
    policy: z.literal('contention'),
  })
  .describe('Contend on the random-access channel for every packet (4-step procedure).');

export type ContentionPolicyParams = z.output<typeof contentionPolicySchema>;

export function createContentionPolicy(_params: ContentionPolicyParams, ctx: PolicyContext): AccessPolicy {
  const procedure = ctx.contention;
  return { begin: (device) => procedure.begin(device) };
}
