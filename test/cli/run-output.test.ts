// `jostle run`: the printed table, summary.json and replications.csv, and the default output folder.
// A small instance of 3GPP TR 37.868 traffic model 2 (2000 devices, 3 replications) keeps it fast.
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTempDir, readText, removeTempDirs, repoFile, runCli, writeText, type CliResult } from './run-cli.js';

const MODEL2 = repoFile('configs/reference/tr37868-model2.yaml');
const SMALL = ['--set', 'groups.mtc.count=2000', '--reps', '3'];

/**
 * Metrics a user of summary.json relies on. The KPIs of 3GPP TR 37.868 (access success probability,
 * collision probability, preamble transmissions, access delay) — from memory; reference-values.md §2:
 * "Two definitions of collision probability exist in 3GPP TR 37.868 (per device and per access
 * opportunity) and disagree widely … Report both."
 */
const METRICS = [
  'access_success_probability',
  'collision_probability_per_device',
  'collision_probability_per_rao',
  'mean_preamble_transmissions',
  'delay_mean_ms',
  'delay_p50_ms',
  'delay_p95_ms',
  'delay_p99_ms',
  'throughput_per_s',
];

interface Entry {
  mean: number | null;
  half_width: number | null;
  std: number | null;
  n: number;
}
interface Summary {
  tool: { name: string; version: string };
  experiment: string;
  seed: unknown;
  config: { groups: Record<string, { count: number }> };
  points: {
    index: number;
    parameters: Record<string, unknown>;
    replications: number;
    metrics: Record<string, Entry>;
    groups: Record<string, { metrics: Record<string, Entry> }>;
  }[];
}

/** Rows of a CSV file without quoted fields (jostle's numeric CSV), header first. */
function csvRows(text: string): string[][] {
  return text.trimEnd().split('\n').map((line) => line.split(','));
}

/** |actual − expected| ≤ rel · max(|expected|, 1e-300). */
function expectRelative(actual: number, expected: number, rel: number, label: string): void {
  expect(Math.abs(actual - expected), label).toBeLessThanOrEqual(rel * Math.max(Math.abs(expected), 1e-300));
}

let dir = '';
let run: CliResult;
let summary: Summary;
let rows: string[][];

beforeAll(() => {
  dir = makeTempDir();
  run = runCli(['run', MODEL2, ...SMALL, '--out', join(dir, 'm2')], { cwd: dir });
  if (run.status === 0) {
    summary = JSON.parse(readText(join(dir, 'm2', 'summary.json'))) as Summary;
    rows = csvRows(readText(join(dir, 'm2', 'replications.csv')));
  }
});
afterAll(removeTempDirs);

describe('jostle run writes the documented results', () => {
  it('exits 0 and prints a table with the success probability', () => {
    // common practice: exit 0 on success; results on stdout
    expect(run.stderr).not.toContain('    at ');
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('access_success_probability');
  });

  it('summary.json has the documented shape', () => {
    // common practice: a machine-readable result file that names the tool and version that made it
    const pkg = JSON.parse(readText(repoFile('package.json'))) as { version: string };
    expect(summary.tool).toEqual({ name: 'jostle', version: pkg.version });
    expect(summary.experiment).toBe('tr37868-model2');
    expect(summary.seed).toBe(37868);
    expect(summary.points).toHaveLength(1);
    const point = summary.points[0]!;
    expect(point.index).toBe(0);
    expect(point.parameters).toEqual({});
    expect(point.replications).toBe(3);
    for (const name of METRICS) {
      const entry = point.metrics[name];
      expect(entry, name).toBeDefined();
      expect(Object.keys(entry!).sort()).toEqual(['half_width', 'mean', 'n', 'std']);
      expect(entry!.n).toBe(3);
      expect(typeof entry!.mean).toBe('number');
    }
    expect(Object.keys(point.groups)).toEqual(['mtc']);
    for (const name of METRICS.filter((m) => m !== 'collision_probability_per_rao')) {
      // per-RAO collisions are a property of the cell, not of a group
      expect(point.groups['mtc']!.metrics[name]?.n, name).toBe(3);
    }
  });

  it('probabilities lie in [0, 1] and delay percentiles are ordered', () => {
    // exact: probabilities are in [0, 1]; p50 ≤ p95 ≤ p99 for any distribution
    const m = summary.points[0]!.metrics;
    for (const name of ['access_success_probability', 'collision_probability_per_device', 'collision_probability_per_rao']) {
      expect(m[name]!.mean!).toBeGreaterThanOrEqual(0);
      expect(m[name]!.mean!).toBeLessThanOrEqual(1);
    }
    expect(m['delay_p50_ms']!.mean!).toBeLessThanOrEqual(m['delay_p95_ms']!.mean!);
    expect(m['delay_p95_ms']!.mean!).toBeLessThanOrEqual(m['delay_p99_ms']!.mean!);
    expect(m['mean_preamble_transmissions']!.mean!).toBeGreaterThanOrEqual(1);
  });

  it('replications.csv has one row per replication with a 16-hex-digit seed', () => {
    // common practice: a header row, then one record per line
    const [header, ...data] = rows;
    expect(header!.slice(0, 3)).toEqual(['point', 'replication', 'seed']);
    for (const name of METRICS) expect(header).toContain(name);
    expect(data).toHaveLength(3);
    data.forEach((row, i) => {
      expect(row).toHaveLength(header!.length);
      expect(row[0]).toBe('0');
      expect(row[1]).toBe(String(i));
      expect(row[2]).toMatch(/^[0-9a-f]{16}$/);
    });
    expect(new Set(data.map((row) => row[2])).size).toBe(3);
  });

  it('summary mean, std and half-width follow from the CSV rows', () => {
    // exact: sample mean; sample standard deviation with n − 1; Student-t half-width t·s/√n, where
    // for 2 degrees of freedom t_p = (2p − 1)/√(2p(1 − p)) (closed form), p = 0.975 → 4.302653
    const [header, ...data] = rows;
    const t2 = (2 * 0.975 - 1) / Math.sqrt(2 * 0.975 * 0.025);
    for (const name of METRICS) {
      const col = header!.indexOf(name);
      const xs = data.map((row) => Number(row[col]));
      const mean = (xs[0]! + xs[1]! + xs[2]!) / 3;
      const std = Math.sqrt(xs.reduce((acc, x) => acc + (x - mean) ** 2, 0) / 2);
      const entry = summary.points[0]!.metrics[name]!;
      // tolerances: rounding of sums (1e-12 relative); numerical t quantile (1e-8 relative)
      expectRelative(entry.mean!, mean, 1e-12, name);
      expectRelative(entry.std!, std, 1e-12, name);
      expectRelative(entry.half_width!, (t2 * std) / Math.sqrt(3), 1e-8, name);
    }
  });

  it('the config echo shows the --set override and validates again', () => {
    // common practice: a result file records the exact inputs that produced it
    expect(summary.config.groups['mtc']!.count).toBe(2000);
    // JSON is YAML (YAML 1.2 spec, §1.3 — from memory), so the echo can be fed back to `validate`
    const echo = writeText(dir, 'echo.yaml', JSON.stringify(summary.config));
    const again = runCli(['validate', echo], { cwd: dir });
    expect(again.status).toBe(0);
    expect(again.stdout).toContain('count: 2000');
  });
});

describe('default output folder', () => {
  it('without --out the files go to results/<experiment>/ under the working directory', () => {
    // common practice: relative output paths resolve against the current directory
    const r = runCli(['run', MODEL2, '--set', 'groups.mtc.count=2000', '--reps', '1', '--quiet']);
    expect(r.status).toBe(0);
    const out = join(r.cwd, 'results', 'tr37868-model2');
    expect(existsSync(join(out, 'summary.json'))).toBe(true);
    expect(existsSync(join(out, 'replications.csv'))).toBe(true);
  });
});
