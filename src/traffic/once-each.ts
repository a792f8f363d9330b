/**
 * Shared machinery for models in which every device of a group gets exactly one packet
 * (3GPP TR 37.868 models 1 and 2).
 *
 * All arrival times are drawn up front, then put in time order with a bucket sort (expected O(N) for
 * any smooth density), and a single kernel event walks the sorted list. The kernel therefore holds one
 * pending arrival per group instead of one per device.
 */
import { z } from 'zod';
import type { Stream } from '../random/index.js';
import type { TrafficEnv, TrafficSource } from './model.js';

/** The `active_share` key of the once-each models. */
export const activeShareField = z
  .number()
  .min(0)
  .max(1)
  .default(1)
  .describe('Share of the devices that send at all (each independently); 1: every device.');

/**
 * A once-each source whose active devices report at start + window·X, X drawn by `fraction` from the
 * group's "times" stream (one call per active device, in device order). `fraction` should be a
 * module-level function (one call target for the JIT), reading its parameters from `params`.
 */
export function onceEachOverWindow<P extends { readonly start: number; readonly window: number; readonly active_share: number }>(
  env: TrafficEnv,
  params: P,
  fraction: (s: Stream, params: P) => number,
): TrafficSource {
  const devices = activeDevices(env, params.active_share);
  const times = new Float64Array(devices?.length ?? env.deviceCount);
  fillTimes(times, env.stream('times'), params, fraction);
  return onceEachSource(env, times, params.start, params.start + params.window, devices);
}

function fillTimes<P extends { readonly start: number; readonly window: number }>(
  times: Float64Array,
  s: Stream,
  params: P,
  fraction: (s: Stream, params: P) => number,
): void {
  const start = params.start;
  const window = params.window;
  for (let i = 0; i < times.length; i++) times[i] = start + fraction(s, params) * window;
}

/**
 * Which devices of a group send at all: every one when `share` is 1 (no draws), otherwise each
 * independently with probability `share` (stream "active"). Returns group device indices.
 */
export function activeDevices(env: TrafficEnv, share: number): Int32Array | undefined {
  if (share >= 1) return undefined;
  const s = env.stream('active');
  const chosen: number[] = [];
  for (let i = 0; i < env.deviceCount; i++) if (s.next() < share) chosen.push(i);
  return Int32Array.from(chosen);
}

/** Indices 0 … n−1 ordered by `times` (ties keep index order). Times must lie in [lo, hi]. */
export function orderByTime(times: Float64Array, lo: number, hi: number): Int32Array {
  const n = times.length;
  const order = new Int32Array(n);
  if (n === 0) return order;
  // Bucket sort: n bins over [lo, hi] (about one time per bin for a smooth density), then an
  // insertion sort inside each bin. Each pass is its own small function, so the JIT compiles each
  // with full type feedback even though the whole sort runs once per replication.
  const binOf = new Int32Array(n);
  const start = new Int32Array(n + 1);
  assignBins(times, lo, hi > lo ? (hi - lo) / n : 1, binOf, start);
  prefixSums(start);
  placeByBin(binOf, start, order);
  sortWithinBins(times, start, order);
  return order;
}

/** binOf[i] = bin of times[i]; start[b + 1] = how many times fall in bin b. */
function assignBins(times: Float64Array, lo: number, width: number, binOf: Int32Array, start: Int32Array): void {
  const bins = binOf.length;
  for (let i = 0; i < bins; i++) {
    let b = Math.floor(((times[i] as number) - lo) / width);
    if (b < 0) b = 0;
    else if (b >= bins) b = bins - 1;
    binOf[i] = b;
    start[b + 1] = (start[b + 1] as number) + 1;
  }
}

function prefixSums(start: Int32Array): void {
  for (let b = 1; b < start.length; b++) start[b] = (start[b] as number) + (start[b - 1] as number);
}

/** Writes each index at the next free place of its bin (stable: index order within a bin). */
function placeByBin(binOf: Int32Array, start: Int32Array, order: Int32Array): void {
  const next = new Int32Array(start.length - 1);
  next.set(start.subarray(0, start.length - 1));
  for (let i = 0; i < binOf.length; i++) {
    const b = binOf[i] as number;
    order[next[b] as number] = i;
    next[b] = (next[b] as number) + 1;
  }
}

/** Insertion sort by time inside each bin (bins hold about one element on average). */
function sortWithinBins(times: Float64Array, start: Int32Array, order: Int32Array): void {
  for (let b = 0; b < start.length - 1; b++) {
    const from = start[b] as number;
    const to = start[b + 1] as number;
    for (let j = from + 1; j < to; j++) {
      const idx = order[j] as number;
      const t = times[idx] as number;
      let k = j - 1;
      while (k >= from && (times[order[k] as number] as number) > t) {
        order[k + 1] = order[k] as number;
        k--;
      }
      order[k + 1] = idx;
    }
  }
}

/**
 * A source that delivers one packet per device at the given times (ms, one entry per device of the
 * group, in device order — or, with `devices`, one entry per listed group device index). `lo`/`hi`
 * bound the times (for the bucket sort).
 */
export function onceEachSource(env: TrafficEnv, times: Float64Array, lo: number, hi: number, devices?: Int32Array): TrafficSource {
  const order = orderByTime(times, lo, hi);
  let cursor = 0;
  const first = env.firstDevice;
  const kind = env.sim.defineEvent(`arrival/${env.group}`, () => {
    const index = order[cursor] as number;
    cursor++;
    if (cursor < order.length) env.sim.at(times[order[cursor] as number] as number, kind, 0);
    env.packetArrives(first + (devices === undefined ? index : (devices[index] as number)));
  });
  return {
    start(): void {
      if (order.length > 0) env.sim.at(times[order[0] as number] as number, kind, 0);
    },
  };
}
