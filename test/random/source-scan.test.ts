// Scans every file under src/ (rule: all randomness comes from named, seeded streams).
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const SRC = fileURLToPath(new URL('../../src', import.meta.url));
/** Math.random as a property access, with or without spaces or brackets. */
const USE = /Math\s*(\.\s*random\b|\[\s*['"`]random['"`]\s*\])/;

function filesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? filesUnder(join(dir, e.name)) : e.isFile() ? [join(dir, e.name)] : [],
  );
}

/** Source text without block and line comments (comments may explain the rule itself). */
function code(text: string): string {
  return text.replace(/\/\*[\s\S]*?\*\//g, ' ').replace(/(^|[^:'"`])\/\/.*$/gm, '$1');
}

describe('source scan', () => {
  it('the pattern and comment stripping behave as intended', () => {
    expect(USE.test(code('const u = Math.random();'))).toBe(true);
    expect(USE.test(code("const f = Math['random'];"))).toBe(true);
    expect(USE.test(code('/** never Math.random */ const u = s.next(); // not Math.random'))).toBe(false);
  });

  it('no file under src/ uses Math.random outside comments', () => {
    const files = filesUnder(SRC);
    expect(files.length).toBeGreaterThan(0);
    const offenders = files.filter((f) => USE.test(code(readFileSync(f, 'utf8'))));
    expect(offenders).toEqual([]);
  });
});
