/**
 * `uniform-window`: every device gets one packet at a time drawn uniformly over a window.
 * 3GPP TR 37.868 clause 6.1, traffic model 1 (uniform over 60 s).
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import type { Stream } from '../random/index.js';
import type { TrafficModelEntry } from './model.js';
import { activeShareField, onceEachOverWindow } from './once-each.js';

export const uniformWindowSchema = z
  .strictObject({
    model: z.literal('uniform-window'),
    window: duration({ positive: true, description: 'Length of the activation window (TR 37.868 model 1: 60s).' }).default(
      60_000,
    ),
    start: duration({ description: 'When the window opens.' }).default(0),
    active_share: activeShareField,
  })
  .describe('Each device activates once, uniformly over a window (3GPP TR 37.868 traffic model 1).');

export type UniformWindowParams = z.output<typeof uniformWindowSchema>;

function uniformFraction(s: Stream): number {
  return s.next();
}

export const uniformWindow: TrafficModelEntry<UniformWindowParams> = {
  name: 'uniform-window',
  summary: 'each device activates once, uniformly over `window` (TR 37.868 model 1)',
  schema: uniformWindowSchema,
  recurring: () => false,
  create(params, env) {
    return onceEachOverWindow(env, params, uniformFraction);
  },
};
