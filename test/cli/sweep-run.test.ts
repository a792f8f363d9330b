/**
 * Sweeps from the terminal, parallel workers, shards, interruption and resume — all through the
 * built command. Sources: common practice (reproducible simulation: a result must not depend on the
 * number of workers, on sharding, or on an interruption; Law & Kelton ch. 12 on sweeps/designs).
 */
import { spawn } from 'node:child_process';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { makeTempDir, removeTempDirs, repoFile, REPO_ROOT, runCli } from './run-cli.js';

afterAll(removeTempDirs);

const MODEL2 = repoFile('configs/reference/tr37868-model2.yaml');
const SMALL = ['--set', 'groups.mtc.count=2000', '--reps', '4', '--vary', 'groups.mtc.count=1000,3000', '--quiet'];
const read = (dir: string, file: string): string => readFileSync(join(dir, file), 'utf8');

describe('sweeps from the terminal', () => {
  it('--vary adds an axis; points.csv has one tidy row per point with the swept value and mean/half-width/n', () => {
    const dir = makeTempDir();
    const r = runCli(['run', MODEL2, ...SMALL, '--out', dir, '--workers', '1']);
    expect(r.status).toBe(0);
    const csv = read(dir, 'points.csv').trim().split('\n');
    expect(csv).toHaveLength(3);
    const header = csv[0]?.split(',') ?? [];
    expect(header.slice(0, 4)).toEqual(['point', 'label', 'groups.mtc.count', 'replications']);
    expect(header).toContain('access_success_probability_mean');
    expect(header).toContain('access_success_probability_half_width');
    expect(header).toContain('access_success_probability_n');
    expect(csv[2]?.split(',').slice(0, 4)).toEqual(['1', 'mtc.count=3000', '3000', '4']);
    const summary = JSON.parse(read(dir, 'summary.json')) as { points: Array<{ parameters: Record<string, unknown> }> };
    expect(summary.points.map((p) => p.parameters['groups.mtc.count'])).toEqual([1000, 3000]);
  });

  it('ranges: FROM..TO/COUNT and /log give the documented values', () => {
    const r = runCli(['validate', MODEL2, '--vary', 'groups.mtc.count=1000..100000/3/log']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/range:\s*\n\s*from: 1000\s*\n\s*to: 100000\s*\n\s*count: 3\s*\n\s*scale: log/);
    const bad = runCli(['run', MODEL2, '--vary', 'groups.mtc.count']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('--vary');
  });

  it('1 and 2 workers give byte-identical results', () => {
    const one = makeTempDir();
    const two = makeTempDir();
    expect(runCli(['run', MODEL2, ...SMALL, '--out', one, '--workers', '1']).status).toBe(0);
    expect(runCli(['run', MODEL2, ...SMALL, '--out', two, '--workers', '2']).status).toBe(0);
    for (const f of ['summary.json', 'replications.csv', 'points.csv']) expect(read(two, f)).toBe(read(one, f));
  });

  it('three shards merged give the files of one unsharded run (byte-identical summary.json)', () => {
    const whole = makeTempDir();
    expect(runCli(['run', MODEL2, ...SMALL, '--out', whole, '--workers', '1']).status).toBe(0);
    const shards = [1, 2, 3].map((i) => {
      const dir = makeTempDir();
      expect(runCli(['run', MODEL2, ...SMALL, '--shard', `${i}/3`, '--out', dir, '--workers', '1']).status).toBe(0);
      return dir;
    });
    const merged = makeTempDir();
    const m = runCli(['merge', ...shards, '--out', merged, '--quiet']);
    expect(m.status).toBe(0);
    for (const f of ['summary.json', 'replications.csv', 'points.csv']) expect(read(merged, f)).toBe(read(whole, f));
    // A missing shard is refused with its number.
    const partial = runCli(['merge', shards[0] as string, shards[2] as string, '--out', makeTempDir()]);
    expect(partial.status).not.toBe(0);
    expect(partial.stderr).toContain('2/3');
  });

  it('Ctrl-C keeps finished replications; --resume finishes without changing any result', async () => {
    const full = makeTempDir();
    const args = ['--set', 'groups.mtc.count=30000', '--reps', '24', '--workers', '2'];
    expect(runCli(['run', MODEL2, ...args, '--out', full, '--quiet'], { timeoutMs: 120_000 }).status).toBe(0);
    const cut = makeTempDir();
    const child = spawn(process.execPath, [join(REPO_ROOT, 'bin', 'jostle.js'), 'run', MODEL2, ...args, '--out', cut], { stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => {
      stderr += d.toString();
    });
    // Interrupt once a few replications are on disk.
    await new Promise<void>((resolve) => {
      const poll = setInterval(() => {
        const journal = join(cut, 'journal', 'tasks.jsonl');
        if (existsSync(journal) && readFileSync(journal, 'utf8').split('\n').length > 3) {
          clearInterval(poll);
          child.kill('SIGINT');
          resolve();
        }
      }, 20);
    });
    const status = await new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    expect(status).toBe(130);
    expect(stderr).toContain('--resume');
    const saved = readFileSync(join(cut, 'journal', 'tasks.jsonl'), 'utf8').trim().split('\n').length;
    expect(saved).toBeGreaterThan(2);
    expect(saved).toBeLessThan(24);
    expect(existsSync(join(cut, 'summary.json'))).toBe(false);
    // Without --resume the saved work is not thrown away silently.
    const refused = runCli(['run', MODEL2, ...args, '--out', cut, '--quiet']);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toContain('--resume');
    const resumed = runCli(['run', MODEL2, ...args, '--out', cut, '--resume', '--quiet'], { timeoutMs: 120_000 });
    expect(resumed.status).toBe(0);
    for (const f of ['summary.json', 'replications.csv']) expect(read(cut, f)).toBe(read(full, f));
    // Resumed runs do not redo finished replications: the journal holds each exactly once.
    const lines = readFileSync(join(cut, 'journal', 'tasks.jsonl'), 'utf8').trim().split('\n');
    expect(lines).toHaveLength(24);
  }, 180_000);

  it('progress on a pipe is a plain line, not a redrawn bar; --quiet silences it', () => {
    const dir = makeTempDir();
    const r = runCli(['run', MODEL2, '--set', 'groups.mtc.count=2000', '--reps', '3', '--out', dir, '--workers', '1']);
    expect(r.status).toBe(0);
    expect(r.stderr).toMatch(/^jostle: \[#+\.*\] \d+\/3 replications/m);
    expect(r.stderr).not.toContain('\r');
    const q = runCli(['run', MODEL2, '--set', 'groups.mtc.count=2000', '--reps', '3', '--out', makeTempDir(), '--quiet']);
    expect(q.stderr).toBe('');
  });

  it('a sweep run writes plots and report.html; jostle plot redraws them from summary.json', () => {
    const dir = makeTempDir();
    expect(runCli(['run', MODEL2, ...SMALL, '--out', dir, '--workers', '1']).status).toBe(0);
    const plots = readdirSync(join(dir, 'plots'));
    expect(plots).toContain('access_success_probability.svg');
    expect(plots.filter((f) => f.startsWith('delay-cdf'))).toHaveLength(2);
    const html = read(dir, 'report.html');
    expect(html).toContain('<svg');
    expect(html).not.toContain('<script');
    const before = read(dir, join('plots', 'access_success_probability.svg'));
    const again = runCli(['plot', dir]);
    expect(again.status).toBe(0);
    expect(read(dir, join('plots', 'access_success_probability.svg'))).toBe(before);
  });
});
