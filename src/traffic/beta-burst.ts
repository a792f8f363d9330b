/**
 * `beta-burst`: every device gets one packet at start + window·X with X ~ Beta(alpha, beta).
 * 3GPP TR 37.868 clause 6.1, traffic model 2 (Beta(3, 4) over 10 s), the synchronised burst that follows
 * e.g. a power outage or an alarm.
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import { beta, type Stream } from '../random/index.js';
import type { TrafficModelEntry } from './model.js';
import { activeShareField, onceEachOverWindow } from './once-each.js';

export const betaBurstSchema = z
  .strictObject({
    model: z.literal('beta-burst'),
    window: duration({ positive: true, description: 'Length of the burst (TR 37.868 model 2: 10s).' }).default(10_000),
    alpha: z.number().positive().default(3).describe('First Beta shape parameter (TR 37.868 model 2: 3).'),
    beta: z.number().positive().default(4).describe('Second Beta shape parameter (TR 37.868 model 2: 4).'),
    start: duration({ description: 'When the burst window opens.' }).default(0),
    active_share: activeShareField,
  })
  .describe('Each device activates once at start + window·X, X ~ Beta(alpha, beta) (3GPP TR 37.868 traffic model 2).');

export type BetaBurstParams = z.output<typeof betaBurstSchema>;

function betaFraction(s: Stream, p: BetaBurstParams): number {
  return beta(s, p.alpha, p.beta);
}

export const betaBurst: TrafficModelEntry<BetaBurstParams> = {
  name: 'beta-burst',
  summary: 'each device activates once at window·X, X ~ Beta(alpha, beta) (TR 37.868 model 2)',
  schema: betaBurstSchema,
  recurring: () => false,
  create(params, env) {
    return onceEachOverWindow(env, params, betaFraction);
  },
};
