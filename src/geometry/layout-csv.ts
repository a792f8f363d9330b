/**
 * Reading small numeric CSV files (device layouts here; arrival traces in `traffic/trace.ts` use the
 * same helpers) with every bad line reported as a positioned {@link Problem}.
 *
 * The format is deliberately plain: comma-separated fields, no quoting, a header line naming the
 * columns, one record per line; blank lines are ignored; a UTF-8 byte-order mark is dropped; line
 * ends may be LF or CRLF. Line and column numbers are 1-based. Each bad line gets one problem (its first
 * fault); at most {@link MAX_LINE_PROBLEMS} bad lines are reported one by one, then one problem
 * summarises the rest.
 */
import { readFileSync } from 'node:fs';
import type { Problem } from '../config/problems.js';
import type { Positions } from './positions.js';

/** Bad lines reported individually before the rest are summarised. */
export const MAX_LINE_PROBLEMS = 20;

/** One non-blank line split into trimmed fields, with the 1-based column where each field starts. */
export interface CsvRecord {
  readonly line: number;
  readonly fields: readonly string[];
  readonly columns: readonly number[];
}

/** A plain decimal or exponent number, optionally signed (what `Number()` reads, minus hex, blanks, Infinity). */
const NUMBER_RE = /^[+-]?(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)(?:[eE][+-]?[0-9]+)?$/;

/** The number written in `text`, or undefined when it is not a finite number. */
export function parseCsvNumber(text: string): number | undefined {
  if (!NUMBER_RE.test(text)) return undefined;
  const x = Number(text);
  return Number.isFinite(x) ? x : undefined;
}

/** Collects line problems for one file, capped at {@link MAX_LINE_PROBLEMS} plus a summary. */
export class CsvProblems {
  private readonly list: Problem[] = [];
  private badLines = 0;
  private lastBadLine = -1;

  constructor(
    private readonly file: string,
    private readonly keyPath: string,
  ) {}

  /** A problem on one line; only the first fault of a line is reported (one problem per bad line). */
  atLine(line: number, column: number | null, message: string, found?: string, expected?: string): void {
    if (this.lastBadLine === line) return;
    this.lastBadLine = line;
    this.badLines++;
    if (this.badLines > MAX_LINE_PROBLEMS) return;
    this.add(line, column, message, found, expected);
  }

  /** A problem not counted against the cap (whole-file problems such as a wrong row count). */
  add(line: number | null, column: number | null, message: string, found?: string, expected?: string): void {
    this.list.push({
      code: 'invalid-value',
      file: this.file,
      line,
      column,
      path: this.keyPath,
      message,
      ...(found !== undefined ? { found } : {}),
      ...(expected !== undefined ? { expected } : {}),
    });
  }

  get empty(): boolean {
    return this.list.length === 0;
  }

  /** The problems, with one summary when more than the cap of lines were bad. */
  finish(): Problem[] {
    const hidden = this.badLines - MAX_LINE_PROBLEMS;
    if (hidden > 0) this.add(null, null, `${hidden} more bad line${hidden === 1 ? '' : 's'} not shown (first ${MAX_LINE_PROBLEMS} listed)`);
    return this.list;
  }
}

/** The file's text, or a `file-not-found` / `unreadable` problem. */
export function readCsvText(file: string, keyPath = ''): { ok: true; text: string } | { ok: false; problems: Problem[] } {
  try {
    return { ok: true, text: readFileSync(file, 'utf8') };
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const missing = code === 'ENOENT';
    const reason = e instanceof Error ? e.message : String(e);
    return {
      ok: false,
      problems: [
        {
          code: missing ? 'file-not-found' : 'unreadable',
          file,
          line: null,
          column: null,
          path: keyPath,
          message: missing ? 'file not found' : `cannot read the file (${reason})`,
        },
      ],
    };
  }
}

/** Non-blank lines of `text` split into trimmed fields (no quoting). */
export function csvRecords(text: string): CsvRecord[] {
  const body = text.startsWith('\uFEFF') ? text.slice(1) : text;
  const out: CsvRecord[] = [];
  body.split(/\r\n|\n|\r/).forEach((raw, i) => {
    if (raw.trim() === '') return;
    const fields: string[] = [];
    const columns: number[] = [];
    let at = 0;
    for (const part of raw.split(',')) {
      const lead = part.length - part.trimStart().length;
      fields.push(part.trim());
      columns.push(at + lead + 1);
      at += part.length + 1;
    }
    out.push({ line: i + 1, fields, columns });
  });
  return out;
}

/** Checks that `record` is exactly the header `names`; reports it otherwise. */
export function checkHeader(record: CsvRecord | undefined, names: readonly string[], problems: CsvProblems): void {
  const expected = names.join(',');
  if (record === undefined) {
    problems.add(null, null, `empty file: expected the header \`${expected}\` and one line per record`, undefined, expected);
    return;
  }
  if (record.fields.join(',') !== expected) {
    problems.add(record.line, 1, `the first line must be the header \`${expected}\``, record.fields.join(','), expected);
  }
}

/** Reports a record that does not have exactly `n` fields; true when it has. */
export function checkFieldCount(record: CsvRecord, n: number, problems: CsvProblems): boolean {
  if (record.fields.length === n) return true;
  problems.atLine(record.line, 1, `expected ${n} comma-separated values, found ${record.fields.length}`, record.fields.join(','));
  return false;
}

/** Field `k` of `record` as a finite number, or undefined after reporting it. */
export function numberField(record: CsvRecord, k: number, name: string, problems: CsvProblems): number | undefined {
  const text = record.fields[k] ?? '';
  const x = parseCsvNumber(text);
  if (x === undefined) {
    problems.atLine(record.line, record.columns[k] ?? 1, `\`${name}\` is not a finite number`, text === '' ? '(empty)' : text, 'a finite decimal number, e.g. 12.5');
  }
  return x;
}

const LAYOUT_HEADER = ['x_m', 'y_m'] as const;

/**
 * Reads a layout CSV: header `x_m,y_m`, then exactly `count` lines of finite coordinates in metres (row
 * k = device k of the group). `keyPath` is the config key the problems are reported against.
 */
export function readLayoutCsv(
  path: string,
  count: number,
  keyPath = '',
): { ok: true; positions: Positions } | { ok: false; problems: Problem[] } {
  const read = readCsvText(path, keyPath);
  if (!read.ok) return read;
  const records = csvRecords(read.text);
  const problems = new CsvProblems(path, keyPath);
  checkHeader(records[0], LAYOUT_HEADER, problems);
  const rows = records.slice(1);
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  rows.forEach((r, k) => {
    if (!checkFieldCount(r, 2, problems)) return;
    const px = numberField(r, 0, 'x_m', problems);
    const py = numberField(r, 1, 'y_m', problems);
    if (k < count && px !== undefined && py !== undefined) {
      x[k] = px;
      y[k] = py;
    }
  });
  if (rows.length !== count) {
    const extra = rows[count];
    problems.add(
      extra === undefined ? null : extra.line,
      extra === undefined ? null : 1,
      `found ${rows.length} data line${rows.length === 1 ? '' : 's'}, expected exactly ${count} (one per device of the group)`,
      String(rows.length),
      String(count),
    );
  }
  return problems.empty ? { ok: true, positions: { x, y } } : { ok: false, problems: problems.finish() };
}
