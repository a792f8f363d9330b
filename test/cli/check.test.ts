// `jostle check`: listing and running the built-in validation cases.
import { afterAll, describe, expect, it } from 'vitest';
import { removeTempDirs, runCliAsync } from './run-cli.js';

afterAll(removeTempDirs);

describe.concurrent('jostle check', () => {
  it('--list lists the case ids and exits 0', async () => {
    // common practice: a listing option prints and succeeds
    const r = await runCliAsync(['check', '--list']);
    expect(r.status).toBe(0);
    const ids = r.stdout.trimEnd().split('\n').map((line) => line.split(/\s+/)[0]);
    expect(ids).toContain('aloha-g1');
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('--only aloha-g1 runs that case, passes, and shows its source', async () => {
    const r = await runCliAsync(['check', '--only', 'aloha-g1']);
    expect(r.stderr).not.toContain('    at ');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^ +pass /m);
    expect(r.stdout).not.toMatch(/^ +FAIL /m);
    expect(r.stdout).toContain('G·e^(−G)');
    // reference-values.md §1: "Slotted, Poisson offered load G per slot: S = G·e^(−G); max 1/e =
    // 0.367879 at G = 1. **exact**"
    expect(r.stdout).toContain(`expected ${Math.exp(-1).toFixed(6)}`);
    expect(r.stdout).toContain('expected 0.367879');
    // common practice: only the selected case runs
    expect(r.stdout).not.toContain('aloha-g2');
  });

  it('--only with no matching case exits 2 and names the known cases', async () => {
    // common practice: an argument that selects nothing is a usage error
    const r = await runCliAsync(['check', '--only', 'nosuch']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('nosuch');
    expect(r.stderr).toContain('aloha-g1');
    expect(r.stderr).not.toContain('    at ');
  });
});
