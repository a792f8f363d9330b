/** A minimal traffic environment for driving models directly (not a test file itself). */
import type { Positions } from '../../src/geometry/positions.js';
import { Simulator } from '../../src/kernel/index.js';
import { replicationSeed, StreamSet } from '../../src/random/index.js';
import type { TrafficEnv } from '../../src/traffic/model.js';

export interface FakeEnv extends TrafficEnv {
  /** Recorded arrivals, in order: cell-wide device id and time (ms). */
  readonly devices: number[];
  readonly times: number[];
}

export interface FakeEnvOptions {
  readonly deviceCount: number;
  readonly seed?: string;
  readonly firstDevice?: number;
  readonly positions?: Positions | null;
  readonly cellRadius?: number;
  readonly horizon?: number;
}

/** A real Simulator and StreamSet; `packetArrives` records (device, time). */
export function fakeEnv(o: FakeEnvOptions): FakeEnv {
  const sim = new Simulator();
  const streams = new StreamSet(replicationSeed(o.seed ?? 'jostle-traffic-tests', null, 0));
  const devices: number[] = [];
  const times: number[] = [];
  return {
    sim,
    group: 'g',
    firstDevice: o.firstDevice ?? 0,
    deviceCount: o.deviceCount,
    horizon: o.horizon ?? Infinity,
    positions: o.positions ?? null,
    cellRadius: o.cellRadius ?? 1000,
    stream: (purpose) => streams.stream(`traffic/g/${purpose}`),
    packetArrives: (device) => {
      devices.push(device);
      times.push(sim.now);
    },
    devices,
    times,
  };
}

export function mean(x: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += x[i] as number;
  return s / x.length;
}

/** Unbiased sample variance. */
export function variance(x: ArrayLike<number>): number {
  const m = mean(x);
  let s = 0;
  for (let i = 0; i < x.length; i++) s += ((x[i] as number) - m) ** 2;
  return s / (x.length - 1);
}
