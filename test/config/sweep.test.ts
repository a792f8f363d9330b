/**
 * Sweeps: expansion of axes into points (grid and zip), ranges, labels, and positioned problems for a
 * bad value inside the sweep section. Sources: common practice (full-factorial and one-factor designs,
 * Law & Kelton ch. 12); log ranges are evenly spaced in log10 (exact).
 */
import { describe, expect, it } from 'vitest';
import { loadExperimentText } from '../../src/config/load.js';
import { rangeValues } from '../../src/config/sweep-schema.js';

const base = `experiment: sweep
seed: 1
groups:
  mtc:
    count: 100
    traffic: { model: beta-burst }
`;

function load(text: string) {
  const r = loadExperimentText('sweep.yaml', text);
  return r;
}

describe('sweep expansion', () => {
  it('a grid of 2 × 3 values gives 6 points, first axis slowest, each validated', () => {
    const r = load(`${base}sweep:
  axes:
    - path: groups.mtc.count
      values: [1000, 3000]
    - path: cell.random_access.backoff_indicator
      values: [10ms, 20ms, 40ms]
`);
    if (!r.ok) throw new Error(JSON.stringify(r.problems));
    expect(r.points).toHaveLength(6);
    expect(r.points.map((p) => [p.config.groups['mtc']?.count, p.config.cell.random_access.backoff_indicator])).toEqual([
      [1000, 10], [1000, 20], [1000, 40], [3000, 10], [3000, 20], [3000, 40],
    ]);
    expect(r.points[4]?.parameters).toEqual({ 'groups.mtc.count': 3000, 'cell.random_access.backoff_indicator': '20ms' });
    expect(r.points.map((p) => p.index)).toEqual([0, 1, 2, 3, 4, 5]);
  });

  it('zip takes the i-th values together and needs equal lengths', () => {
    const ok = load(`${base}sweep:
  combine: zip
  axes:
    - path: groups.mtc.count
      values: [1000, 3000]
      labels: [small, large]
    - path: cell.random_access.preambles
      values: [54, 64]
`);
    if (!ok.ok) throw new Error(JSON.stringify(ok.problems));
    expect(ok.points.map((p) => p.label)).toEqual(['small', 'large']);
    expect(ok.points.map((p) => p.config.cell.random_access.preambles)).toEqual([54, 64]);
    const bad = load(`${base}sweep:
  combine: zip
  axes:
    - { path: groups.mtc.count, values: [1000, 3000] }
    - { path: cell.random_access.preambles, values: [54] }
`);
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems[0]?.message).toMatch(/same number of values/);
  });

  it('a bad value is reported at its own line in the sweep section, naming the point', () => {
    const r = load(`${base}sweep:
  axes:
    - path: groups.mtc.count
      values:
        - 1000
        - -5
`);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const p = r.problems[0];
    expect(p?.path).toBe('groups.mtc.count');
    expect(p?.line).toBe(12);
    expect(p?.message).toMatch(/sweep point 1/);
  });

  it('labels must match the values; values or range, not both', () => {
    const r = load(`${base}sweep:
  axes:
    - { path: groups.mtc.count, values: [1, 2], labels: [one] }
`);
    expect(r.ok).toBe(false);
    const both = load(`${base}sweep:
  axes:
    - { path: groups.mtc.count, values: [1, 2], range: { from: 1, to: 2, count: 2 } }
`);
    expect(both.ok).toBe(false);
  });

  it('labels of a range axis are checked once the range is known, at the labels line', () => {
    const r = load(`${base}sweep:
  axes:
    - path: groups.mtc.count
      range: { from: 10, to: 30, count: 3 }
      labels: [a]
`);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems[0]?.path).toBe('sweep.axes.0.labels');
    expect(r.problems[0]?.line).toBe(11);
    expect(r.problems[0]?.message).toMatch(/1 labels for 3 values/);
  });

  it('automatic labels of map values show the keys that differ, and never repeat', () => {
    const r = load(`${base}horizon: 1s
sweep:
  axes:
    - path: groups.mtc.access
      values:
        - { policy: random-grant, grants_per_occasion: 4, fallback_after: 20ms }
        - { policy: random-grant, grants_per_occasion: 4, fallback_after: 200ms }
    - path: groups.mtc.count
      values: [10, 10]
`);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.points.map((p) => p.label)).toEqual([
      'mtc.access={"fallback_after":"20ms"}, mtc.count=10 #1',
      'mtc.access={"fallback_after":"20ms"}, mtc.count=10 #2',
      'mtc.access={"fallback_after":"200ms"}, mtc.count=10 #1',
      'mtc.access={"fallback_after":"200ms"}, mtc.count=10 #2',
    ]);
  });

  it('a grid of more than 100,000 points is refused before it is built', () => {
    const r = load(`${base}sweep:
  axes:
    - { path: groups.mtc.count, range: { from: 1, to: 10000, count: 10000 } }
    - { path: seed, range: { from: 1, to: 10000, count: 10000 } }
`);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems[0]?.message).toBe('the sweep has 100000000 points; at most 100000');
  });

  it('ranges: linear by count or step, log by count, integers deduplicated', () => {
    expect(rangeValues({ from: 1000, to: 5000, count: 5, scale: 'linear', integer: false })).toEqual([1000, 2000, 3000, 4000, 5000]);
    expect(rangeValues({ from: 0.1, to: 0.5, step: 0.1, scale: 'linear', integer: false })).toEqual([0.1, 0.2, 0.3, 0.4, 0.5]);
    expect(rangeValues({ from: 1000, to: 100000, count: 3, scale: 'log', integer: false })).toEqual([1000, 10000, 100000]);
    expect(rangeValues({ from: 1, to: 3, count: 5, scale: 'linear', integer: true })).toEqual([1, 2, 3]);
  });
});
