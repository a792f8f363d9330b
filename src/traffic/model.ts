/**
 * The contract between a traffic model and the cell.
 *
 * A traffic model decides *when* each device of one group gets a packet; it knows nothing of how the
 * packet is delivered. It schedules its own events on the kernel and calls `packetArrives(device)`
 * at the simulated instant a packet appears in that device's buffer.
 */
import type { z } from 'zod';
import type { Simulator } from '../kernel/index.js';
import type { Stream } from '../random/index.js';

export interface TrafficEnv {
  readonly sim: Simulator;
  /** Name of the device group (for event names). */
  readonly group: string;
  /** Device ids of the group are firstDevice … firstDevice + deviceCount − 1. */
  readonly firstDevice: number;
  readonly deviceCount: number;
  /** End of simulated time in ms (Infinity when the run ends once all accesses are resolved). */
  readonly horizon: number;
  /** A named random stream owned by this group's traffic (e.g. "times", "devices"). */
  stream(purpose: string): Stream;
  /** A packet arrives now at `device`. */
  packetArrives(device: number): void;
}

export interface TrafficSource {
  /** Schedules the first arrivals; called once at time 0. */
  start(): void;
}

export interface TrafficModelEntry<P extends { model: string }> {
  /** The YAML name (`traffic.model`). */
  readonly name: P['model'];
  /** One line for the documentation and the JSON Schema. */
  readonly summary: string;
  readonly schema: z.ZodType<P, unknown>;
  /** True when the model produces packets without end, so the experiment needs a `horizon`. */
  recurring(params: P): boolean;
  create(params: P, env: TrafficEnv): TrafficSource;
}
