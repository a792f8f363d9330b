/** The `--seed` option of `run` and `cluster`. */

/**
 * `--seed` as YAML text: a plain whole number stays a number (`--seed 7`, as `seed: 7` in the file);
 * anything else is a text seed, quoted so that YAML does not reinterpret it (`007`, `0x10` and `1.5`
 * are the texts as typed, not the numbers 7, 16 and 1.5).
 */
export function seedValue(text: string): string {
  return /^(0|[1-9][0-9]*)$/.test(text) && Number.isSafeInteger(Number(text)) ? text : JSON.stringify(text);
}
