/**
 * Device layouts: where the devices of one group stand, in metres, in a cell disc of radius R centred
 * at (0, 0). Used by traffic models whose packets depend on place (e.g. `alarm-field`).
 *
 * - `uniform-disc`: independent uniform points in the disc (r = R·√u, θ = 2π·v).
 * - `clustered`: a Thomas cluster process conditioned on the device count. Cluster centres are uniform
 *   in the disc, their number max(1, round(density · πR²)); each device picks a centre uniformly and is
 *   offset from it by independent Normal(0, spread²) draws per coordinate (not clipped to the disc).
 *   Device indices are then ordered by cluster: the devices of one cluster have consecutive indices, so
 *   models that group consecutive devices into zones (`markov` with `scope: zone`) get zones that follow
 *   clusters.
 * - `csv`: positions read from a file (`readLayoutCsv` in `layout-csv.ts`); the caller loads them.
 */
import { z } from 'zod';
import { length } from '../config/length.js';
import { normal, type Stream } from '../random/index.js';
import type { Positions } from './positions.js';

const TWO_PI = 2 * Math.PI;
/** Square metres in a square kilometre. */
const M2_PER_KM2 = 1e6;

export const uniformDiscLayoutSchema = z
  .strictObject({ model: z.literal('uniform-disc') })
  .describe('Devices stand independently and uniformly in the cell disc.');

export const clusteredLayoutSchema = z
  .strictObject({
    model: z.literal('clustered'),
    clusters_per_km2: z
      .number()
      .positive()
      .default(20)
      .describe('Cluster centres per square kilometre of the cell disc; their number is max(1, round(density × πR²)).'),
    spread: length({ description: 'Standard deviation of a device’s offset from its cluster centre, per coordinate.' }).prefault('50m'),
  })
  .describe('Devices gather around cluster centres uniform in the disc (Thomas process); devices of one cluster get consecutive indices.');

export const csvLayoutSchema = z
  .strictObject({
    model: z.literal('csv'),
    file: z
      .string()
      .min(1)
      .describe('CSV file with the header `x_m,y_m` and one line per device (metres); a relative path is relative to the experiment file.'),
  })
  .describe('Device positions read from a CSV file, one line per device.');

export const layoutSchema = z
  .discriminatedUnion('model', [uniformDiscLayoutSchema, clusteredLayoutSchema, csvLayoutSchema])
  .describe('Where the devices of the group stand in the cell disc.');

export type LayoutParams = z.output<typeof layoutSchema>;

/** `count` independent uniform points in the disc of radius `radius` (m) centred at (0, 0). Two draws per point. */
export function uniformDisc(count: number, stream: Stream, radius: number): Positions {
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const r = radius * Math.sqrt(stream.next());
    const theta = TWO_PI * stream.next();
    x[i] = r * Math.cos(theta);
    y[i] = r * Math.sin(theta);
  }
  return { x, y };
}

/** A clustered layout with its hidden structure (the structure is exposed for tests). */
export interface ClusteredLayout {
  readonly positions: Positions;
  readonly centres: Positions;
  /** Cluster of each device; non-decreasing in the device index. */
  readonly clusterOf: Int32Array;
}

/** Number of cluster centres for a density (per km²) over a disc of radius `radius` (m). */
export function clusterCount(clustersPerKm2: number, radius: number): number {
  return Math.max(1, Math.round((clustersPerKm2 * Math.PI * radius * radius) / M2_PER_KM2));
}

/**
 * Thomas-process layout of `count` devices (see the file comment). Draw order: centres, then each
 * device's cluster choice, then the offsets in final index order.
 */
export function clusteredLayout(count: number, stream: Stream, radius: number, clustersPerKm2: number, spread: number): ClusteredLayout {
  const k = clusterCount(clustersPerKm2, radius);
  const centres = uniformDisc(k, stream, radius);
  const pick = new Int32Array(count);
  const start = new Int32Array(k + 1);
  for (let i = 0; i < count; i++) {
    const c = stream.int(k);
    pick[i] = c;
    start[c + 1] = (start[c + 1] as number) + 1;
  }
  for (let c = 0; c < k; c++) start[c + 1] = (start[c + 1] as number) + (start[c] as number);
  const clusterOf = new Int32Array(count);
  for (let c = 0; c < k; c++) clusterOf.fill(c, start[c] as number, start[c + 1] as number);
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const c = clusterOf[i] as number;
    x[i] = (centres.x[c] as number) + normal(stream, 0, spread);
    y[i] = (centres.y[c] as number) + normal(stream, 0, spread);
  }
  return { positions: { x, y }, centres, clusterOf };
}

/**
 * Positions (m) of `count` devices for the layout `params` in a disc of radius `cellRadius` (m).
 * For `csv` the caller passes the positions it read (`readLayoutCsv`); they must hold `count` points.
 */
export function createLayout(params: LayoutParams, count: number, stream: Stream, cellRadius: number, csvPositions?: Positions): Positions {
  switch (params.model) {
    case 'uniform-disc':
      return uniformDisc(count, stream, cellRadius);
    case 'clustered':
      return clusteredLayout(count, stream, cellRadius, params.clusters_per_km2, params.spread).positions;
    case 'csv':
      if (csvPositions === undefined || csvPositions.x.length !== count || csvPositions.y.length !== count) {
        throw new Error(`layout csv ${params.file}: expected ${count} loaded positions`);
      }
      return csvPositions;
  }
}
