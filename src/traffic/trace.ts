/**
 * `trace`: replays recorded arrivals from a CSV file with the header `time_ms,device` (time in ms from
 * the start of the run, finite and ≥ 0; device = 0-based index within the group). Rows need not be
 * sorted: they are replayed by time, ties in row order. The source ends after the last row.
 *
 * The file is read once per process per (absolute path, device count) by {@link loadTrace}; the loader
 * of the experiment validates it first (with {@link readTraceCsv}), so a bad file never reaches a run.
 * The cache holds immutable input data only, never simulation state.
 */
import { resolve } from 'node:path';
import { z } from 'zod';
import { formatProblems, type Problem } from '../config/problems.js';
import { checkFieldCount, checkHeader, csvRecords, CsvProblems, numberField, readCsvText } from '../geometry/layout-csv.js';
import type { TrafficModelEntry } from './model.js';

export const traceSchema = z
  .strictObject({
    model: z.literal('trace'),
    file: z
      .string()
      .min(1)
      .describe('CSV file with the header `time_ms,device` and one line per packet; a relative path is relative to the experiment file.'),
  })
  .describe('Replays the arrivals listed in a CSV file (time in ms, device index within the group).');

export type TraceParams = z.output<typeof traceSchema>;

/** Arrivals in replay order: times (ms, non-decreasing) and device indices within the group. */
export interface TraceData {
  readonly times: Float64Array;
  readonly devices: Int32Array;
}

const TRACE_HEADER = ['time_ms', 'device'] as const;

/** Row order sorted by time, ties by row (a stable sort). */
function replayOrder(times: Float64Array): Int32Array {
  const order = Int32Array.from(times.keys());
  return order.sort((a, b) => (times[a] as number) - (times[b] as number) || a - b);
}

/** The device field of a record, or undefined after reporting it. */
function deviceField(rec: Parameters<typeof numberField>[0], deviceCount: number, problems: CsvProblems): number | undefined {
  const d = numberField(rec, 1, 'device', problems);
  if (d === undefined) return undefined;
  if (!Number.isInteger(d) || d < 0 || d >= deviceCount) {
    const expected = `an integer from 0 to ${deviceCount - 1} (device index within the group)`;
    problems.atLine(rec.line, rec.columns[1] ?? 1, '`device` is not a device index of the group', rec.fields[1], expected);
    return undefined;
  }
  return d;
}

/**
 * Reads and checks a trace CSV for a group of `deviceCount` devices. Every bad line is reported with
 * its 1-based line and column (the first 20, then a summary). `keyPath` is the config key the problems
 * are reported against.
 */
export function readTraceCsv(
  path: string,
  deviceCount: number,
  keyPath = '',
): ({ ok: true } & TraceData) | { ok: false; problems: Problem[] } {
  const read = readCsvText(path, keyPath);
  if (!read.ok) return read;
  const records = csvRecords(read.text);
  const problems = new CsvProblems(path, keyPath);
  checkHeader(records[0], TRACE_HEADER, problems);
  const rows = records.slice(1);
  const rawTimes = new Float64Array(rows.length);
  const rawDevices = new Int32Array(rows.length);
  rows.forEach((rec, k) => {
    if (!checkFieldCount(rec, 2, problems)) return;
    const t = numberField(rec, 0, 'time_ms', problems);
    if (t !== undefined && t < 0) problems.atLine(rec.line, rec.columns[0] ?? 1, '`time_ms` is negative', rec.fields[0], 'a time ≥ 0 in ms');
    const d = deviceField(rec, deviceCount, problems);
    rawTimes[k] = t ?? 0;
    rawDevices[k] = d ?? 0;
  });
  if (!problems.empty) return { ok: false, problems: problems.finish() };
  const order = replayOrder(rawTimes);
  const times = new Float64Array(order.length);
  const devices = new Int32Array(order.length);
  order.forEach((row, i) => {
    times[i] = rawTimes[row] as number;
    devices[i] = rawDevices[row] as number;
  });
  return { ok: true, times, devices };
}

const cache = new Map<string, TraceData>();

/**
 * The trace at `path` for a group of `deviceCount` devices, read once per process (cached by absolute
 * path and device count). Throws an Error listing the problems when the file is bad.
 */
export function loadTrace(path: string, deviceCount: number): TraceData {
  const key = `${resolve(path)}\u0000${deviceCount}`;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  const r = readTraceCsv(path, deviceCount);
  if (!r.ok) throw new Error(`bad trace file ${path}:\n${formatProblems(r.problems)}`);
  const data: TraceData = { times: r.times, devices: r.devices };
  cache.set(key, data);
  return data;
}

/** Forgets every loaded trace (for tests that rewrite a file). */
export function clearTraceCache(): void {
  cache.clear();
}

export const trace: TrafficModelEntry<TraceParams> = {
  name: 'trace',
  summary: 'replays the arrivals of a CSV file (`time_ms,device`)',
  schema: traceSchema,
  recurring: () => false,
  create(params, env) {
    const { times, devices } = loadTrace(params.file, env.deviceCount);
    const first = env.firstDevice;
    let cursor = 0;
    const kind = env.sim.defineEvent(`arrival/${env.group}`, () => {
      const device = devices[cursor] as number;
      cursor++;
      if (cursor < times.length) env.sim.at(times[cursor] as number, kind, 0);
      env.packetArrives(first + device);
    });
    return {
      start(): void {
        if (times.length > 0) env.sim.at(times[0] as number, kind, 0);
      },
    };
  },
};
