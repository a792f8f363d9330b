/** Test helper: run an experiment given as YAML text through the real loader and runner. */
import { loadExperimentText } from '../../src/config/load.js';
import type { ExperimentConfig } from '../../src/config/schema.js';
import { runExperiment, type ExperimentResult, type RunOptions } from '../../src/experiment/run.js';
import type { Summary } from '../../src/stats/index.js';

export function configFrom(yaml: string, sets: readonly string[] = []): ExperimentConfig {
  const loaded = loadExperimentText('test.yaml', yaml, sets);
  if (!loaded.ok) throw new Error(loaded.problems.map((p) => `${p.path}: ${p.message}`).join('\n'));
  return loaded.config;
}

export function runYaml(yaml: string, sets: readonly string[] = [], options: RunOptions = {}): ExperimentResult {
  const loaded = loadExperimentText('test.yaml', yaml, sets);
  if (!loaded.ok) throw new Error(loaded.problems.map((p) => `${p.path}: ${p.message}`).join('\n'));
  return runExperiment(loaded.config, { points: loaded.points, ...options });
}

export function metricOf(result: ExperimentResult, name: string, group?: string): Summary {
  const point = result.points[0];
  if (point === undefined) throw new Error('no point');
  const table = group === undefined ? point.summary.metrics : point.summary.groups[group]?.metrics;
  const s = table?.[name];
  if (s === undefined) throw new Error(`metric ${name} missing`);
  return s;
}

/** Per-replication values of a cell metric. */
export function valuesOf(result: ExperimentResult, name: string): number[] {
  return (result.points[0]?.records ?? []).map((r) => r.metrics[name] ?? Number.NaN);
}

/** Ideal random access: perfect detection, unlimited responses, no HARQ errors (multichannel slotted ALOHA). */
export function idealCell(preambles: number, attempts = 1): string {
  return `cell:
  random_access:
    preambles: ${preambles}
    detection: perfect
    answers_per_subframe: unlimited
    msg3: { error_probability: 0 }
    msg4: { error_probability: 0 }
    preamble_trans_max: ${attempts}
`;
}

/** |mean − expected| within `k` standard errors (k ≈ 3.3 is a two-sided 99.9 % normal band). */
export function expectWithinSE(s: Summary, expected: number, k = 3.3): void {
  const se = s.std / Math.sqrt(s.n);
  const gap = Math.abs(s.mean - expected);
  if (!(gap <= k * se)) {
    throw new Error(`mean ${s.mean} differs from ${expected} by ${gap}, more than ${k} standard errors (${se}, n=${s.n})`);
  }
}
