// `jostle validate` (the resolved experiment as YAML, every default filled in) and `jostle schema`
// (the JSON Schema of experiment files).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTempDir, removeTempDirs, repoFile, runCliAsync, writeText } from './run-cli.js';

const MODEL2 = repoFile('configs/reference/tr37868-model2.yaml');

let dir = '';

beforeAll(() => {
  dir = makeTempDir();
});
afterAll(removeTempDirs);

/** The output without its first line (the `# FILE: valid…` comment, which names the file). */
function body(stdout: string): string {
  return stdout.slice(stdout.indexOf('\n') + 1);
}

describe.concurrent('jostle validate', () => {
  it('prints the experiment with every default filled in', async () => {
    const r = await runCliAsync(['validate', MODEL2], { cwd: dir });
    expect(r.status).toBe(0);
    expect(r.stdout.split('\n')[0]).toMatch(/^# .*valid/);
    // Random-access defaults: the evaluation assumptions of 3GPP TR 37.868 (preambleTransMax 10,
    // backoff indicator 20 ms, 54 contention preambles, one PRACH opportunity every 5 ms) — from memory
    expect(r.stdout).toMatch(/^ +preamble_trans_max: 10$/m);
    expect(r.stdout).toMatch(/^ +backoff_indicator: 20ms$/m);
    expect(r.stdout).toMatch(/^ +preambles: 54$/m);
    expect(r.stdout).toMatch(/^ +occasion_period: 5ms$/m);
    // common practice: the resolved form spells out defaults the file left implicit
    expect(r.stdout).toMatch(/^replications: 10$/m);
    expect(r.stdout).toMatch(/^ +policy: contention$/m);
  });

  it('its output is itself a valid experiment that resolves to the same text', async () => {
    // common practice: a normalised form is a fixed point of the normaliser
    const first = await runCliAsync(['validate', MODEL2], { cwd: dir });
    expect(first.status).toBe(0);
    const resolved = writeText(dir, 'resolved.yaml', first.stdout);
    const second = await runCliAsync(['validate', resolved], { cwd: dir });
    expect(second.status).toBe(0);
    expect(second.stderr).toBe('');
    expect(body(second.stdout)).toBe(body(first.stdout));
  });

  it('applies --set overrides and reports bad ones with exit 2', async () => {
    // common practice: overrides change the printed configuration; a bad value is a usage error
    const ok = await runCliAsync(['validate', MODEL2, '--set', 'groups.mtc.count=2000', '--set', 'cell.random_access.backoff_indicator=40ms'], { cwd: dir });
    expect(ok.status).toBe(0);
    expect(ok.stdout).toMatch(/^ +count: 2000$/m);
    expect(ok.stdout).toMatch(/^ +backoff_indicator: 40ms$/m);
    const bad = await runCliAsync(['validate', MODEL2, '--set', 'cell.random_access.backoff_indicator=40'], { cwd: dir });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/^--set: cell\.random_access\.backoff_indicator: /m);
    expect(bad.stderr).not.toContain('    at ');
  });
});

interface JsonSchema {
  $schema?: string;
  properties?: Record<string, JsonSchema>;
  anyOf?: JsonSchema[];
  type?: string;
  pattern?: string;
}

describe.concurrent('jostle schema', () => {
  it('prints a JSON Schema of experiment files', async () => {
    // JSON Schema draft 2020-12 (json-schema.org): `$schema` names the dialect — common practice
    const r = await runCliAsync(['schema'], { cwd: dir });
    expect(r.status).toBe(0);
    const schema = JSON.parse(r.stdout) as JsonSchema;
    expect(schema.$schema).toMatch(/^https:\/\/json-schema\.org\//);
    expect(schema.properties?.['groups']).toBeDefined();
    expect(schema.properties?.['experiment']).toBeDefined();
  });

  it('describes `horizon` as a string with a pattern that accepts durations with units only', async () => {
    // common practice: editors check durations by pattern; units as in the `validate` cases above
    const schema = JSON.parse((await runCliAsync(['schema'], { cwd: dir })).stdout) as JsonSchema;
    const horizon = schema.properties?.['horizon'];
    const text = [horizon, ...(horizon?.anyOf ?? [])].find((s) => s?.type === 'string' && s.pattern !== undefined);
    expect(text, 'a string branch with a pattern').toBeDefined();
    const re = new RegExp(text!.pattern!, 'u');
    for (const good of ['10ms', '2.5s', '1h', '15min', '250us']) expect(re.test(good), good).toBe(true);
    for (const bad of ['10', '5 parsecs', '-1s', '1e3ms']) expect(re.test(bad), bad).toBe(false);
  });
});
