/**
 * Expanding a sweep into points: every combination of axis values (grid) or the i-th values of all
 * axes (zip) becomes one point, whose config is the experiment with those values written at their
 * paths and validated again — so a bad value is reported at its own line in the sweep section.
 */
import { isSeq, type Node } from 'yaml';
import type { Problem } from './problems.js';
import { experimentSchema, type ExperimentConfig } from './schema.js';
import { rangeValues, type SweepSpec } from './sweep-schema.js';
import { validateSource, type EditOrigin, type Edits } from './validate.js';
import { positionOf, type YamlSource } from './yaml-source.js';

export interface PointSpec {
  readonly index: number;
  /** The swept values of this point, path → value as written. */
  readonly parameters: Readonly<Record<string, unknown>>;
  /** A short name for tables: axis labels, or path=value. */
  readonly label: string;
  readonly config: ExperimentConfig;
}

interface AxisValues {
  readonly path: string;
  readonly nodes: Node[];
  readonly values: unknown[];
  readonly labels: string[];
  /** Whether the labels were given in the file (then axes without labels stay out of point names). */
  readonly named: boolean;
}

const MAX_POINTS = 100_000;

const isPlainObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function describeValue(value: unknown): string {
  if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') return String(value);
  return JSON.stringify(value);
}

/**
 * Labels for an axis without `labels`: path=value. Maps are shown by the keys in which the axis's
 * values differ (`access={"fallback_after":"20ms"}`), so that labels stay short and distinct; values
 * that still read alike get their position appended (`#2`), so no two points share a label.
 */
function autoLabels(path: string, values: readonly unknown[]): string[] {
  const short = path.split('.').slice(-2).join('.');
  let shown: readonly unknown[] = values;
  if (values.length > 1 && values.every(isPlainObject)) {
    const keys = [...new Set(values.flatMap((v) => Object.keys(v)))];
    const differing = keys.filter((k) => new Set(values.map((v) => JSON.stringify(v[k]))).size > 1);
    shown = values.map((v) => Object.fromEntries(differing.filter((k) => k in v).map((k) => [k, v[k]])));
  }
  const labels = shown.map((v) => `${short}=${describeValue(v)}`);
  const count = new Map<string, number>();
  for (const l of labels) count.set(l, (count.get(l) ?? 0) + 1);
  return labels.map((l, i) => ((count.get(l) ?? 0) > 1 ? `${l} #${i + 1}` : l));
}

function axisValues(source: YamlSource, sweep: SweepSpec, a: number): AxisValues {
  const axis = sweep.axes[a]!;
  let nodes: Node[];
  if (axis.values !== undefined) {
    const seq: unknown = source.doc.getIn(['sweep', 'axes', a, 'values'], true);
    nodes = isSeq(seq) ? (seq.items as Node[]).map((n) => n.clone() as Node) : axis.values.map((v) => source.doc.createNode(v) as Node);
  } else {
    nodes = rangeValues(axis.range!).map((v) => source.doc.createNode(v) as Node);
  }
  const values = nodes.map((n) => n.toJSON() as unknown);
  const labels = axis.labels ?? autoLabels(axis.path, values);
  return { path: axis.path, nodes, values, labels, named: axis.labels !== undefined };
}

/**
 * Edits of one point: the command-line ones, plus each file axis's path with the position of the
 * value written there — a path whose parents are not in the file has no position of its own. (A
 * range value has no node of its own: it is reported at its axis.)
 */
function pointEdits(source: YamlSource, axes: readonly AxisValues[], tuple: readonly number[], edits: Edits): Edits {
  const out = new Map<string, EditOrigin>();
  tuple.forEach((v, a) => {
    const path = axes[a]!.path;
    const at = positionOf(source, ['sweep', 'axes', a, 'values', v]);
    if (at !== null && !edits.has(path)) out.set(path, at);
  });
  for (const [k, o] of edits) out.set(k, o);
  return out;
}

/** Index tuples of the points, first axis slowest. */
function combinations(sizes: readonly number[], combine: SweepSpec['combine']): number[][] {
  if (combine === 'zip') return Array.from({ length: sizes[0] ?? 0 }, (_, i) => sizes.map(() => i));
  let out: number[][] = [[]];
  for (const size of sizes) out = out.flatMap((prefix) => Array.from({ length: size }, (_, i) => [...prefix, i]));
  return out;
}

/** Keys for setIn: a numeric segment whose parent is a YAML list becomes an index. */
function keysFor(doc: YamlSource['doc'], path: string): (string | number)[] {
  const keys: (string | number)[] = [];
  for (const segment of path.split('.')) {
    const parent: unknown = keys.length === 0 ? doc.contents : doc.getIn(keys, true);
    keys.push(isSeq(parent) && /^\d+$/.test(segment) ? Number(segment) : segment);
  }
  return keys;
}

export type SweepResult = { ok: true; points: PointSpec[] } | { ok: false; problems: Problem[] };

export function expandSweep(source: YamlSource, base: ExperimentConfig, overridden: Edits = new Map()): SweepResult {
  const sweep = base.sweep;
  if (sweep === undefined) return { ok: true, points: [{ index: 0, parameters: {}, label: 'base', config: base }] };
  const axes = sweep.axes.map((_, a) => axisValues(source, sweep, a));
  const sizes = axes.map((a) => a.nodes.length);
  if (sweep.combine === 'zip' && sizes.some((n) => n !== sizes[0])) {
    return {
      ok: false,
      problems: [{ code: 'invalid-value', file: source.file, line: null, column: null, path: 'sweep.axes', message: `zipped axes must have the same number of values (found ${sizes.join(', ')})` }],
    };
  }
  for (const [a, axis] of axes.entries()) {
    // Checked here for range axes, whose values are known only now (lists are checked by the schema).
    if (axis.named && axis.labels.length !== axis.values.length) {
      const at = positionOf(source, ['sweep', 'axes', a, 'labels']);
      return {
        ok: false,
        problems: [
          {
            code: 'invalid-value',
            file: source.file,
            line: at?.line ?? null,
            column: at?.column ?? null,
            path: `sweep.axes.${a}.labels`,
            message: `labels must have one entry per value: ${axis.labels.length} labels for ${axis.values.length} values`,
          },
        ],
      };
    }
  }
  // Count before building: a grid of large axes must be refused, not expanded.
  const count = sweep.combine === 'zip' ? (sizes[0] ?? 0) : sizes.reduce((n, s) => n * s, 1);
  if (count > MAX_POINTS) {
    return { ok: false, problems: [{ code: 'invalid-value', file: source.file, line: null, column: null, path: 'sweep', message: `the sweep has ${count} points; at most ${MAX_POINTS}` }] };
  }
  const tuples = combinations(sizes, sweep.combine);
  const anyNamed = axes.some((a) => a.named);
  const points: PointSpec[] = [];
  const problems = new Map<string, Problem>();
  tuples.forEach((tuple, index) => {
    const doc = source.doc.clone() as YamlSource['doc'];
    const parameters: Record<string, unknown> = {};
    const labels: string[] = [];
    tuple.forEach((v, a) => {
      const axis = axes[a]!;
      doc.setIn(keysFor(doc, axis.path), axis.nodes[v]!.clone());
      parameters[axis.path] = axis.values[v];
      // In a grid every axis names its value; zipped axes move together, so named ones suffice.
      if (axis.named || !anyNamed || sweep.combine === 'grid') labels.push(axis.labels[v]!);
    });
    const checked = validateSource({ ...source, doc }, experimentSchema, pointEdits(source, axes, tuple, overridden));
    if (!checked.ok) {
      for (const p of checked.problems) {
        const key = `${p.code}|${p.line}|${p.column}|${p.path}|${p.message}`;
        if (!problems.has(key)) problems.set(key, { ...p, message: `${p.message} (in sweep point ${index}: ${labels.join(', ')})` });
      }
      return;
    }
    points.push({ index, parameters, label: labels.join(', '), config: checked.value });
  });
  return problems.size > 0 ? { ok: false, problems: [...problems.values()] } : { ok: true, points };
}
