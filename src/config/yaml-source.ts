/**
 * YAML text → positioned document. Syntax errors, duplicate keys and YAML warnings become
 * {@link Problem}s (code `syntax`) with 1-based line/column; nothing here throws for bad input.
 */
import { readFileSync } from 'node:fs';
import { LineCounter, isAlias, isMap, isScalar, isSeq, parseDocument } from 'yaml';
import type { Document, Node, YAMLError } from 'yaml';
import type { Problem } from './problems.js';

/** A parsed YAML file: its name as given, its text, the document (with node ranges) and line index. */
export interface YamlSource {
  readonly file: string;
  readonly text: string;
  readonly doc: Document.Parsed;
  readonly lines: LineCounter;
}

export type SourceResult = { ok: true; source: YamlSource } | { ok: false; problems: Problem[] };

/** A key path into a document: map keys and list indices. */
export type KeyPath = readonly (string | number)[];

/** Dotted rendering of a key path (`groups.meters.count`, `points.2`); `""` for the document. */
export function dottedPath(path: readonly PropertyKey[]): string {
  return path.map((k) => String(k)).join('.');
}

function startOf(node: Node | null | undefined): number | undefined {
  return node?.range?.[0];
}

/** Start of a node that has visible text; undefined for an empty value (`key:` with nothing). */
function visibleStartOf(node: Node | null | undefined): number | undefined {
  const range = node?.range;
  return range === undefined || range === null || range[0] === range[1] ? undefined : range[0];
}

/** Map keys are Scalar nodes when parsed, plain values when `setIn` created the pair. */
function keyMatches(key: unknown, seg: string | number): boolean {
  const value = isScalar(key) ? key.value : key;
  return (typeof value === 'string' || typeof value === 'number') && String(value) === String(seg);
}

/** Result of walking a document along a key path. */
export interface Located {
  /** How many leading segments exist in the document with a source position. */
  readonly depth: number;
  /** Node reached (value at `path[depth-1]`, or the document contents), null for an empty value. */
  readonly node: Node | null;
  /** Key node of the last map pair walked, if any. */
  readonly key: Node | null;
  /** True when the walk stopped at a node that has no source position (made by an override). */
  readonly created: boolean;
}

interface Step {
  readonly node: Node | null;
  readonly key: Node | null;
  readonly created: boolean;
}

/** One step down from `cur` along `seg`, or undefined when there is no such child. */
function stepInto(doc: Document, cur: Node, seg: string | number): Step | undefined {
  const here = isAlias(cur) ? (cur.resolve(doc) ?? null) : cur;
  if (isMap(here)) {
    const pair = here.items.find((p) => keyMatches(p.key, seg));
    if (pair === undefined) return undefined;
    const key = isScalar(pair.key) ? pair.key : null;
    const value = (pair.value ?? null) as Node | null;
    return { node: value, key, created: startOf(key) === undefined };
  }
  if (isSeq(here) && /^[0-9]+$/.test(String(seg))) {
    const item = here.items[Number(seg)] as Node | undefined;
    if (item === undefined) return undefined;
    return { node: item, key: null, created: startOf(item) === undefined };
  }
  return undefined;
}

/** Walks `path` in the document as far as it exists with source positions. */
export function locatePath(source: YamlSource, path: KeyPath): Located {
  let node = (source.doc.contents ?? null) as Node | null;
  let key: Node | null = null;
  let depth = 0;
  for (const seg of path) {
    if (node === null) break;
    const step = stepInto(source.doc, node, seg);
    if (step === undefined) break;
    if (step.created) return { depth, node, key, created: true };
    node = step.node;
    key = step.key;
    depth++;
  }
  return { depth, node, key, created: false };
}

/**
 * 1-based position of the node at `path`: the value node, or with `preferKey` the key node (use
 * for unknown keys). An empty value (`key:`) points at its key. When the path does not exist,
 * falls back to the deepest existing ancestor (its key, else its value). Null for an empty file.
 */
export function positionOf(
  source: YamlSource,
  path: KeyPath,
  preferKey = false,
): { line: number; column: number } | null {
  const at = locatePath(source, path);
  const complete = at.depth === path.length && !at.created;
  const useKey = at.key !== null && (!complete || preferKey || visibleStartOf(at.node) === undefined);
  const offset = useKey ? startOf(at.key) : (visibleStartOf(at.node) ?? startOf(at.node));
  if (offset === undefined) return null;
  const { line, col } = source.lines.linePos(offset);
  return { line, column: col };
}

/** Dotted path of the deepest map key whose node starts at `offset` (for duplicate keys). */
function pathOfKeyAt(doc: Document, node: unknown, offset: number, prefix: string[]): string | undefined {
  if (!isMap(node) && !isSeq(node)) return undefined;
  for (const [i, item] of node.items.entries()) {
    if (isMap(node)) {
      const pair = item as { key: unknown; value: unknown };
      const name = isScalar(pair.key) ? String(pair.key.value) : '?';
      if (isScalar(pair.key) && startOf(pair.key) === offset) return dottedPath([...prefix, name]);
      const inner = pathOfKeyAt(doc, pair.value, offset, [...prefix, name]);
      if (inner !== undefined) return inner;
    } else {
      const inner = pathOfKeyAt(doc, item, offset, [...prefix, String(i)]);
      if (inner !== undefined) return inner;
    }
  }
  return undefined;
}

function messageOf(e: YAMLError): string {
  if (e.code === 'DUPLICATE_KEY') return 'duplicate key: a key may appear only once in a map';
  if (e.code === 'MULTIPLE_DOCS') return 'the file holds more than one YAML document; use exactly one';
  return e.message.replace(/\s+/g, ' ').trim();
}

function syntaxProblem(file: string, e: YAMLError, source: Omit<YamlSource, 'file' | 'text'>): Problem {
  const { line, col } = source.lines.linePos(e.pos[0]);
  const path = e.code === 'DUPLICATE_KEY' ? pathOfKeyAt(source.doc, source.doc.contents, e.pos[0], []) : undefined;
  return { code: 'syntax', file, line, column: col, path: path ?? '', message: messageOf(e) };
}

/** Parses YAML text with positions (unique keys enforced). Never throws for bad input. */
export function parseYamlSource(file: string, text: string): SourceResult {
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, uniqueKeys: true, prettyErrors: false });
  const errors = [...doc.errors, ...doc.warnings];
  if (errors.length > 0) {
    return { ok: false, problems: errors.map((e) => syntaxProblem(file, e, { doc, lines })) };
  }
  return { ok: true, source: { file, text, doc, lines } };
}

/** Reads `file` as UTF-8 and parses it; a missing or unreadable file becomes one Problem. */
export function readYamlSource(file: string): SourceResult {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code ?? 'unknown error';
    const missing = code === 'ENOENT' || code === 'ENOTDIR';
    const problem: Problem = missing
      ? { code: 'file-not-found', file, line: null, column: null, path: '', message: 'file not found' }
      : { code: 'unreadable', file, line: null, column: null, path: '', message: `cannot read the file (${code})` };
    return { ok: false, problems: [problem] };
  }
  return parseYamlSource(file, text);
}
