/**
 * `--vary path=VALUES`: adds a sweep axis from the terminal, or replaces the file's axis on the same
 * path, so a sweep needs no file edit. VALUES is one of
 *   v1,v2,v3          a list (each read as a YAML scalar: 1000, 5ms, true, contention)
 *   [v1, {…}, …]      a YAML flow list (for maps: [{policy: contention}, {policy: random-grant}])
 *   FROM..TO/COUNT    COUNT evenly spaced values, ends included (…/COUNT/log: evenly in log10)
 *   FROM..TO+STEP     FROM, FROM+STEP, … up to TO
 * Integer ends (and step) give integer values.
 */
import { isMap, isSeq, parseDocument, YAMLMap, YAMLSeq } from 'yaml';
import type { Problem } from './problems.js';
import type { EditOrigin, Edits } from './validate.js';
import type { YamlSource } from './yaml-source.js';

const EXPECTED = 'path=v1,v2,…  or  path=[v1, v2]  or  path=FROM..TO/COUNT[/log]  or  path=FROM..TO+STEP';

function bad(item: string, message: string): Problem {
  return { code: 'bad-override', file: '--vary', line: null, column: null, path: item.split('=')[0] ?? '', message, found: item, expected: EXPECTED };
}

const NUMBER = '[-+]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][-+]?\\d+)?';
const COUNT_RANGE = new RegExp(`^(${NUMBER})\\.\\.(${NUMBER})/(\\d+)(/log)?$`);
const STEP_RANGE = new RegExp(`^(${NUMBER})\\.\\.(${NUMBER})\\+(${NUMBER})$`);

type Axis = { path: string; values?: unknown[]; range?: Record<string, unknown> };

function parseAxis(item: string): Axis | string {
  const eq = item.indexOf('=');
  if (eq <= 0) return 'missing `path=` before the values';
  const path = item.slice(0, eq).trim();
  if (!/^[A-Za-z0-9_-]+(\.[A-Za-z0-9_-]+)*$/.test(path)) return `malformed key path \`${path}\``;
  const text = item.slice(eq + 1).trim();
  if (text === '') return 'no values after `=`';
  const countRange = COUNT_RANGE.exec(text);
  if (countRange !== null) {
    const [, from = '', to = '', count = '', log] = countRange;
    const integer = Number.isInteger(Number(from)) && Number.isInteger(Number(to)) && !from.includes('.') && !to.includes('.');
    return { path, range: { from: Number(from), to: Number(to), count: Number(count), scale: log === undefined ? 'linear' : 'log', integer } };
  }
  const stepRange = STEP_RANGE.exec(text);
  if (stepRange !== null) {
    const [, from = '', to = '', step = ''] = stepRange;
    const integer = [from, to, step].every((x) => !x.includes('.') && !/e/i.test(x));
    return { path, range: { from: Number(from), to: Number(to), step: Number(step), integer } };
  }
  const listText = text.startsWith('[') ? text : `[${text}]`;
  const doc = parseDocument(listText, { uniqueKeys: true });
  const err = [...doc.errors, ...doc.warnings][0];
  if (err !== undefined) return `the values are not valid YAML: ${err.message.replace(/\s+/g, ' ').trim()}`;
  const values = doc.toJS() as unknown;
  if (!Array.isArray(values) || values.length === 0) return 'no values';
  return { path, values };
}

/**
 * `edits` maps each varied path, and the axis it became (`sweep.axes.i`), to its `--vary` item, so
 * that problems with the values are reported against the item, not the file.
 */
export type VaryResult = { ok: true; source: YamlSource; edits: Edits } | { ok: false; problems: Problem[] };

/** Applies --vary items (and --combine) to a copy of the document's sweep section. */
export function applyVary(source: YamlSource, items: readonly string[], combine?: 'grid' | 'zip'): VaryResult {
  if (items.length === 0 && combine === undefined) return { ok: true, source, edits: new Map() };
  const problems: Problem[] = [];
  const axes: Axis[] = [];
  for (const item of items) {
    const parsed = parseAxis(item);
    if (typeof parsed === 'string') problems.push(bad(item, parsed));
    else axes.push(parsed);
  }
  if (problems.length > 0) return { ok: false, problems };
  const doc = source.doc.clone() as YamlSource['doc'];
  if (!isMap(doc.contents)) return { ok: false, problems: [bad(items[0] ?? '--combine', 'the experiment file is not a map of keys')] };
  let sweep = doc.get('sweep', true);
  if (!isMap(sweep)) {
    sweep = new YAMLMap();
    doc.set('sweep', sweep);
  }
  const sweepMap = sweep as YAMLMap;
  if (combine !== undefined) sweepMap.set('combine', combine);
  const existing: unknown = sweepMap.get('axes', true);
  let seq: YAMLSeq;
  if (isSeq(existing)) {
    seq = existing;
  } else {
    seq = new YAMLSeq();
    sweepMap.set('axes', seq);
  }
  const edits = new Map<string, EditOrigin>();
  axes.forEach((axis, i) => {
    const node = doc.createNode(axis);
    let at = seq.items.findIndex((n) => isMap(n) && n.get('path') === axis.path);
    if (at >= 0) seq.items[at] = node;
    else at = seq.items.push(node) - 1;
    const origin: EditOrigin = { option: '--vary', item: items[i] as string };
    edits.set(axis.path, origin);
    edits.set(`sweep.axes.${at}`, origin);
  });
  return { ok: true, source: { ...source, doc }, edits };
}
