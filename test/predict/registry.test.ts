/**
 * The predictor registry: the discriminated union picks the right schema, fills defaults, builds the
 * right predictor, and gives an editor JSON Schema (common practice: every variant is reachable).
 */
import { describe, it, expect } from 'vitest';
import { toEditorSchema } from '../../src/config/json-schema.js';
import { NeighbourPredictor } from '../../src/predict/neighbour.js';
import { OraclePredictor } from '../../src/predict/oracle.js';
import { PeriodicPredictor } from '../../src/predict/periodic.js';
import { createPredictor, predictorNames, predictorNeedsPositions, predictorSchema } from '../../src/predict/registry.js';
import { FakeHost, positionsOf } from './fake-host.js';

describe('predictor registry', () => {
  it('builds each model from its validated parameters', () => {
    const host = new FakeHost(2, positionsOf([0, 1], [0, 0]));
    const built = predictorNames.map((model) => createPredictor(predictorSchema.parse({ model }), host));
    expect(built[0]).toBeInstanceOf(OraclePredictor);
    expect(built[1]).toBeInstanceOf(PeriodicPredictor);
    expect(built[2]).toBeInstanceOf(NeighbourPredictor);
    expect(predictorNames.map((model) => predictorNeedsPositions(predictorSchema.parse({ model })))).toEqual([false, false, true]);
  });

  it('rejects unknown models and unknown keys', () => {
    expect(predictorSchema.safeParse({ model: 'crystal-ball' }).success).toBe(false);
    expect(predictorSchema.safeParse({ model: 'periodic', recall: 1 }).success).toBe(false);
  });

  it('has an editor JSON Schema with one branch per model', () => {
    const js = JSON.stringify(toEditorSchema(predictorSchema, { title: 'predictor' }));
    for (const name of predictorNames) expect(js).toContain(`"const":"${name}"`);
    expect(js).toContain('"default":0.2'); // neighbour threshold
    expect(js).toContain('"default":"100m"'); // lengths are shown with their unit
  });
});
