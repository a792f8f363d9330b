/**
 * `markov`: a two-state (quiet / alarm) Markov-modulated Poisson process (MMPP).
 *
 * Devices are grouped into zones of `zone_devices` consecutive device indices (`scope: zone`; the last
 * zone may be smaller) or each device is its own zone (`scope: device`). Every zone has one state:
 * quiet periods last Exp(mean_quiet), alarm periods Exp(mean_alarm), and while in a state every device
 * of the zone sends as a Poisson process with mean inter-arrival `quiet_interval` (none when omitted)
 * or `alarm_interval`. The zones are independent; each starts at `start` in the stationary
 * distribution, P(alarm) = mean_alarm / (mean_alarm + mean_quiet).
 *
 * Each zone holds exactly one pending kernel event: the next event of the competing exponential clocks
 * (state switch, or the next point of the zone's superposed Poisson process). Since all clocks are
 * memoryless, the time to the next event is drawn with the total rate and its kind is decided when it
 * fires (switch with probability switch rate / total rate, otherwise a packet for a uniformly chosen
 * device of the zone); the clocks are redrawn after every event.
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import { exponential } from '../random/index.js';
import type { TrafficEnv, TrafficModelEntry, TrafficSource } from './model.js';

export const markovSchema = z
  .strictObject({
    model: z.literal('markov'),
    quiet_interval: duration({
      positive: true,
      description: 'Mean time between two packets of one device while quiet; omit it for silence while quiet.',
    }).optional(),
    alarm_interval: duration({ positive: true, description: 'Mean time between two packets of one device while in alarm.' }),
    mean_quiet: duration({ positive: true, description: 'Mean length of a quiet period (exponential).' }),
    mean_alarm: duration({ positive: true, description: 'Mean length of an alarm period (exponential).' }),
    scope: z
      .enum(['device', 'zone'])
      .default('device')
      .describe('`device`: every device has its own state; `zone`: devices of one zone share one state.'),
    zone_devices: z
      .number()
      .int()
      .positive()
      .optional()
      .describe('Devices per zone (consecutive device indices; the last zone may be smaller); only with `scope: zone`, default 100.'),
    start: duration({ description: 'When the state processes start (in their stationary distribution).' }).default(0),
  })
  .refine((p) => p.scope === 'zone' || p.zone_devices === undefined, {
    message: '`zone_devices` applies only with `scope: zone`',
    path: ['zone_devices'],
  })
  .describe('Each device (or zone of devices) alternates between quiet and alarm states, sending as a Poisson process whose rate depends on the state.');

export type MarkovParams = z.output<typeof markovSchema>;

/** Devices per zone when `scope: zone` and `zone_devices` is not given. */
export const DEFAULT_ZONE_DEVICES = 100;

/** Stationary probability of the alarm state: mean_alarm / (mean_alarm + mean_quiet) (exact). */
export function alarmProbability(p: Pick<MarkovParams, 'mean_quiet' | 'mean_alarm'>): number {
  return p.mean_alarm / (p.mean_alarm + p.mean_quiet);
}

/** Devices per zone for these parameters (1 for `scope: device`). */
export function zoneSize(p: Pick<MarkovParams, 'scope' | 'zone_devices'>): number {
  return p.scope === 'zone' ? (p.zone_devices ?? DEFAULT_ZONE_DEVICES) : 1;
}

/** A markov source; `inAlarm` exposes a zone's state (for tests and diagnostics). */
export interface MarkovSource extends TrafficSource {
  readonly zoneCount: number;
  inAlarm(zone: number): boolean;
}

export function createMarkovSource(params: MarkovParams, env: TrafficEnv): MarkovSource {
  const n = env.deviceCount;
  const size = zoneSize(params);
  const zones = Math.ceil(n / size);
  const alarm = new Uint8Array(zones);
  const times = env.stream('times');
  const choices = env.stream('choices');
  const devices = env.stream('devices');
  const leaveRate = [1 / params.mean_quiet, 1 / params.mean_alarm] as const;
  const packetRate = [params.quiet_interval === undefined ? 0 : 1 / params.quiet_interval, 1 / params.alarm_interval] as const;
  const first = env.firstDevice;
  const members = (zone: number): number => Math.min(size, n - zone * size);

  const schedule = (zone: number, now: number): void => {
    const s = alarm[zone] as number;
    const total = leaveRate[s as 0 | 1] + packetRate[s as 0 | 1] * members(zone);
    env.sim.at(now + exponential(times, 1 / total), kind, zone);
  };
  const kind = env.sim.defineEvent(`arrival/${env.group}`, (zone, now) => {
    const s = alarm[zone] as 0 | 1;
    const m = members(zone);
    const leave = leaveRate[s];
    const u = choices.next() * (leave + packetRate[s] * m);
    if (u < leave) {
      alarm[zone] = 1 - s;
      schedule(zone, now);
      return;
    }
    schedule(zone, now);
    env.packetArrives(first + zone * size + (m === 1 ? 0 : devices.int(m)));
  });

  return {
    zoneCount: zones,
    inAlarm: (zone) => alarm[zone] === 1,
    start(): void {
      const states = env.stream('states');
      const pAlarm = alarmProbability(params);
      for (let z = 0; z < zones; z++) {
        alarm[z] = states.next() < pAlarm ? 1 : 0;
        schedule(z, params.start);
      }
    },
  };
}

export const markov: TrafficModelEntry<MarkovParams> = {
  name: 'markov',
  summary: 'quiet/alarm Markov-modulated Poisson traffic, per device or per zone of consecutive devices',
  schema: markovSchema,
  recurring: () => true,
  create: createMarkovSource,
};
