/**
 * `silent`: devices that never send. They exist (memory, layouts) but cost no event: a cell's cost
 * should follow its traffic, not its device count.
 */
import { z } from 'zod';
import type { TrafficModelEntry } from './model.js';

export const silentSchema = z.strictObject({ model: z.literal('silent') }).describe('Devices that never send.');

export type SilentParams = z.output<typeof silentSchema>;

export const silent: TrafficModelEntry<SilentParams> = {
  name: 'silent',
  summary: 'devices that never send',
  schema: silentSchema,
  recurring: () => false,
  create() {
    return { start(): void {} };
  },
};
