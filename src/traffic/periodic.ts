/**
 * `periodic`: every device reports every `period`, with its own random phase, each report delayed by a
 * uniform jitter in [0, jitter) (modelling choice: devices wake on schedule and report late, never early).
 *
 * Instead of one `period`, a `mix` of periods with shares may be given: each device draws its period
 * from the mix once, at the start (stream `period-mix`), and keeps it. Example: the mobile-autonomous-
 * reporting mix of 3GPP TR 45.820 Annex E (from memory): 1 d / 2 h / 1 h / 30 min at 40 / 40 / 15 / 5 %.
 *
 * Each device holds exactly one pending kernel event.
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import type { Stream } from '../random/index.js';
import type { TrafficModelEntry } from './model.js';

/** How far the shares of a mix may sum away from 1. */
export const SHARE_SUM_TOLERANCE = 1e-9;

const mixEntrySchema = z.strictObject({
  period: duration({ positive: true, description: 'Time between two reports of a device with this period.' }),
  share: z.number().positive().max(1).describe('Share of the group’s devices that report with this period (the shares sum to 1).'),
});

export const periodicSchema = z
  .strictObject({
    model: z.literal('periodic'),
    period: duration({ positive: true, description: 'Time between two reports of one device (or give `mix` instead).' }).optional(),
    mix: z
      .array(mixEntrySchema)
      .min(1)
      .optional()
      .describe(
        'Instead of `period`: periods with the share of devices using each; every device draws its period once. ' +
          'E.g. 3GPP TR 45.820 Annex E (from memory): 1d / 2h / 1h / 30min at 0.4 / 0.4 / 0.15 / 0.05.',
      ),
    jitter: duration({ description: 'Each report is delayed by a uniform draw in [0, jitter); must be below every period.' }).default(0),
    start: duration({ description: 'Phases are drawn uniformly in [start, start + period).' }).default(0),
  })
  .superRefine((p, ctx) => {
    if (p.period === undefined && p.mix === undefined) {
      ctx.addIssue({
        code: 'custom',
        message: 'give `period` (one period for all devices) or `mix` (periods with shares)',
        path: ['period'],
        params: { problem: 'missing-key', expected: 'a duration such as `1h`, or a `mix` list instead' },
      });
      return;
    }
    if (p.period !== undefined && p.mix !== undefined) {
      ctx.addIssue({ code: 'custom', message: 'give either `period` or `mix`, not both', path: ['mix'] });
      return;
    }
    if (p.mix !== undefined) {
      const sum = p.mix.reduce((s, e) => s + e.share, 0);
      if (Math.abs(sum - 1) > SHARE_SUM_TOLERANCE) {
        ctx.addIssue({ code: 'custom', message: `the shares of \`mix\` sum to ${sum}, not 1`, path: ['mix'] });
      }
    }
    if (p.jitter >= shortestPeriod(p)) {
      ctx.addIssue({ code: 'custom', message: 'jitter must be smaller than every period', path: ['jitter'] });
    }
  })
  .describe('Each device reports every `period` (or a period drawn once from `mix`) with a random phase and optional jitter.');

export type PeriodicParams = z.output<typeof periodicSchema>;

function shortestPeriod(p: Pick<PeriodicParams, 'period' | 'mix'>): number {
  return p.mix === undefined ? (p.period ?? Infinity) : Math.min(...p.mix.map((e) => e.period));
}

/** Mean reports per device per ms: 1/period, or Σ share/period over the mix (exact). */
export function meanReportRate(p: Pick<PeriodicParams, 'period' | 'mix'>): number {
  if (p.mix === undefined) return p.period === undefined ? 0 : 1 / p.period;
  return p.mix.reduce((s, e) => s + e.share / e.period, 0);
}

/** Each device's period (ms): the single period, or one draw per device from the mix. */
export function devicePeriods(p: Pick<PeriodicParams, 'period' | 'mix'>, n: number, mixStream: () => Stream): Float64Array {
  const periods = new Float64Array(n);
  if (p.mix === undefined) return periods.fill(p.period ?? 0);
  const mix = p.mix;
  const s = mixStream();
  for (let i = 0; i < n; i++) {
    let u = s.next();
    let k = 0;
    while (k < mix.length - 1 && u >= (mix[k]?.share ?? 0)) {
      u -= mix[k]?.share ?? 0;
      k++;
    }
    periods[i] = mix[k]?.period ?? 0;
  }
  return periods;
}

export const periodic: TrafficModelEntry<PeriodicParams> = {
  name: 'periodic',
  summary: 'each device reports every `period` (or one drawn from `mix`), random phase, optional late jitter',
  schema: periodicSchema,
  recurring: () => true,
  create(params, env) {
    const phases = env.stream('phases');
    const jitters = env.stream('jitter');
    const n = env.deviceCount;
    const first = env.firstDevice;
    const nominal = new Float64Array(n);
    const jitter = params.jitter;
    const periods = devicePeriods(params, n, () => env.stream('period-mix'));
    const kind = env.sim.defineEvent(`arrival/${env.group}`, (index) => {
      const next = (nominal[index] as number) + (periods[index] as number);
      nominal[index] = next;
      env.sim.at(jitter > 0 ? next + jitters.next() * jitter : next, kind, index);
      env.packetArrives(first + index);
    });
    return {
      start(): void {
        for (let i = 0; i < n; i++) {
          const t = params.start + phases.next() * (periods[i] as number);
          nominal[i] = t;
          env.sim.at(jitter > 0 ? t + jitters.next() * jitter : t, kind, i);
        }
      },
    };
  },
};
