/**
 * `always-fresh`: generate-at-will traffic (Yates & Kaul's model of status updates): every device
 * always has a packet to send. At `start` every device gets a packet; whenever a device's buffer
 * becomes empty the cell calls `deviceIdle(device)` and the device gets a fresh packet at once.
 * `freshAtTransmission` tells the cell to stamp each packet's generation time when its transmission
 * starts, so the packet is as fresh as it can be.
 *
 * One kernel event in all (at `start`); before it, idle notices are ignored.
 */
import { z } from 'zod';
import { duration } from '../config/duration.js';
import type { TrafficModelEntry, TrafficSource } from './model.js';

export const alwaysFreshSchema = z
  .strictObject({
    model: z.literal('always-fresh'),
    start: duration({ description: 'When every device gets its first packet.' }).default(0),
  })
  .describe('Every device always has a fresh packet: a new one as soon as its buffer empties (generate-at-will).');

export type AlwaysFreshParams = z.output<typeof alwaysFreshSchema>;

export const alwaysFresh: TrafficModelEntry<AlwaysFreshParams> = {
  name: 'always-fresh',
  summary: 'every device always has a fresh packet (generate-at-will)',
  schema: alwaysFreshSchema,
  recurring: () => true,
  freshAtTransmission: true,
  create(params, env): TrafficSource {
    const first = env.firstDevice;
    const n = env.deviceCount;
    let started = false;
    const kind = env.sim.defineEvent(`arrival/${env.group}`, () => {
      started = true;
      for (let i = 0; i < n; i++) env.packetArrives(first + i);
    });
    return {
      start(): void {
        if (n > 0) env.sim.at(params.start, kind, 0);
      },
      deviceIdle(device: number): void {
        if (started) env.packetArrives(device);
      },
    };
  },
};
