// Bad experiment files: exit 2 and one `file:line:col: key.path: message` block per problem on
// stderr, with the line of the offending text, never a stack trace, and no results written.
// Source: common practice (compiler-style `file:line:column: message` diagnostics, as in GNU
// coding standards "Formatting Error Messages" — from memory; exit 2 for bad input).
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTempDir, removeTempDirs, runCliAsync, writeText } from './run-cli.js';

/** A valid group, to which each case adds one mistake. */
const GROUPS = `groups:
  mtc:
    count: 100
    traffic: { model: uniform-window, window: 1s }
`;

/** A problem header as printed: `file:line:col: path: message` (path absent for syntax errors). */
interface Header {
  readonly line: number;
  readonly rest: string;
}

let dir = '';

/** Writes `text` as `name` in the temp folder, runs `jostle run name` (cwd = that folder), expects exit 2; returns stderr and headers. */
async function runBroken(name: string, text: string, extra: readonly string[] = []): Promise<{ stderr: string; headers: Header[] }> {
  writeText(dir, name, text);
  const r = await runCliAsync(['run', name, '--out', `out-${name}`, ...extra], { cwd: dir });
  expect(r.status).toBe(2);
  expect(r.stderr).not.toContain('    at ');
  expect(existsSync(join(dir, `out-${name}`))).toBe(false);
  const prefix = `${name}:`;
  const headers = r.stderr
    .split('\n')
    .filter((l) => l.startsWith(prefix))
    .map((l) => {
      const m = /^[^:]+:(\d+):(\d+): (.*)$/.exec(l);
      expect(m, l).not.toBeNull();
      return { line: Number(m![1]), rest: m![3]! };
    });
  return { stderr: r.stderr, headers };
}

beforeAll(() => {
  dir = makeTempDir();
});
afterAll(removeTempDirs);

describe.concurrent('broken experiment files exit 2 with positioned problems', () => {
  it('YAML syntax: an unclosed flow map', async () => {
    // common practice: an unclosed bracket is reported where it opens or where the parser notices it
    const { headers } = await runBroken('unclosed.yaml', `experiment: bad\nseed: { a: 1\n${GROUPS}`);
    expect(headers).toHaveLength(1);
    expect([2, 3]).toContain(headers[0]!.line);
  });

  it('YAML syntax: a nested mapping in a compact value, at its exact line', async () => {
    // YAML 1.2 §7.3.3: a plain scalar may not contain ": " in a block mapping value — from memory
    const text = `experiment: bad\ngroups:\n  mtc:\n    count: 100: 200\n    traffic: { model: uniform-window, window: 1s }\n`;
    const { headers } = await runBroken('nested.yaml', text);
    expect(headers.map((h) => h.line)).toEqual([4]);
  });

  it('a misspelt key, with a suggestion', async () => {
    // common practice: "did you mean" suggestions for near-miss names (edit distance 2 here)
    const text = `experiment: bad\ncell:\n  random_access:\n    preambels: 54\n${GROUPS}`;
    const { stderr, headers } = await runBroken('typo.yaml', text);
    expect(headers).toHaveLength(1);
    expect(headers[0]!.line).toBe(4);
    expect(headers[0]!.rest).toMatch(/^cell\.random_access\.preambels: /);
    expect(stderr).toContain('preambles');
  });

  it('a duration with an unknown unit', async () => {
    // common practice: units are SI symbols (us, ms, s …); an unknown unit is named back to the user
    const text = `experiment: bad\ncell:\n  random_access:\n    occasion_period: 5 parsecs\n${GROUPS}`;
    const { stderr, headers } = await runBroken('unit.yaml', text);
    expect(headers[0]!.line).toBe(4);
    expect(headers[0]!.rest).toMatch(/^cell\.random_access\.occasion_period: /);
    expect(stderr).toContain('parsecs');
    expect(stderr).toMatch(/\bms\b/); // the accepted units are listed
  });

  it('a plain number where a duration belongs', async () => {
    // common practice: a bare number has no unit, so it is refused rather than guessed
    const { stderr, headers } = await runBroken('plain.yaml', `experiment: bad\nhorizon: 10\n${GROUPS}`);
    expect(headers[0]!.line).toBe(2);
    expect(headers[0]!.rest).toMatch(/^horizon: /);
    expect(stderr).toMatch(/unit/);
  });

  it('a negative device count', async () => {
    // exact: a device count is a positive integer
    const text = `experiment: bad\ngroups:\n  mtc:\n    count: -5\n    traffic: { model: uniform-window, window: 1s }\n`;
    const { stderr, headers } = await runBroken('negative.yaml', text);
    expect(headers[0]!.line).toBe(4);
    expect(headers[0]!.rest).toMatch(/^groups\.mtc\.count: /);
    expect(stderr).toContain('-5');
  });

  it('zero preambles', async () => {
    // exact: contention needs at least one preamble (M ≥ 1)
    const text = `experiment: bad\ncell:\n  random_access:\n    preambles: 0\n${GROUPS}`;
    const { headers } = await runBroken('zero.yaml', text);
    expect(headers[0]!.line).toBe(4);
    expect(headers[0]!.rest).toMatch(/^cell\.random_access\.preambles: /);
  });

  it('an unknown traffic model lists the valid ones', async () => {
    // common practice: an enumerated choice lists its valid values
    const text = `experiment: bad\ngroups:\n  mtc:\n    count: 100\n    traffic:\n      model: sometimes\n`;
    const { stderr, headers } = await runBroken('model.yaml', text);
    expect(headers[0]!.line).toBe(6);
    expect(headers[0]!.rest).toMatch(/^groups\.mtc\.traffic\.model: /);
    for (const model of ['uniform-window', 'beta-burst', 'poisson', 'periodic']) expect(stderr).toContain(model);
  });

  it('recurring (Poisson) traffic without a horizon asks for one', async () => {
    // exact: a Poisson process never stops, so a run needs a finite horizon to end
    const text = `experiment: bad\ngroups:\n  mtc:\n    count: 100\n    traffic: { model: poisson, mean_interval: 10s }\n`;
    const { headers } = await runBroken('recurring.yaml', text);
    expect(headers).toHaveLength(1);
    expect(headers[0]!.line).toBe(5);
    expect(headers[0]!.rest).toMatch(/^groups\.mtc\.traffic\.model: .*horizon/);
  });

  it('both `replications` and `stopping`', async () => {
    // common practice: mutually exclusive settings are refused, not silently resolved
    const text = `experiment: bad\nreplications: 5\nstopping:\n  metric: access_success_probability\n  relative_precision: 0.1\n${GROUPS}`;
    const { stderr, headers } = await runBroken('both.yaml', text);
    expect(headers).toHaveLength(1);
    expect(headers[0]!.line).toBe(2);
    expect(headers[0]!.rest).toMatch(/^replications: /);
    expect(stderr).toContain('stopping');
  });

  it('a stopping rule on a metric this experiment does not report is refused, naming what it needs', async () => {
    // exact: grants_wasted is reported only when some group uses grants; a rule on it could never be met
    const text = `experiment: bad\nstopping:\n  metric: grants_wasted\n  relative_precision: 0.1\n${GROUPS}`;
    const { stderr, headers } = await runBroken('never.yaml', text);
    expect(headers).toHaveLength(1);
    expect(headers[0]!.line).toBe(3);
    expect(headers[0]!.rest).toMatch(/^stopping\.metric: 'grants_wasted' is not reported/);
    expect(stderr).toContain('a group with a grant policy');
  });

  it('several problems in one file are all reported, in line order', async () => {
    // common practice: report every problem in one pass, in file order
    const text = [
      'experiment: bad',
      'horizon: 10',
      'cell:',
      '  random_access:',
      '    preambels: 54',
      '    occasion_period: 5 parsecs',
      'groups:',
      '  mtc:',
      '    count: -5',
      '    traffic: { model: uniform-window, window: 1s }',
      '',
    ].join('\n');
    const { headers } = await runBroken('many.yaml', text);
    expect(headers.map((h) => h.line)).toEqual([2, 5, 6, 9]);
    expect(headers.map((h) => h.rest.split(':')[0])).toEqual([
      'horizon',
      'cell.random_access.preambels',
      'cell.random_access.occasion_period',
      'groups.mtc.count',
    ]);
  });
});

describe.concurrent('problems outside the file', () => {
  it('a missing file exits 2 and names the file', async () => {
    // common practice: a missing input file is reported by name
    const r = await runCliAsync(['run', 'no-such-experiment.yaml'], { cwd: dir });
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('no-such-experiment.yaml');
    expect(r.stderr).not.toContain('    at ');
  });

  it('a bad --set value is reported against --set with the item text', async () => {
    // common practice: an error names the argument that caused it
    const { stderr } = await runBroken('ok.yaml', `experiment: fine\n${GROUPS}`, ['--set', 'groups.mtc.count=abc']);
    expect(stderr).toMatch(/^--set: groups\.mtc\.count: /m);
    expect(stderr).toContain('groups.mtc.count=abc');
  });
});
