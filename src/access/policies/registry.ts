/** The access-policy registry: YAML name (`access.policy`) → schema and constructor. */
import { z } from 'zod';
import { createPredictor } from '../../predict/registry.js';
import { ConfiguredGrants } from '../grants/configured.js';
import { DynamicGrants } from '../grants/dynamic.js';
import { GrantedAccess } from '../grants/granted-access.js';
import { PredictorSelector, RandomSelector } from '../grants/selectors.js';
import type { AccessPolicy, PolicyContext } from '../policy.js';
import { contentionPolicySchema, createContentionPolicy } from './contention.js';
import { configuredGrantSchema, predictedGrantSchema, randomGrantSchema } from './grant-policies.js';

export const accessSchema = z
  .discriminatedUnion('policy', [contentionPolicySchema, randomGrantSchema, predictedGrantSchema, configuredGrantSchema])
  .describe('How the group reaches the uplink.');

export type AccessParams = z.output<typeof accessSchema>;

/** A built policy, with its grant front-end when it uses grants (the scheduler needs those). */
export interface BuiltPolicy {
  readonly policy: AccessPolicy;
  readonly dynamic?: DynamicGrants;
  readonly configured?: ConfiguredGrants;
}

function timing(ctx: PolicyContext): { grantPeriod: number; grantDelay: number; tti: number } {
  return { grantPeriod: ctx.uplink.grant_period, grantDelay: ctx.uplink.grant_delay, tti: ctx.uplink.tti };
}

export function createPolicy(params: AccessParams, ctx: PolicyContext): BuiltPolicy {
  if (params.policy === 'contention') return { policy: createContentionPolicy(params, ctx) };
  const access = new GrantedAccess(ctx, {
    fallbackAfter: params.fallback_after ?? Infinity,
    maxWait: params.max_wait ?? Infinity,
    monitoring: params.grant_monitoring,
  });
  const ledger = ctx.host.ledger;
  switch (params.policy) {
    case 'random-grant': {
      const selector = new RandomSelector(ctx.streams.stream(`grants/${ctx.group}/random`), ctx.deviceCount);
      const dynamic = new DynamicGrants(access, selector, ledger, params.grants_per_occasion ?? Infinity, ctx.host.sim, ctx.group, timing(ctx));
      access.front = dynamic;
      return { policy: access, dynamic };
    }
    case 'predicted-grant': {
      const predictor = createPredictor(params.predictor, {
        sim: ctx.host.sim,
        deviceCount: ctx.deviceCount,
        get positions() {
          return ctx.positions();
        },
        stream: (purpose) => ctx.streams.stream(`predict/${ctx.group}/${purpose}`),
        flag: (i, on) => access.flag(i, on),
      });
      const dynamic = new DynamicGrants(access, new PredictorSelector(predictor), ledger, params.grants_per_occasion ?? Infinity, ctx.host.sim, ctx.group, timing(ctx));
      access.front = dynamic;
      return { policy: access, dynamic };
    }
    case 'configured-grant': {
      const configured = new ConfiguredGrants(access, params.period, ledger, ctx.host.sim, ctx.group);
      access.front = configured;
      return { policy: access, configured };
    }
  }
}
