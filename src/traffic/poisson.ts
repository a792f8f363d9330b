/**
 * `poisson`: every device gets packets as an independent Poisson process with mean inter-arrival
 * `mean_interval`.
 *
 * Implemented as the superposition (a Poisson process of rate N/mean_interval whose points are marked
 * with a uniformly chosen device), which has exactly the same law and keeps a single pending event per
 * group however many devices it holds: a device that sends nothing costs nothing.
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import { exponential } from '../random/index.js';
import type { TrafficModelEntry } from './model.js';

export const poissonSchema = z
  .strictObject({
    model: z.literal('poisson'),
    mean_interval: duration({ positive: true, description: 'Mean time between two packets of one device.' }),
    start: duration({ description: 'When arrivals begin.' }).default(0),
  })
  .describe('Each device sends packets as a Poisson process with mean inter-arrival `mean_interval`.');

export type PoissonParams = z.output<typeof poissonSchema>;

export const poisson: TrafficModelEntry<PoissonParams> = {
  name: 'poisson',
  summary: 'each device sends as a Poisson process with mean inter-arrival `mean_interval`',
  schema: poissonSchema,
  recurring: () => true,
  create(params, env) {
    const times = env.stream('times');
    const pick = env.stream('devices');
    const n = env.deviceCount;
    const meanGap = params.mean_interval / n;
    const kind = env.sim.defineEvent(`arrival/${env.group}`, (_subject, now) => {
      env.sim.at(now + exponential(times, meanGap), kind, 0);
      env.packetArrives(env.firstDevice + pick.int(n));
    });
    return {
      start(): void {
        if (n > 0) env.sim.at(params.start + exponential(times, meanGap), kind, 0);
      },
    };
  },
};
