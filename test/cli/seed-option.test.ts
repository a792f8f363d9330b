/**
 * `--seed` text → the experiment's seed: a plain whole number is the number, anything else the text as
 * typed (the file format's rule: `seed` is a non-negative integer or a text; common practice: a
 * command-line value means what was typed, not what a YAML reader would make of it).
 */
import { describe, expect, it } from 'vitest';
import { seedValue } from '../../src/cli/seed.js';
import { configFrom } from '../sim/run-yaml.js';

const BASE = 'experiment: s\ngroups:\n  m:\n    count: 10\n    traffic: { model: beta-burst }\n';

describe('--seed', () => {
  it('keeps whole numbers as numbers and everything else as the text typed', () => {
    const seedOf = (typed: string): unknown => configFrom(BASE, [`seed=${seedValue(typed)}`]).seed;
    expect(seedOf('7')).toBe(7);
    expect(seedOf('0')).toBe(0);
    expect(seedOf('007')).toBe('007');
    expect(seedOf('0x10')).toBe('0x10');
    expect(seedOf('1.5')).toBe('1.5');
    expect(seedOf('harbour "2026"')).toBe('harbour "2026"');
    expect(seedOf('99999999999999999999')).toBe('99999999999999999999');
  });
});
