// Rendering conventions (`file:line:column: path: message`, then found/expected/hint lines and a
// caret under the column) are common practice for compiler-style diagnostics. Tests check the
// structure, not the wording. Columns are exact, counted in the test text.
import { describe, expect, it } from 'vitest';
import { ConfigError, formatProblems, sortProblems, type Problem } from '../../src/config/problems.js';

const P1: Problem = { code: 'unknown-key', file: 'exp.yaml', line: 2, column: 5, path: 'groups.cuont', message: 'm1', found: 'f', expected: 'e', suggestion: 's' };
const P2: Problem = { code: 'file-not-found', file: 'x.yaml', line: null, column: null, path: '', message: 'm2' };
const P3: Problem = { code: 'syntax', file: 'exp.yaml', line: 1, column: 3, path: '', message: 'm3' };

describe('formatProblems', () => {
  const text = 'groups:\n    cuont: 3\n';
  const out = formatProblems([P1, P2], new Map([['exp.yaml', text]]));
  const lines = out.split('\n');

  it('starts each block with file:line:column: path', () => {
    expect(lines[0]?.startsWith('exp.yaml:2:5: groups.cuont: ')).toBe(true);
    expect(out).toContain('\nx.yaml: m2');
  });

  it('prints found, expected and the suggestion on their own lines', () => {
    expect(lines.slice(1, 4).map((l) => l.trim().split(':')[0])).toEqual(['found', 'expected', 'hint']);
  });

  it('shows the source line with a caret under the column', () => {
    const srcLine = lines.find((l) => l.includes('cuont: 3')) ?? '';
    const caretLine = lines[lines.indexOf(srcLine) + 1] ?? '';
    const textStart = srcLine.indexOf('    cuont');
    expect(caretLine.indexOf('^') - textStart).toBe(4); // column 5 → 4 characters into the line
  });

  it('omits the excerpt without sources and prints nothing for no problems', () => {
    expect(formatProblems([P1])).not.toContain('^');
    expect(formatProblems([])).toBe('');
  });
});

describe('sortProblems and ConfigError', () => {
  it('sorts by line then column, problems without position last', () => {
    expect(sortProblems([P2, P1, P3])).toEqual([P3, P1, P2]);
  });

  it('keeps every problem in the error', () => {
    const e = new ConfigError([P1, P2]);
    expect(e).toBeInstanceOf(Error);
    expect(e.problems).toEqual([P1, P2]);
    expect(e.message).toContain('exp.yaml:2:5');
  });
});
