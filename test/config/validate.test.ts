// Expected codes, paths and suggestions follow the conventions of this module (common practice for
// configuration validators: report every problem with file:line:column and the key path). Line and
// column numbers are exact: counted by hand in the YAML text of each test (1-based).
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import type { Problem } from '../../src/config/problems.js';
import { closestKey, validateSource, validKeysAt } from '../../src/config/validate.js';
import { parseYamlSource } from '../../src/config/yaml-source.js';
import { demoSchema } from './demo-schema.js';

function problemsOf(text: string, schema: z.ZodType = demoSchema): Problem[] {
  const parsed = parseYamlSource('exp.yaml', text);
  if (!parsed.ok) throw new Error(`unexpected syntax problems: ${JSON.stringify(parsed.problems)}`);
  const r = validateSource(parsed.source, schema);
  if (r.ok) throw new Error('expected validation problems');
  return r.problems;
}

const only = (problems: Problem[], path: string): Problem => {
  const found = problems.filter((p) => p.path === path);
  expect(found, `problems at ${path}: ${JSON.stringify(problems)}`).toHaveLength(1);
  return found[0] as Problem;
};

const GOOD = ['name: demo', 'horizon: 10s', 'groups:', '  meters:', '    count: 20', '    period: 5min', ''].join('\n');

describe('validateSource', () => {
  it('returns the typed, defaulted value for a valid file', () => {
    const parsed = parseYamlSource('exp.yaml', GOOD);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const r = validateSource(parsed.source, demoSchema);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // Durations in ms (SI: 1 min = 60 s); defaults from the demo schema.
    expect(r.value).toEqual({
      name: 'demo',
      preambles: 54,
      slot: 1,
      horizon: 10_000,
      backoff: { kind: 'uniform', window: 20 },
      groups: { meters: { count: 20, period: 300_000, mode: 'poisson' } },
    });
  });

  it('reports an unknown top-level key at the key, suggesting the closest valid key', () => {
    const p = only(problemsOf(`${GOOD}preambels: 54\n`), 'preambels');
    expect(p).toMatchObject({ code: 'unknown-key', file: 'exp.yaml', line: 7, column: 1 });
    expect(p.suggestion).toContain('`preambles`');
  });

  it('reports an unknown key deep inside a record of groups, with line of the key', () => {
    const text = ['name: demo', 'horizon: 10s', 'groups:', '  meters:', '    cuont: 20', '    period: 5min', ''].join('\n');
    const problems = problemsOf(text);
    const p = only(problems, 'groups.meters.cuont');
    expect(p).toMatchObject({ code: 'unknown-key', line: 5, column: 5 });
    expect(p.suggestion).toContain('`count`');
    // The missing `count` is reported too, at the `meters` key (deepest existing ancestor).
    expect(only(problems, 'groups.meters.count')).toMatchObject({ code: 'missing-key', line: 4, column: 3 });
  });

  it('reports a wrong type with found and expected', () => {
    const text = GOOD.replace('count: 20', 'count: lots');
    const p = only(problemsOf(text), 'groups.meters.count');
    expect(p).toMatchObject({ code: 'invalid-type', line: 5, column: 12, found: '"lots"' });
    expect(p.expected).toBeDefined();
  });

  it('reports a negative count and zero where positive is required as invalid values', () => {
    const neg = only(problemsOf(GOOD.replace('count: 20', 'count: -3')), 'groups.meters.count');
    expect(neg).toMatchObject({ code: 'invalid-value', line: 5, column: 12, found: '-3' });
    expect(neg.expected).toMatch(/0/);
    const zero = only(problemsOf(`${GOOD}preambles: 0\n`), 'preambles');
    expect(zero).toMatchObject({ code: 'invalid-value', line: 7, column: 12, found: '0' });
  });

  it('reports a wrong unit and a plain number for a duration as bad-unit, listing the units', () => {
    const text = GOOD.replace('period: 5min', 'period: 5 parsecs').replace('horizon: 10s', 'horizon: 10');
    const problems = problemsOf(text);
    const period = only(problems, 'groups.meters.period');
    expect(period).toMatchObject({ code: 'bad-unit', line: 6, column: 13, found: '"5 parsecs"' });
    for (const unit of ['ms', 's', 'min', 'h']) expect(period.expected).toContain(unit);
    expect(only(problems, 'horizon')).toMatchObject({ code: 'bad-unit', line: 2, column: 10, found: '10' });
  });

  it('reports a duration of the wrong type (true) as bad-unit too', () => {
    expect(only(problemsOf(GOOD.replace('horizon: 10s', 'horizon: true')), 'horizon')).toMatchObject({ code: 'bad-unit', line: 2 });
  });

  it('reports a duration out of range as invalid-value (zero where positive)', () => {
    expect(only(problemsOf(GOOD.replace('horizon: 10s', 'horizon: 0s')), 'horizon')).toMatchObject({ code: 'invalid-value', line: 2, column: 10 });
  });

  it('reports an unknown discriminator with the valid names, and checks the matching branch', () => {
    const bad = `${GOOD}backoff:\n  kind: expo\n  base: 5ms\n`;
    const p = only(problemsOf(bad), 'backoff.kind');
    expect(p).toMatchObject({ code: 'invalid-value', line: 8, column: 9, found: '"expo"' });
    expect(p.expected).toContain('`uniform`');
    expect(p.expected).toContain('`exponential`');
    // A key of the other branch is unknown in the branch chosen by `kind`.
    const wrongBranch = `${GOOD}backoff:\n  kind: exponential\n  window: 5ms\n`;
    const problems = problemsOf(wrongBranch);
    expect(only(problems, 'backoff.window')).toMatchObject({ code: 'unknown-key', line: 9, column: 3 });
    expect(only(problems, 'backoff.base')).toMatchObject({ code: 'missing-key', line: 7, column: 1 });
  });

  it('reports a missing required key at the enclosing map', () => {
    const p = only(problemsOf(GOOD.replace('horizon: 10s\n', '')), 'horizon');
    expect(p).toMatchObject({ code: 'missing-key', file: 'exp.yaml', line: 1, column: 1 });
  });

  it('reports several problems in one pass, sorted by line then column', () => {
    const text = ['nmae: demo', 'horizon: 10', 'groups:', '  meters:', '    count: 0', '    period: 5 parsecs', 'preambles: -1', ''].join('\n');
    const problems = problemsOf(text);
    expect(problems.map((p) => [p.code, p.path])).toEqual([
      ['missing-key', 'name'], // at the root map, line 1 column 1
      ['unknown-key', 'nmae'], // line 1 column 1 too; stable order after the missing key
      ['bad-unit', 'horizon'],
      ['invalid-value', 'groups.meters.count'],
      ['bad-unit', 'groups.meters.period'],
      ['invalid-value', 'preambles'],
    ]);
    const lines = problems.map((p) => p.line ?? 0);
    expect(lines).toEqual([...lines].sort((a, b) => a - b));
    expect(only(problems, 'nmae').suggestion).toContain('`name`');
  });

  it('reports a document that is not a map', () => {
    const p = only(problemsOf('- 1\n- 2\n'), '');
    expect(p).toMatchObject({ code: 'invalid-type', line: 1, column: 1 });
  });
});

describe('validKeysAt', () => {
  it('walks records, defaults and discriminated unions (branch chosen by the data)', () => {
    const data = { groups: { meters: {} }, backoff: { kind: 'exponential' } };
    expect(validKeysAt(demoSchema, ['groups', 'meters'], data)).toEqual(['count', 'period', 'mode']);
    expect(validKeysAt(demoSchema, ['backoff'], data)).toEqual(['kind', 'base', 'factor']);
    expect(validKeysAt(demoSchema, ['backoff'], { backoff: { kind: '?' } })).toEqual(['kind', 'window', 'base', 'factor']);
    expect(validKeysAt(demoSchema, [], data)).toContain('preambles');
  });

  it('walks arrays, optional and nullable wrappers, pipes and plain unions', () => {
    const s = z.strictObject({
      points: z.array(z.strictObject({ load: z.number(), label: z.string().optional() })).nullable().optional(),
      either: z.union([z.strictObject({ a: z.number() }), z.strictObject({ b: z.number() })]),
      piped: z.strictObject({ x: z.number() }).transform((v) => v.x),
    });
    expect(validKeysAt(s, ['points', 0], { points: [{}] })).toEqual(['load', 'label']);
    expect(validKeysAt(s, ['either'], {})).toEqual(['a', 'b']);
    expect(validKeysAt(s, ['piped'], {})).toEqual(['x']);
  });
});

describe('closestKey', () => {
  // Damerau–Levenshtein (optimal string alignment) distances, exact by hand.
  it.each([
    ['preambels', ['preambles', 'slot', 'horizon'], 'preambles'], // one transposition
    ['cuont', ['count', 'period', 'mode'], 'count'], // one transposition
    ['horizn', ['horizon', 'slot'], 'horizon'], // one deletion
    ['Slot', ['slot', 'horizon'], 'slot'], // case only
    ['xyz', ['count', 'period'], undefined], // too far
    ['perod', ['period', 'mode'], 'period'],
  ] as const)('%s → %s', (key, candidates, expected) => {
    expect(closestKey(key, candidates)).toBe(expected);
  });
});
