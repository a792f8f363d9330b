/**
 * `trace`: replay of a CSV of arrivals. Sources: the file format defined in src/traffic/trace.ts
 * (header `time_ms,device`, replay by time with ties in row order); line numbers are 1-based lines of
 * the file as any text editor counts them (common practice).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { MAX_LINE_PROBLEMS } from '../../src/geometry/layout-csv.js';
import { clearTraceCache, loadTrace, readTraceCsv, trace, traceSchema } from '../../src/traffic/trace.js';
import { fakeEnv } from './fake-env.js';

const dir = mkdtempSync(join(tmpdir(), 'jostle-trace-'));
let fileNo = 0;

function csv(text: string): string {
  const file = join(dir, `t${fileNo++}.csv`);
  writeFileSync(file, text);
  return file;
}

function problemsOf(text: string, deviceCount: number): Array<{ line: number | null; column: number | null; code: string; message: string }> {
  const r = readTraceCsv(csv(text), deviceCount);
  if (r.ok) throw new Error('expected problems');
  return r.problems.map((p) => ({ line: p.line, column: p.column, code: p.code, message: p.message }));
}

afterEach(() => clearTraceCache());
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('trace traffic', () => {
  it('replays rows by time, ties in row order, at the written times', () => {
    const file = csv('time_ms,device\n30,2\n10.5,1\n30,0\n\n0,3\n10.5,4\r\n');
    const params = traceSchema.parse({ model: 'trace', file });
    expect(trace.recurring(params)).toBe(false);
    const env = fakeEnv({ deviceCount: 5, firstDevice: 100 });
    trace.create(params, env).start();
    const r = env.sim.run();
    expect(r.reason).toBe('drained'); // the source ends after the last row
    expect(env.times).toEqual([0, 10.5, 10.5, 30, 30]);
    expect(env.devices).toEqual([103, 101, 104, 102, 100]);
  });

  it('reports a bad header on line 1', () => {
    const p = problemsOf('time,device\n1,0\n', 2);
    expect(p).toHaveLength(1);
    expect(p[0]).toMatchObject({ line: 1, column: 1, code: 'invalid-value' });
    expect(p[0]?.message).toContain('time_ms,device');
  });

  it('reports every bad line with its line and column: numbers, negative times, device range, field count', () => {
    const text = ['time_ms,device', '5,0', 'abc,1', '7, 9', '-1,0', '3,1.5', '', '4', '1e400,0', '2,-1', ' 8 ,1'].join('\n');
    const p = problemsOf(text, 3);
    expect(p.map((x) => [x.line, x.column])).toEqual([
      [3, 1], // abc
      [4, 4], // device 9 ≥ 3 (column of the value after the space)
      [5, 1], // negative time
      [6, 3], // device 1.5 not an integer
      [8, 1], // one field only
      [9, 1], // not finite
      [10, 3], // device −1
    ]);
    expect(p.every((x) => x.code === 'invalid-value')).toBe(true);
  });

  it('lists the first 20 bad lines, then one summary of the rest', () => {
    const rows = Array.from({ length: 30 }, () => 'x,0');
    const p = problemsOf(['time_ms,device', ...rows].join('\n'), 1);
    expect(p).toHaveLength(MAX_LINE_PROBLEMS + 1);
    expect(p[19]?.line).toBe(21);
    expect(p[20]).toMatchObject({ line: null });
    expect(p[20]?.message).toContain('10 more');
  });

  it('reports a missing file as file-not-found', () => {
    const r = readTraceCsv(join(dir, 'nope.csv'), 1);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]?.code).toBe('file-not-found');
  });

  it('loadTrace reads a file once per process and throws on a bad file', () => {
    const file = csv('time_ms,device\n1,0\n');
    const a = loadTrace(file, 1);
    writeFileSync(file, 'time_ms,device\n2,0\n3,0\n');
    expect(loadTrace(file, 1)).toBe(a);
    clearTraceCache();
    expect(Array.from(loadTrace(file, 1).times)).toEqual([2, 3]);
    expect(() => loadTrace(csv('time_ms,device\n1,5\n'), 1)).toThrow(/line|device/);
  });
});
