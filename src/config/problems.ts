/**
 * Configuration problems as positioned data, and their human rendering.
 *
 * Every stage of configuration loading (reading, YAML parsing, `--set` overrides, schema
 * validation) reports what went wrong as a list of {@link Problem}s instead of throwing, so the
 * user sees every problem of a file in one pass. Tests check `code`, `line`, `column` and `path`;
 * the `message` wording is for humans.
 */

/** What kind of problem this is; stable, meant for tests and tools. */
export type ProblemCode =
  | 'syntax'
  | 'unknown-key'
  | 'invalid-type'
  | 'invalid-value'
  | 'missing-key'
  | 'bad-unit'
  | 'bad-override'
  | 'file-not-found'
  | 'unreadable';

/** One thing wrong with a configuration, with where it is and what would be valid. */
export interface Problem {
  readonly code: ProblemCode;
  /** The file as given by the user; `"--set"` for problems that come from a command-line override. */
  readonly file: string;
  /** 1-based line, or null when there is no position (missing file, `--set`). */
  readonly line: number | null;
  /** 1-based column, or null when there is no position. */
  readonly column: number | null;
  /** Dotted key path, e.g. `groups.meters.count`; list indices are segments too (`points.2`); `""` is the whole document. */
  readonly path: string;
  /** One sentence: what is wrong. */
  readonly message: string;
  /** Short rendering of the offending value (for `--set` problems: the override item as typed). */
  readonly found?: string;
  /** What would be valid. */
  readonly expected?: string;
  /** A hint such as "did you mean `preambles`?". */
  readonly suggestion?: string;
}

/** Thrown (or returned) when a configuration cannot be used; carries every problem found. */
export class ConfigError extends Error {
  readonly problems: readonly Problem[];
  /** File texts by name, for caret excerpts when the problems are printed. */
  readonly sources: ReadonlyMap<string, string>;

  constructor(problems: readonly Problem[], sources: ReadonlyMap<string, string> = new Map()) {
    const first = problems[0];
    const head = first === undefined ? 'invalid configuration' : headerOf(first);
    const more = problems.length > 1 ? ` (and ${problems.length - 1} more)` : '';
    super(`${head}${more}`);
    this.name = 'ConfigError';
    this.problems = problems;
    this.sources = sources;
  }
}

/** Orders problems by file position: line, then column; problems without a line come last, in their original order. */
function compareProblems(a: Problem, b: Problem): number {
  const la = a.line ?? Number.POSITIVE_INFINITY;
  const lb = b.line ?? Number.POSITIVE_INFINITY;
  if (la !== lb) return la < lb ? -1 : 1;
  const ca = a.column ?? 0;
  const cb = b.column ?? 0;
  return ca - cb;
}

/** Stable sort by {@link compareProblems}; returns a new array. */
export function sortProblems(problems: readonly Problem[]): Problem[] {
  return problems
    .map((p, i) => ({ p, i }))
    .sort((x, y) => compareProblems(x.p, y.p) || x.i - y.i)
    .map((x) => x.p);
}

function locationOf(p: Problem): string {
  if (p.line === null) return p.file;
  return p.column === null ? `${p.file}:${p.line}` : `${p.file}:${p.line}:${p.column}`;
}

function headerOf(p: Problem): string {
  const where = locationOf(p);
  return p.path === '' ? `${where}: ${p.message}` : `${where}: ${p.path}: ${p.message}`;
}

/** The source line with a caret under the column, indented, or [] when the text is not available. */
function excerpt(p: Problem, sources: ReadonlyMap<string, string> | undefined): string[] {
  if (p.line === null || sources === undefined) return [];
  const text = sources.get(p.file);
  if (text === undefined) return [];
  const lineText = text.split(/\r?\n/)[p.line - 1];
  if (lineText === undefined) return [];
  const gutter = String(p.line);
  const pad = ' '.repeat(gutter.length);
  const lead = lineText.slice(0, Math.max(0, (p.column ?? 1) - 1)).replace(/[^\t]/g, ' ');
  return [`  ${gutter} | ${lineText}`, `  ${pad} | ${lead}^`];
}

/**
 * Human rendering: one block per problem, blocks separated by a blank line.
 *
 * ```
 * exp.yaml:7:5: groups.meters.cuont: unknown key `cuont`
 *   found: cuont
 *   expected: one of `count`, `arrivals`
 *   hint: did you mean `count`?
 *   7 |     cuont: 20
 *     |     ^
 * ```
 * The first line is `file:line:column: path: message` (path omitted for the whole document,
 * line/column omitted when unknown). `sources` maps file names to their text for the caret excerpt.
 */
export function formatProblems(
  problems: readonly Problem[],
  sources?: ReadonlyMap<string, string>,
): string {
  const blocks = problems.map((p) => {
    const lines = [headerOf(p)];
    if (p.found !== undefined) lines.push(`  found: ${p.found}`);
    if (p.expected !== undefined) lines.push(`  expected: ${p.expected}`);
    if (p.suggestion !== undefined) lines.push(`  hint: ${p.suggestion}`);
    lines.push(...excerpt(p, sources));
    return lines.join('\n');
  });
  const count = problems.length === 1 ? '1 problem' : `${problems.length} problems`;
  return problems.length === 0 ? '' : `${blocks.join('\n\n')}\n\n${count} found.\n`;
}
