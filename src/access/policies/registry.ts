/** The access-policy registry: YAML name (`access.policy`) → schema and constructor. */
import { z } from 'zod';
import type { AccessPolicy, PolicyContext } from '../policy.js';
import { contentionPolicySchema, createContentionPolicy } from './contention.js';

export const accessSchema = z
  .discriminatedUnion('policy', [contentionPolicySchema])
  .describe('How the group reaches the uplink.');

export type AccessParams = z.output<typeof accessSchema>;

export const policyNames: readonly string[] = ['contention'];

export function createPolicy(params: AccessParams, ctx: PolicyContext): AccessPolicy {
  switch (params.policy) {
    case 'contention':
      return createContentionPolicy(params, ctx);
  }
}
