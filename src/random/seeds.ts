/**
 * Seed derivation. Every seed is a hash of a list of identifying parts, never
 * `seed + i`: with additive offsets, runs with roots 1 and 2 would share most of
 * their replications. Hashing makes every (root, point, replication, name) path
 * independent of every other and needs no coordination between processes.
 */
import { createHash } from 'node:crypto';

/** The one seed of an experiment: a safe integer or any string. */
export type RootSeed = number | string;

/** One part of a hashed path: a string, a finite number, or null. */
export type SeedPart = string | number | null;

/** Number of hex characters kept in a replication seed (64 bits). */
const REPLICATION_SEED_HEX = 16;

/**
 * Full lowercase hex digest (64 chars) of SHA-256 over `JSON.stringify(parts)`.
 * The JSON encoding is unambiguous: strings are quoted, so `1` and `"1"` differ,
 * and array boundaries are explicit. Non-finite numbers are rejected because JSON
 * would encode them as `null`.
 */
export function hashParts(parts: readonly SeedPart[]): string {
  for (const part of parts) {
    if (typeof part === 'number' && !Number.isFinite(part)) {
      throw new RangeError(`hashParts: non-finite number ${String(part)}`);
    }
  }
  return createHash('sha256').update(JSON.stringify(parts)).digest('hex');
}

/**
 * Seed of one replication: the first 16 lowercase hex chars of
 * `hashParts([root, point, replication])`.
 * @param root experiment root seed (safe integer or string)
 * @param point sweep point index (non-negative integer), or `null` for common random
 *   numbers: every point then gets the same seed for a given replication.
 * @param replication replication index (non-negative integer)
 */
export function replicationSeed(root: RootSeed, point: number | null, replication: number): string {
  if (typeof root === 'number' && !Number.isSafeInteger(root)) {
    throw new RangeError(`replicationSeed: root must be a safe integer or a string, got ${root}`);
  }
  if (point !== null && !isIndex(point)) {
    throw new RangeError(`replicationSeed: point must be a non-negative integer or null, got ${point}`);
  }
  if (!isIndex(replication)) {
    throw new RangeError(`replicationSeed: replication must be a non-negative integer, got ${replication}`);
  }
  return hashParts([root, point, replication]).slice(0, REPLICATION_SEED_HEX);
}

function isIndex(x: number): boolean {
  return Number.isSafeInteger(x) && x >= 0;
}
