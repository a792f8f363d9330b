/**
 * Positions read from a layout CSV, cached per process by path and device count. The loader checks
 * the file (with positioned problems) before any replication runs; here a failure can only mean the
 * file changed during the run.
 */
import { formatProblems } from '../config/problems.js';
import { readLayoutCsv } from './layout-csv.js';
import type { Positions } from './positions.js';

const cache = new Map<string, Positions>();

export function layoutPositionsFromCsv(path: string, count: number): Positions {
  const key = `${count}\u0000${path}`;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  const read = readLayoutCsv(path, count);
  if (!read.ok) throw new Error(`layout file ${path} became unreadable during the run:\n${formatProblems(read.problems)}`);
  cache.set(key, read.positions);
  return read.positions;
}
