/**
 * Command-line overrides `--set path=value`, applied to the YAML document before validation.
 *
 * `path` is dotted (`groups.meters.count`); a segment that lands in a YAML list is an index.
 * `value` is read as one YAML flow value: `20000` is a number, `5ms` a string, `true` a boolean,
 * `[1, 2]` a list, `{a: 1}` a map, an empty value is null. Missing intermediate maps are created.
 * Keys containing `.` or `=` cannot be addressed.
 */
import { isAlias, isMap, isScalar, isSeq, parseDocument } from 'yaml';
import type { Problem } from './problems.js';
import type { EditOrigin, Edits } from './validate.js';
import { dottedPath, type YamlSource } from './yaml-source.js';

export type OverrideResult =
  | { ok: true; source: YamlSource; overridden: Edits }
  | { ok: false; problems: Problem[] };

const EXPECTED = 'an item `path.to.key=value`, e.g. `groups.meters.count=20000`';

function bad(item: string, path: string, message: string): Problem {
  return { code: 'bad-override', file: '--set', line: null, column: null, path, message, found: item, expected: EXPECTED };
}

interface ParsedItem {
  readonly segments: string[];
  readonly value: unknown;
}

/** Splits and checks one item; a string is the problem message. */
function parseItem(item: string): ParsedItem | string {
  const eq = item.indexOf('=');
  if (eq < 0) return 'missing `=` between the key path and the value';
  const pathText = item.slice(0, eq).trim();
  if (pathText === '') return 'missing key path before `=`';
  const segments = pathText.split('.');
  if (segments.some((s) => s.trim() === '' || s !== s.trim())) return `malformed key path \`${pathText}\` (empty segment or spaces)`;
  const valueDoc = parseDocument(item.slice(eq + 1), { prettyErrors: false, uniqueKeys: true });
  const err = [...valueDoc.errors, ...valueDoc.warnings][0];
  if (err !== undefined) return `the value is not valid YAML: ${err.message.replace(/\s+/g, ' ').trim()}`;
  return { segments, value: valueDoc.toJS() };
}

/** The node currently at `segments` (following aliases), or undefined. */
function nodeAt(doc: YamlSource['doc'], segments: readonly (string | number)[]): unknown {
  const node: unknown = doc.getIn(segments, true);
  return isAlias(node) ? node.resolve(doc) : node;
}

/** Turns segments into keys: an index where the parent is a YAML list. A string is a problem. */
function resolveKeys(doc: YamlSource['doc'], segments: readonly string[]): (string | number)[] | string {
  const keys: (string | number)[] = [];
  for (const seg of segments) {
    const parent = keys.length === 0 ? doc.contents : nodeAt(doc, keys);
    if (isSeq(parent)) {
      if (!/^[0-9]+$/.test(seg)) return `\`${dottedPath(keys)}\` is a list; \`${seg}\` is not an index`;
      keys.push(Number(seg));
    } else if (parent === undefined || parent === null || isMap(parent)) {
      keys.push(seg);
    } else if (isScalar(parent) && parent.value === null) {
      keys.push(seg); // `key:` with an empty value becomes a map
    } else {
      const where = keys.length === 0 ? 'the document' : `\`${dottedPath(keys)}\``;
      return `${where} holds a single value, not a map, so \`${seg}\` cannot be set inside it`;
    }
  }
  return keys;
}

/** Sets one value on `doc`; a string is a problem message. */
function setOne(doc: YamlSource['doc'], parsed: ParsedItem): string | undefined {
  const keys = resolveKeys(doc, parsed.segments);
  if (typeof keys === 'string') return keys;
  for (let i = 1; i < keys.length; i++) {
    const prefix = keys.slice(0, i);
    const here = nodeAt(doc, prefix);
    if (isScalar(here) && here.value === null) doc.setIn(prefix, doc.createNode({}));
  }
  try {
    if (doc.contents === null || isScalar(doc.contents)) {
      doc.contents = doc.createNode({}) as unknown as YamlSource['doc']['contents']; // empty file
    }
    doc.setIn(keys, doc.createNode(parsed.value));
  } catch (err) {
    return `cannot set this path: ${(err as Error).message}`;
  }
  return undefined;
}

/**
 * Applies `--set` items in order (later items win) to a copy of the document. Malformed items
 * give Problems (code `bad-override`, file `--set`, all items checked). `overridden` maps each
 * dotted path set to its item, so validation can report problems there as `--set`.
 */
export function applyOverrides(source: YamlSource, items: readonly string[]): OverrideResult {
  const doc = source.doc.clone() as YamlSource['doc'];
  const overridden = new Map<string, EditOrigin>();
  const problems: Problem[] = [];
  for (const item of items) {
    const parsed = parseItem(item);
    if (typeof parsed === 'string') {
      const eq = item.indexOf('=');
      problems.push(bad(item, eq < 0 ? '' : item.slice(0, eq).trim(), parsed));
      continue;
    }
    const failure = setOne(doc, parsed);
    if (failure !== undefined) problems.push(bad(item, parsed.segments.join('.'), failure));
    else overridden.set(parsed.segments.join('.'), { option: '--set', item });
  }
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, source: { ...source, doc }, overridden };
}
