/**
 * Layout CSV files. Source: the format defined in src/geometry/layout-csv.ts (header `x_m,y_m`, one
 * line per device); line and column numbers are 1-based as text editors count them (common practice).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { MAX_LINE_PROBLEMS, readLayoutCsv } from '../../src/geometry/layout-csv.js';

const dir = mkdtempSync(join(tmpdir(), 'jostle-layout-'));
let fileNo = 0;
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function csv(text: string): string {
  const file = join(dir, `l${fileNo++}.csv`);
  writeFileSync(file, text);
  return file;
}

function problems(text: string, count: number, keyPath?: string) {
  const file = csv(text);
  const r = keyPath === undefined ? readLayoutCsv(file, count) : readLayoutCsv(file, count, keyPath);
  if (r.ok) throw new Error('expected problems');
  return r.problems.map((p) => ({ file: p.file === file, line: p.line, column: p.column, code: p.code, path: p.path, message: p.message }));
}

describe('readLayoutCsv', () => {
  it('reads positions in row order (BOM, CRLF, blank lines and spaces tolerated)', () => {
    const r = readLayoutCsv(csv('\uFEFFx_m, y_m\r\n1.5,-2\r\n\r\n 1e3 , .25\r\n'), 2);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(Array.from(r.positions.x)).toEqual([1.5, 1000]);
      expect(Array.from(r.positions.y)).toEqual([-2, 0.25]);
    }
  });

  it('reports a wrong header on line 1 against the given key path', () => {
    const p = problems('x,y\n1,2\n', 1, 'groups.a.layout.file');
    expect(p).toEqual([expect.objectContaining({ file: true, line: 1, column: 1, code: 'invalid-value', path: 'groups.a.layout.file' })]);
  });

  it('reports every bad number with its line and column', () => {
    const p = problems('x_m,y_m\n1,2\nfoo,3\n4,\n5,6,7\nInfinity,1\n0x10,2\n', 6);
    expect(p.map((x) => [x.line, x.column])).toEqual([[3, 1], [4, 3], [5, 1], [6, 1], [7, 1]]);
  });

  it('requires exactly one line per device', () => {
    const few = problems('x_m,y_m\n1,2\n', 3);
    expect(few).toEqual([expect.objectContaining({ line: null, code: 'invalid-value' })]);
    expect(few[0]?.message).toMatch(/found 1 data line, expected exactly 3/);
    const many = problems('x_m,y_m\n1,2\n3,4\n\n5,6\n', 2);
    expect(many).toEqual([expect.objectContaining({ line: 5, column: 1 })]);
  });

  it('lists at most 20 bad lines, then a summary', () => {
    const rows = Array.from({ length: 25 }, () => 'a,b');
    const p = problems(['x_m,y_m', ...rows].join('\n'), 25);
    expect(p).toHaveLength(MAX_LINE_PROBLEMS + 1);
    expect(p.slice(0, 20).map((x) => x.line)).toEqual(Array.from({ length: 20 }, (_, i) => i + 2));
    expect(p[20]?.message).toContain('5 more bad lines');
  });

  it('reports a missing file as file-not-found, a directory as unreadable', () => {
    const missing = readLayoutCsv(join(dir, 'none.csv'), 1);
    expect(missing.ok ? 'ok' : missing.problems[0]?.code).toBe('file-not-found');
    const directory = readLayoutCsv(dir, 1);
    expect(directory.ok ? 'ok' : directory.problems[0]?.code).toBe('unreadable');
  });
});
