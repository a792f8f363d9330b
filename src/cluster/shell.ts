/**
 * Quoting of text written into generated bash scripts and into `#SBATCH` option lines.
 * Pure functions; nothing here runs a shell.
 */

/** Characters that never need quoting in a bash word. */
const PLAIN_WORD = /^[A-Za-z0-9_./:=@+,-]+$/;

/**
 * Quotes `text` as one bash word. Plain words stay as they are; anything else is put in single
 * quotes, each `'` written as `'\''` (inside single quotes bash expands nothing: no `$`, backticks,
 * `!` or backslashes).
 */
export function shellQuote(text: string): string {
  if (text.includes('\0')) throw new Error('text for a shell script cannot contain a NUL character');
  if (PLAIN_WORD.test(text)) return text;
  return `'${text.replaceAll("'", `'\\''`)}'`;
}

/** Characters that never need quoting in the value of an `#SBATCH` option. */
const PLAIN_SBATCH = /^[A-Za-z0-9_./:=@+,%-]+$/;

/**
 * Quotes the value of an `#SBATCH --option=value` line. sbatch splits these lines at white space,
 * treats an unquoted `#` as the start of a comment, groups text in double quotes and takes a
 * backslash as an escape; so a value with anything else than plain characters is written in double
 * quotes with `"` and `\` escaped. Line breaks cannot be written at all.
 */
export function sbatchQuote(value: string): string {
  if (/[\n\r\0]/.test(value)) throw new Error('an #SBATCH value cannot contain a line break');
  if (PLAIN_SBATCH.test(value)) return value;
  return `"${value.replaceAll(/["\\]/g, (c) => `\\${c}`)}"`;
}
