/**
 * Lengths with units (src/config/length.ts; kept here with the layouts that use them).
 * Unit sizes: BIPM, The International System of Units (SI Brochure, 9th ed., 2019): the metre (m) is
 * the SI unit of length and the prefix kilo (k) means 10³ (table number from memory).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { z } from 'zod';
import { formatLength, isLengthSchema, length, LENGTH_PATTERN, parseLength } from '../../src/config/length.js';
import { duration, isDurationSchema } from '../../src/config/duration.js';

describe('parseLength', () => {
  it.each([
    ['500m', 500],
    ['1.2km', 1200],
    ['1.2 km', 1200],
    ['0.25m', 0.25],
    ['  7 m ', 7],
    ['0', 0],
    ['0km', 0],
    ['0.1km', 100],
  ] as const)('parses %j as %d m (SI, see header)', (text, metres) => {
    expect(parseLength(text)).toEqual({ ok: true, metres });
  });

  it('rejects a bare number other than 0 (common practice: its unit would be a guess)', () => {
    expect(parseLength(0)).toEqual({ ok: true, metres: 0 });
    for (const bad of [10, 0.5, '10', '2.5']) {
      const r = parseLength(bad);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.reason).toMatch(/no unit/);
    }
  });

  it.each([
    ['5 parsecs', /accepted units: m, km/],
    ['5 meters', /did you mean `m`/],
    ['5KM', /did you mean `km`/],
    ['5cm', /accepted units/],
    ['-5m', /negative/],
    ['1e3m', /exponent/],
    ['', /empty/],
    ['m', /not a length/],
  ])('rejects %j with a reason (common practice)', (text, reason) => {
    const r = parseLength(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(reason);
  });
});

describe('formatLength', () => {
  it.each([
    [500, '500m'],
    [1200, '1.2km'],
    [1000, '1km'],
    [0.25, '0.25m'],
    [0, '0m'],
    [1e-7, '0.0000001m'],
  ])('formats %d m as %j', (metres, text) => {
    expect(formatLength(metres)).toBe(text);
  });

  it('round-trips through parseLength for every finite non-negative double (exact)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, noNaN: true, noDefaultInfinity: true }), (m) => {
        const back = parseLength(formatLength(m));
        return back.ok && back.metres === m;
      }),
      { numRuns: 2000 },
    );
  });

  it('matches the published pattern for all formatted values (exact)', () => {
    const re = new RegExp(LENGTH_PATTERN, 'u');
    fc.assert(fc.property(fc.double({ min: 0, max: 1e12, noNaN: true }), (m) => re.test(formatLength(m))));
  });
});

describe('length() zod schema', () => {
  const demo = z.strictObject({
    radius: length({ positive: true }),
    spread: length({ max: 1000 }).prefault('50m'),
  });

  it('outputs metres and fills defaults', () => {
    expect(demo.parse({ radius: '1km' })).toEqual({ radius: 1000, spread: 50 });
  });

  it('rejects zero where positive is required and values over max; bad units carry bad-unit params', () => {
    expect(demo.safeParse({ radius: 0 }).success).toBe(false);
    expect(demo.safeParse({ radius: '1m', spread: '1.5km' }).success).toBe(false);
    const r = demo.safeParse({ radius: '5 furlongs' });
    const issue = r.error?.issues[0];
    expect(issue?.code).toBe('custom');
    expect((issue as { params?: Record<string, unknown> } | undefined)?.params?.['problem']).toBe('bad-unit');
  });

  it('is recognised by isLengthSchema (also through .describe), not by isDurationSchema, and vice versa', () => {
    const l = length();
    expect(isLengthSchema(l)).toBe(true);
    expect(isLengthSchema(l.describe('x'))).toBe(true);
    expect(isDurationSchema(l)).toBe(false);
    expect(isLengthSchema(duration())).toBe(false);
  });

  it('has an input JSON Schema: a string with the pattern, and the default as text', () => {
    const js = z.toJSONSchema(demo, { io: 'input', unrepresentable: 'any' }) as { properties: Record<string, Record<string, unknown>> };
    expect(js.properties['spread']?.['default']).toBe('50m');
    expect(JSON.stringify(js.properties['radius'])).toContain('"pattern"');
  });

  it('rejects min > max when the schema is built', () => {
    expect(() => length({ min: 10, max: 5 })).toThrow(RangeError);
  });
});
