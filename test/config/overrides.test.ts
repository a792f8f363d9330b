// `--set path=value` conventions of this module (common practice for command-line overrides);
// values are read as YAML 1.2 flow scalars (core schema: `20000` is an integer, `true` a boolean,
// `5ms` a string — yaml.org/spec/1.2.2, section 10.3, from memory). Lines/columns exact by hand.
import { describe, expect, it } from 'vitest';
import { applyOverrides } from '../../src/config/overrides.js';
import { validateSource, type Edits } from '../../src/config/validate.js';
import { parseYamlSource, type YamlSource } from '../../src/config/yaml-source.js';
import { demoSchema } from './demo-schema.js';

const TEXT = ['name: demo', 'horizon: 10s', 'groups:', '  meters:', '    count: 20', '    period: 5min', 'list: [1, 2, 3]', 'empty:', ''].join('\n');

/** TEXT without the keys the demo schema does not know. */
const VALID = TEXT.replace('list: [1, 2, 3]\nempty:\n', '');

function sourceOf(text = TEXT): YamlSource {
  const r = parseYamlSource('exp.yaml', text);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.source;
}

function applied(items: string[], text = TEXT): { source: YamlSource; overridden: Edits } {
  const r = applyOverrides(sourceOf(text), items);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r;
}

describe('applyOverrides', () => {
  it('reads values as YAML scalars and flow values', () => {
    const { source } = applied(['groups.meters.count=20000', 'horizon=5ms', 'list=[4, 5]', 'name=true', 'extra={a: 1}']);
    const js = source.doc.toJS() as Record<string, unknown>;
    expect(js['groups']).toEqual({ meters: { count: 20000, period: '5min' } });
    expect(js['horizon']).toBe('5ms');
    expect(js['list']).toEqual([4, 5]);
    expect(js['name']).toBe(true);
    expect(js['extra']).toEqual({ a: 1 });
  });

  it('creates missing keys and intermediate maps, also under an empty value', () => {
    const { source, overridden } = applied(['groups.sensors.count=5', 'empty.inner=1', 'brand.new.deep=x']);
    const js = source.doc.toJS() as Record<string, unknown>;
    expect(js['groups']).toMatchObject({ sensors: { count: 5 } });
    expect(js['empty']).toEqual({ inner: 1 });
    expect(js['brand']).toEqual({ new: { deep: 'x' } });
    expect(overridden.get('groups.sensors.count')).toEqual({ option: '--set', item: 'groups.sensors.count=5' });
  });

  it('creates the root map of an empty file, and refuses a file that is a single value', () => {
    const { source } = applied(['a.b=1'], '');
    expect(source.doc.toJS()).toEqual({ a: { b: 1 } });
    const r = applyOverrides(sourceOf('42\n'), ['a=1']);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]?.code).toBe('bad-override');
  });

  it('indexes lists and lets later items win', () => {
    const { source } = applied(['list.1=9', 'horizon=1s', 'horizon=2s']);
    const js = source.doc.toJS() as Record<string, unknown>;
    expect(js['list']).toEqual([1, 9, 3]);
    expect(js['horizon']).toBe('2s');
  });

  it('does not change the original document', () => {
    const source = sourceOf();
    applyOverrides(source, ['horizon=1h']);
    expect((source.doc.toJS() as Record<string, unknown>)['horizon']).toBe('10s');
  });

  it('reports every malformed item as bad-override with file "--set"', () => {
    const r = applyOverrides(sourceOf(), ['abc', '=3', 'a..b=1', 'ok=1', 'groups.meters.count.x=1', 'list.x=1', 'v=[1, 2']);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems.map((p) => [p.code, p.file, p.found])).toEqual([
      ['bad-override', '--set', 'abc'],
      ['bad-override', '--set', '=3'],
      ['bad-override', '--set', 'a..b=1'],
      ['bad-override', '--set', 'groups.meters.count.x=1'], // count holds a number, not a map
      ['bad-override', '--set', 'list.x=1'], // list index must be a number
      ['bad-override', '--set', 'v=[1, 2'], // unterminated flow list
    ]);
    for (const p of r.problems) expect(p.line).toBeNull();
  });
});

describe('validation after overrides', () => {
  it('validates a key created by --set', () => {
    const { source, overridden } = applied(['groups.sensors.count=7', 'groups.sensors.period=1h'], VALID);
    const r = validateSource(source, demoSchema, overridden);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.value.groups['sensors']).toEqual({ count: 7, period: 3_600_000, mode: 'poisson' });
  });

  it('reports a bad value given by --set against "--set" and the item, not a line', () => {
    const { source, overridden } = applied(['groups.meters.count=-5', 'horizon=5 parsecs'], VALID);
    const r = validateSource(source, demoSchema, overridden);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual([
      expect.objectContaining({ code: 'invalid-value', file: '--set', line: null, column: null, path: 'groups.meters.count', found: 'groups.meters.count=-5' }),
      expect.objectContaining({ code: 'bad-unit', file: '--set', line: null, path: 'horizon', found: 'horizon=5 parsecs' }),
    ]);
  });

  it('attributes a key missing from a map created by --set to that item; file problems keep their lines', () => {
    const text = TEXT.replace('count: 20', 'count: 0');
    const { source, overridden } = applied(['groups.sensors.count=3'], text);
    const r = validateSource(source, demoSchema, overridden);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems.map((p) => [p.code, p.path, p.file, p.line])).toEqual([
      ['invalid-value', 'groups.meters.count', 'exp.yaml', 5],
      ['unknown-key', 'list', 'exp.yaml', 7],
      ['unknown-key', 'empty', 'exp.yaml', 8],
      ['missing-key', 'groups.sensors.period', '--set', null],
    ]);
  });

  it('reports an unknown key set by --set with a suggestion', () => {
    const { source, overridden } = applied(['groups.meters.cuont=3'], VALID);
    const r = validateSource(source, demoSchema, overridden);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems).toEqual([expect.objectContaining({ code: 'unknown-key', file: '--set', path: 'groups.meters.cuont', suggestion: 'did you mean `count`?' })]);
  });
});
