// YAML 1.2.2 (yaml.org/spec/1.2.2) requires the keys of a mapping to be unique (section 3.2.1.1,
// from memory) and forbids tabs in indentation (section 6.1, from memory). Problem codes are this
// module's conventions (common practice). Lines and columns are exact, counted in each test's text.
import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseYamlSource, positionOf, readYamlSource, type YamlSource } from '../../src/config/yaml-source.js';

function sourceOf(text: string): YamlSource {
  const r = parseYamlSource('exp.yaml', text);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.source;
}

describe('parseYamlSource', () => {
  it('reports a syntax error with its line and column, without throwing', () => {
    const r = parseYamlSource('exp.yaml', 'name: demo\ngroups: [a, b\nhorizon: 1s\n');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems.length).toBeGreaterThan(0);
    for (const p of r.problems) expect(p).toMatchObject({ code: 'syntax', file: 'exp.yaml' });
    expect(r.problems[0]?.line).toBeGreaterThanOrEqual(2);
  });

  it('reports a bad indentation at the offending line', () => {
    const r = parseYamlSource('exp.yaml', 'a:\n  b: 1\n c: 2\n');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]).toMatchObject({ code: 'syntax', line: 3 });
  });

  it('reports a tab used for indentation', () => {
    const r = parseYamlSource('exp.yaml', 'a:\n\tb: 1\n');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]).toMatchObject({ code: 'syntax', line: 2, column: 1 });
  });

  it('reports a duplicate key at the second occurrence, with its path', () => {
    const r = parseYamlSource('exp.yaml', 'groups:\n  meters:\n    count: 1\n    count: 2\n');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems).toEqual([expect.objectContaining({ code: 'syntax', line: 4, column: 5, path: 'groups.meters.count' })]);
  });

  it('reports every syntax problem of the file', () => {
    const r = parseYamlSource('exp.yaml', 'a: 1\na: 2\nb: 1\nb: 2\n');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems.map((p) => p.line)).toEqual([2, 4]);
  });

  it('rejects two documents in one file', () => {
    const r = parseYamlSource('exp.yaml', 'a: 1\n---\nb: 2\n');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]?.code).toBe('syntax');
  });

  it('accepts an empty file (validation reports the missing content)', () => {
    expect(parseYamlSource('exp.yaml', '').ok).toBe(true);
  });
});

describe('readYamlSource', () => {
  it('reports a missing file as file-not-found with the path as given', () => {
    const r = readYamlSource('no/such/experiment.yaml');
    expect(r).toEqual({ ok: false, problems: [expect.objectContaining({ code: 'file-not-found', file: 'no/such/experiment.yaml', line: null })] });
  });

  it('reports a directory as unreadable, and reads a real file', () => {
    const dir = mkdtempSync(join(tmpdir(), 'jostle-config-'));
    mkdirSync(join(dir, 'sub'));
    const r = readYamlSource(join(dir, 'sub'));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]?.code).toBe('unreadable');
    writeFileSync(join(dir, 'ok.yaml'), 'a: 1\n');
    const ok = readYamlSource(join(dir, 'ok.yaml'));
    expect(ok.ok && ok.source.doc.toJS()).toEqual({ a: 1 });
  });
});

describe('positionOf', () => {
  const text = ['name: demo', 'groups:', '  meters:', '    count: 20', '    empty:', 'list:', '  - 1', '  - x: 2', ''].join('\n');
  const source = sourceOf(text);

  it('points at the value, or at the key when asked', () => {
    expect(positionOf(source, ['groups', 'meters', 'count'])).toEqual({ line: 4, column: 12 });
    expect(positionOf(source, ['groups', 'meters', 'count'], true)).toEqual({ line: 4, column: 5 });
  });

  it('points at the key of an empty value', () => {
    expect(positionOf(source, ['groups', 'meters', 'empty'])).toEqual({ line: 5, column: 5 });
  });

  it('walks list indices', () => {
    expect(positionOf(source, ['list', 1, 'x'])).toEqual({ line: 8, column: 8 });
    expect(positionOf(source, ['list', 0])).toEqual({ line: 7, column: 5 });
  });

  it('falls back to the key of the deepest existing ancestor', () => {
    expect(positionOf(source, ['groups', 'meters', 'period'])).toEqual({ line: 3, column: 3 });
    expect(positionOf(source, ['nothing', 'here'])).toEqual({ line: 1, column: 1 });
  });

  it('follows aliases into the anchored node', () => {
    const s = sourceOf('base: &b\n  count: 1\ncopy: *b\n');
    expect(positionOf(s, ['copy', 'count'])).toEqual({ line: 2, column: 10 });
  });

  it('returns null for an empty document', () => {
    expect(positionOf(sourceOf(''), ['a'])).toBeNull();
  });
});
