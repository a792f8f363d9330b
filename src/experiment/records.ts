/**
 * Replication records as JSON lines. Non-finite numbers (a metric with no sample is NaN) are written
 * as null and read back as NaN; finite numbers round-trip exactly (shortest round-trip decimal).
 */
import type { ReplicationRecord } from './replicate.js';

export function recordToJson(record: ReplicationRecord): string {
  return JSON.stringify(record);
}

const nanMap = (m: Record<string, number | null>): Record<string, number> => {
  const out: Record<string, number> = {};
  for (const [k, v] of Object.entries(m)) out[k] = v ?? Number.NaN;
  return out;
};

const nanList = (a: ReadonlyArray<number | null>): number[] => a.map((v) => v ?? Number.NaN);

interface RawRecord {
  point: number;
  replication: number;
  seed: string;
  events: number;
  metrics: Record<string, number | null>;
  groups: Record<string, Record<string, number | null>>;
  delayQuantiles: { cell: Array<number | null>; groups: Record<string, Array<number | null>> };
}

export function recordFromJson(text: string): ReplicationRecord {
  const raw = JSON.parse(text) as RawRecord;
  if (typeof raw.point !== 'number' || typeof raw.replication !== 'number' || typeof raw.seed !== 'string') {
    throw new Error('not a replication record');
  }
  const groups: Record<string, Record<string, number>> = {};
  for (const [g, m] of Object.entries(raw.groups)) groups[g] = nanMap(m);
  const groupQuantiles: Record<string, number[]> = {};
  for (const [g, q] of Object.entries(raw.delayQuantiles.groups)) groupQuantiles[g] = nanList(q);
  return {
    point: raw.point,
    replication: raw.replication,
    seed: raw.seed,
    events: raw.events,
    metrics: nanMap(raw.metrics),
    groups,
    delayQuantiles: { cell: nanList(raw.delayQuantiles.cell), groups: groupQuantiles },
  };
}
