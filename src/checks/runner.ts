/**
 * Runs validation cases through the real simulator and judges them.
 *
 * Pass rule for exact values: |mean − expected| ≤ h₉₉ + tolerance, where h₉₉ is the 99 % Student-t
 * half-width over the replications (a 95 % interval would fail one exact check in twenty by chance).
 * Bands (values from memory) pass when the mean lies inside the band.
 */
import { loadExperimentText } from '../config/load.js';
import { ConfigError } from '../config/problems.js';
import { runExperiment } from '../experiment/run.js';
import { tHalfWidth, type Summary } from '../stats/index.js';
import type { CheckCase, CheckLine } from './case.js';

export const JUDGE_LEVEL = 0.99;

function scaled(s: Summary, k: number): Summary {
  return { mean: s.mean * k, std: s.std * k, half_width: s.half_width * k, n: s.n };
}

export function runCheckCase(c: CheckCase): CheckLine[] {
  const loaded = loadExperimentText(`check:${c.id}`, c.yaml);
  if (!loaded.ok) throw new ConfigError(loaded.problems);
  const result = runExperiment(loaded.config, { points: loaded.points, baseDir: loaded.baseDir });
  const point = result.points[0];
  if (point === undefined) throw new Error(`check ${c.id} produced no point`);
  const metric = (name: string): Summary => {
    const s = point.summary.metrics[name];
    if (s === undefined) throw new Error(`check ${c.id}: metric ${name} is not reported`);
    return s;
  };
  const lines: CheckLine[] = [];
  for (const e of c.expectations) {
    const s = scaled(metric(e.metric), e.scale ?? 1);
    const judge = tHalfWidth(s.std, s.n, JUDGE_LEVEL);
    const allowed = (Number.isFinite(judge) ? judge : 0) + e.tolerance;
    const ok = Math.abs(s.mean - e.expected) <= allowed;
    lines.push({ caseId: c.id, metric: e.metric, simulated: s, expected: e.expected, allowed, source: e.source, verdict: ok ? 'pass' : 'fail' });
  }
  for (const b of c.bands ?? []) {
    const s = metric(b.metric);
    const ok = s.mean >= b.low && s.mean <= b.high;
    lines.push({ caseId: c.id, metric: b.metric, simulated: s, expected: [b.low, b.high], allowed: 0, source: b.source, verdict: ok ? 'pass' : 'fail' });
  }
  return lines;
}
