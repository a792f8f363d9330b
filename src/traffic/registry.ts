/**
 * The traffic-model registry: YAML name → schema and constructor. Adding a model is one file plus one
 * line here.
 */
import { z } from 'zod';
import { alarmField, alarmFieldSchema } from './alarm-field.js';
import { alwaysFresh, alwaysFreshSchema } from './always-fresh.js';
import { betaBurst, betaBurstSchema } from './beta-burst.js';
import { markov, markovSchema } from './markov.js';
import type { TrafficModelEntry } from './model.js';
import { silent, silentSchema } from './silent.js';
import { periodic, periodicSchema } from './periodic.js';
import { poisson, poissonSchema } from './poisson.js';
import { trace, traceSchema } from './trace.js';
import { uniformWindow, uniformWindowSchema } from './uniform-window.js';

export const trafficSchema = z.discriminatedUnion('model', [
  uniformWindowSchema,
  betaBurstSchema,
  poissonSchema,
  periodicSchema,
  markovSchema,
  alarmFieldSchema,
  traceSchema,
  alwaysFreshSchema,
  silentSchema,
]);

export type TrafficParams = z.output<typeof trafficSchema>;

const entries = [uniformWindow, betaBurst, poisson, periodic, markov, alarmField, trace, alwaysFresh, silent] as const;

export function trafficModel(name: TrafficParams['model']): TrafficModelEntry<TrafficParams> {
  const entry = entries.find((e) => e.name === name);
  if (entry === undefined) throw new Error(`unknown traffic model ${name}`);
  return entry as unknown as TrafficModelEntry<TrafficParams>;
}

export const trafficModelNames: readonly string[] = entries.map((e) => e.name);

export function describeTrafficModels(): Array<{ name: string; summary: string }> {
  return entries.map((e) => ({ name: e.name, summary: e.summary }));
}

/** True when the model of `params` needs the group's device positions (`env.positions`). */
export function trafficNeedsPositions(params: TrafficParams): boolean {
  return trafficModel(params.model).needsPositions?.(params) ?? false;
}
