/**
 * `alarm-field`: spatially correlated alarms. Alarm events form a Poisson process in time (mean gap
 * `event_interval` for the whole cell, from `start`); each has an epicentre uniform in the cell disc.
 * A device at distance d from the epicentre reports it (one packet) with probability
 * exp(−d² / (2σ²)), after a delay drawn from an exponential with mean `report_delay`.
 *
 * Truncation: only devices within 4σ of the epicentre are visited (through a {@link PointGrid} with
 * cells of size σ); farther devices would report with probability below e^−8 ≈ 3.4·10⁻⁴ and are
 * ignored.
 *
 * Kernel events: one pending alarm event for the group, plus one event per pending report (subject =
 * device index within the group).
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import { length } from '../config/length.js';
import { PointGrid } from '../geometry/grid.js';
import type { Positions } from '../geometry/positions.js';
import { exponential, type Stream } from '../random/index.js';
import type { TrafficEnv, TrafficModelEntry, TrafficSource } from './model.js';

/** Devices farther than this many σ from an epicentre are not visited. */
export const CUTOFF_SIGMAS = 4;

export const alarmFieldSchema = z
  .strictObject({
    model: z.literal('alarm-field'),
    event_interval: duration({ positive: true, description: 'Mean time between two alarm events in the cell (Poisson process).' }),
    sigma: length({
      positive: true,
      description: 'Reach of an event: a device at distance d reports with probability exp(−d²/(2σ²)).',
    }).prefault('100m'),
    report_delay: duration({ description: 'Mean of the exponential delay between an event and a report.' }).default(2000),
    start: duration({ description: 'When alarm events begin.' }).default(0),
  })
  .describe('Alarm events at random places; devices near an event report it with a Gaussian-shaped probability of distance (needs the group layout).');

export type AlarmFieldParams = z.output<typeof alarmFieldSchema>;

/**
 * Draws which devices report an event: visits every device within 4σ of the epicentre and calls
 * `report(index)` for each one that reports, in the grid's fixed order, one uniform draw per visited
 * device. Built once per source (no allocation per event).
 */
export class ReporterSampler {
  private count = 0;
  private readonly visit: (index: number, d2: number) => void;

  constructor(
    private readonly grid: PointGrid,
    private readonly sigma: number,
    stream: Stream,
    report: (index: number) => void,
  ) {
    const twoSigma2 = 2 * sigma * sigma;
    this.visit = (index, d2) => {
      if (stream.next() < Math.exp(-d2 / twoSigma2)) {
        this.count++;
        report(index);
      }
    };
  }

  /** Draws the reporters of an event at (x, y) (m); returns how many report. */
  draw(x: number, y: number): number {
    this.count = 0;
    this.grid.forEachWithin(x, y, CUTOFF_SIGMAS * this.sigma, this.visit);
    return this.count;
  }
}

/** Called at every alarm event with its time (ms) and epicentre (m); for tests and diagnostics. */
export type AlarmObserver = (time: number, x: number, y: number) => void;

/** The alarm-field source; `observe` sees every alarm event. */
export function createAlarmField(params: AlarmFieldParams, env: TrafficEnv, observe?: AlarmObserver): TrafficSource {
  const positions: Positions | null = env.positions;
  if (positions === null || positions.x.length !== env.deviceCount) {
    throw new Error(`alarm-field traffic of group ${env.group} needs the positions of its ${env.deviceCount} devices`);
  }
  const grid = new PointGrid(positions, params.sigma);
  const gaps = env.stream('events');
  const places = env.stream('epicentres');
  const delays = env.stream('delays');
  const meanDelay = params.report_delay;
  const radius = env.cellRadius;
  const first = env.firstDevice;
  let now = 0;

  const report = env.sim.defineEvent(`arrival/${env.group}`, (index) => env.packetArrives(first + index));
  const sampler = new ReporterSampler(grid, params.sigma, env.stream('reporters'), (index) => {
    env.sim.at(meanDelay > 0 ? now + exponential(delays, meanDelay) : now, report, index);
  });
  const alarm = env.sim.defineEvent(`alarm/${env.group}`, (_subject, t) => {
    now = t;
    env.sim.at(t + exponential(gaps, params.event_interval), alarm, 0);
    const r = radius * Math.sqrt(places.next());
    const theta = 2 * Math.PI * places.next();
    const x = r * Math.cos(theta);
    const y = r * Math.sin(theta);
    observe?.(t, x, y);
    sampler.draw(x, y);
  });
  return {
    start(): void {
      if (env.deviceCount > 0) env.sim.at(params.start + exponential(gaps, params.event_interval), alarm, 0);
    },
  };
}

export const alarmField: TrafficModelEntry<AlarmFieldParams> = {
  name: 'alarm-field',
  summary: 'alarm events at random places; nearby devices report with probability exp(−d²/(2σ²))',
  schema: alarmFieldSchema,
  recurring: () => true,
  needsPositions: () => true,
  create: (params, env) => createAlarmField(params, env),
};
