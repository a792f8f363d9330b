/**
 * `beta-burst`: every device gets one packet at start + window·X with X ~ Beta(alpha, beta).
 * 3GPP TR 37.868 clause 6.1, traffic model 2 (Beta(3, 4) over 10 s), the synchronised burst that follows
 * e.g. a power outage or an alarm.
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import { beta } from '../random/index.js';
import type { TrafficModelEntry } from './model.js';
import { activeDevices, onceEachSource } from './once-each.js';

export const betaBurstSchema = z
  .strictObject({
    model: z.literal('beta-burst'),
    window: duration({ positive: true, description: 'Length of the burst (TR 37.868 model 2: 10s).' }).default(10_000),
    alpha: z.number().positive().default(3).describe('First Beta shape parameter (TR 37.868 model 2: 3).'),
    beta: z.number().positive().default(4).describe('Second Beta shape parameter (TR 37.868 model 2: 4).'),
    start: duration({ description: 'When the burst window opens.' }).default(0),
    active_share: z
      .number()
      .min(0)
      .max(1)
      .default(1)
      .describe('Share of the devices that send at all (each independently); 1: every device.'),
  })
  .describe('Each device activates once at start + window·X, X ~ Beta(alpha, beta) (3GPP TR 37.868 traffic model 2).');

export type BetaBurstParams = z.output<typeof betaBurstSchema>;

export const betaBurst: TrafficModelEntry<BetaBurstParams> = {
  name: 'beta-burst',
  summary: 'each device activates once at window·X, X ~ Beta(alpha, beta) (TR 37.868 model 2)',
  schema: betaBurstSchema,
  recurring: () => false,
  create(params, env) {
    const devices = activeDevices(env, params.active_share);
    const s = env.stream('times');
    const times = new Float64Array(devices?.length ?? env.deviceCount);
    for (let i = 0; i < times.length; i++) times[i] = params.start + beta(s, params.alpha, params.beta) * params.window;
    return onceEachSource(env, times, params.start, params.start + params.window, devices);
  },
};
