/**
 * The contract between a traffic model and the cell.
 *
 * A traffic model decides *when* each device of one group gets a packet; it knows nothing of how the
 * packet is delivered. It schedules its own events on the kernel and calls `packetArrives(device)`
 * at the simulated instant a packet appears in that device's buffer.
 */
import type { z } from 'zod';
import type { Positions } from '../geometry/positions.js';
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
  /**
   * Positions of the group's devices in metres (index = device index within the group), or null when
   * the group's model does not need them (see {@link TrafficModelEntry.needsPositions}).
   */
  readonly positions: Positions | null;
  /** Radius of the cell disc in metres (centred at (0, 0)). */
  readonly cellRadius: number;
  /** A named random stream owned by this group's traffic (e.g. "times", "devices"). */
  stream(purpose: string): Stream;
  /** A packet arrives now at `device`. */
  packetArrives(device: number): void;
}

export interface TrafficSource {
  /** Schedules the first arrivals; called once at time 0. */
  start(): void;
  /**
   * Optional: the cell calls this when `device` (a cell-wide device id, as given to `packetArrives`)
   * has just emptied its buffer. Only generate-at-will models implement it; they may call
   * `packetArrives(device)` from inside, so the cell calls it after its own bookkeeping is done.
   */
  deviceIdle?(device: number): void;
}

export interface TrafficModelEntry<P extends { model: string }> {
  /** The YAML name (`traffic.model`). */
  readonly name: P['model'];
  /** One line for the documentation and the JSON Schema. */
  readonly summary: string;
  readonly schema: z.ZodType<P, unknown>;
  /** True when the model produces packets without end, so the experiment needs a `horizon`. */
  recurring(params: P): boolean;
  /** Optional: true when `create` needs `env.positions` (the group's layout must be built). Absent = false. */
  needsPositions?(params: P): boolean;
  /**
   * Optional: true when a packet's generation time is the instant its transmission starts, not its
   * arrival in the buffer (generate-at-will sources, whose packets are always fresh). Absent = false.
   */
  readonly freshAtTransmission?: boolean;
  create(params: P, env: TrafficEnv): TrafficSource;
}
