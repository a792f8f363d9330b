/**
 * The predictor registry: YAML `model` name → schema and constructor. Adding a predictor is one file
 * plus one line in the union and one case here.
 */
import { z } from 'zod';
import { createNeighbourPredictor, neighbourSchema } from './neighbour.js';
import { createOracle, oracleSchema } from './oracle.js';
import { createPeriodicPredictor, periodicPredictorSchema } from './periodic.js';
import type { Predictor, PredictorHost } from './predictor.js';

export const predictorSchema = z.discriminatedUnion('model', [oracleSchema, periodicPredictorSchema, neighbourSchema]);

export type PredictorParams = z.output<typeof predictorSchema>;

/** The `model` names, in the order of the union. */
export const predictorNames: readonly PredictorParams['model'][] = ['oracle', 'periodic', 'neighbour'];

/** True if the predictor needs the group's device positions (`host.positions` not null). */
export function predictorNeedsPositions(params: PredictorParams): boolean {
  return params.model === 'neighbour';
}

/** Builds the predictor described by `params` (already validated by {@link predictorSchema}). */
export function createPredictor(params: PredictorParams, host: PredictorHost): Predictor {
  switch (params.model) {
    case 'oracle':
      return createOracle(params, host);
    case 'periodic':
      return createPeriodicPredictor(params, host);
    case 'neighbour':
      return createNeighbourPredictor(params, host);
  }
}
