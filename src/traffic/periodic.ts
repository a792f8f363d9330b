/**
 * `periodic`: every device reports every `period`, with its own random phase, each report delayed by a
 * uniform jitter in [0, jitter) (modelling choice: devices wake on schedule and report late, never early).
 * Each device holds exactly one pending kernel event.
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import type { TrafficModelEntry } from './model.js';

export const periodicSchema = z
  .strictObject({
    model: z.literal('periodic'),
    period: duration({ positive: true, description: 'Time between two reports of one device.' }),
    jitter: duration({ description: 'Each report is delayed by a uniform draw in [0, jitter); must be below the period.' }).default(0),
    start: duration({ description: 'Phases are drawn uniformly in [start, start + period).' }).default(0),
  })
  .refine((p) => p.jitter < p.period, { message: 'jitter must be smaller than period', path: ['jitter'] })
  .describe('Each device reports every `period` with a random phase and optional jitter.');

export type PeriodicParams = z.output<typeof periodicSchema>;

export const periodic: TrafficModelEntry<PeriodicParams> = {
  name: 'periodic',
  summary: 'each device reports every `period`, random phase, optional late jitter',
  schema: periodicSchema,
  recurring: () => true,
  create(params, env) {
    const phases = env.stream('phases');
    const jitters = env.stream('jitter');
    const n = env.deviceCount;
    const first = env.firstDevice;
    const nominal = new Float64Array(n);
    const { period, jitter } = params;
    const kind = env.sim.defineEvent(`arrival/${env.group}`, (index) => {
      const next = (nominal[index] as number) + period;
      nominal[index] = next;
      env.sim.at(jitter > 0 ? next + jitters.next() * jitter : next, kind, index);
      env.packetArrives(first + index);
    });
    return {
      start(): void {
        for (let i = 0; i < n; i++) {
          const t = params.start + phases.next() * period;
          nominal[i] = t;
          env.sim.at(jitter > 0 ? t + jitters.next() * jitter : t, kind, i);
        }
      },
    };
  },
};
