import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { z } from 'zod';
import { duration, formatDuration, parseDuration, DURATION_PATTERN } from '../../src/config/duration.js';

// Unit sizes: BIPM, The International System of Units (SI Brochure, 9th ed., 2019): the second (s)
// is the SI unit of time; ms and µs are the SI prefixes milli (1e-3) and micro (1e-6) (Table 7);
// the minute (1 min = 60 s), hour (1 h = 3600 s) and day (1 d = 86 400 s) are non-SI units accepted
// for use with the SI (Table 8). Table numbers from memory. `us` as an ASCII spelling of µs is common practice.
const SI_EXAMPLES: readonly [string, number][] = [
  ['5ms', 5],
  ['2.5 s', 2500],
  ['10s', 10_000],
  ['15min', 15 * 60_000],
  ['1h', 3_600_000],
  ['1d', 86_400_000],
  ['250us', 0.25],
  ['250µs', 0.25], // U+00B5 micro sign
  ['250μs', 0.25], // U+03BC Greek mu
  ['1.5min', 90_000],
  ['0.001s', 1],
  ['0', 0],
  ['0ms', 0],
  ['  7 ms  ', 7],
];

describe('parseDuration', () => {
  it.each(SI_EXAMPLES)('parses %j as %d ms (SI, see header)', (text, ms) => {
    expect(parseDuration(text)).toEqual({ ok: true, ms });
  });

  it('computes decimal values exactly, with one rounding (exact: 1.1 h = 3 960 000 ms)', () => {
    // A naive 1.1 * 3_600_000 gives 3960000.0000000005 in binary floating point.
    expect(parseDuration('1.1h')).toEqual({ ok: true, ms: 3_960_000 });
    expect(parseDuration('0.3s')).toEqual({ ok: true, ms: 300 });
  });

  it('accepts the number 0 and rejects any other plain number (common practice: a bare number has no unit)', () => {
    expect(parseDuration(0)).toEqual({ ok: true, ms: 0 });
    for (const bad of [10, 0.5, 1e3, '10', '2.5']) {
      const r = parseDuration(bad);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.reason).toMatch(/unit/);
    }
  });

  it.each(['5 parsecs', '5m', '5 sec', '5MS', '-5ms', 'ms', '', '1e3ms', 'five s', '5ms5'])(
    'rejects %j and names the accepted units or the fault (common practice)',
    (text) => {
      const r = parseDuration(text);
      expect(r.ok).toBe(false);
    },
  );

  it('lists the accepted units for an unknown unit', () => {
    const r = parseDuration('5 parsecs');
    expect(r.ok).toBe(false);
    if (!r.ok) for (const unit of ['ms', 's', 'min', 'h', 'd', 'us']) expect(r.reason).toContain(unit);
  });
});

describe('formatDuration', () => {
  // Largest SI-accepted unit giving a value >= 1 that is an exact decimal (SI sizes as above).
  it.each([
    [5, '5ms'],
    [10_000, '10s'],
    [900_000, '15min'],
    [3_600_000, '1h'],
    [86_400_000, '1d'],
    [1500, '1.5s'],
    [90_000, '1.5min'],
    [0.5, '500us'],
    [0.0005, '0.5us'],
    [100, '100ms'],
    [3_700_000, '3700s'], // 61 2/3 min is not a finite decimal in min or h
    [0, '0ms'],
  ])('formats %d ms as %j', (ms, text) => {
    expect(formatDuration(ms)).toBe(text);
  });

  it('round-trips through parseDuration for every finite non-negative double (exact)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, noNaN: true, noDefaultInfinity: true }), (ms) => {
        const back = parseDuration(formatDuration(ms));
        return back.ok && back.ms === ms;
      }),
      { numRuns: 2000 },
    );
  });

  it('round-trips whole numbers of each unit to the unit itself (exact)', () => {
    const units: readonly [string, number][] = [['ms', 1], ['s', 1000], ['min', 60_000], ['h', 3_600_000], ['d', 86_400_000]];
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10_000 }), fc.constantFrom(...units), (n, [unit, size]) => {
        const text = formatDuration(n * size);
        const back = parseDuration(text);
        return back.ok && back.ms === n * size && parseDuration(`${n}${unit}`).ok;
      }),
    );
  });

  it('matches the published pattern for all formatted values (exact)', () => {
    const re = new RegExp(DURATION_PATTERN, 'u');
    fc.assert(fc.property(fc.double({ min: 0, max: 1e12, noNaN: true }), (ms) => re.test(formatDuration(ms))));
  });
});

describe('duration() zod schema', () => {
  const demo = z.strictObject({
    slot: duration({ positive: true }),
    warmup: duration({ min: 0, max: 3_600_000 }).default(0),
  });

  it('outputs milliseconds and fills defaults', () => {
    const out = demo.parse({ slot: '1ms' });
    expect(out).toEqual({ slot: 1, warmup: 0 });
    const inferred: { slot: number; warmup: number } = out; // compile-time check of the output type
    expect(typeof inferred.slot).toBe('number');
  });

  it('rejects zero where positive is required, and values over max (bounds inclusive)', () => {
    expect(demo.safeParse({ slot: 0 }).success).toBe(false);
    expect(demo.safeParse({ slot: '1ms', warmup: '1h' }).success).toBe(true);
    expect(demo.safeParse({ slot: '1ms', warmup: '61min' }).success).toBe(false);
  });

  it('names the accepted units in the issue message for a bad unit', () => {
    const r = demo.safeParse({ slot: '5 parsecs' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toMatch(/ms.*min.*h/);
  });

  it('rejects min > max when the schema is built', () => {
    expect(() => duration({ min: 10, max: 5 })).toThrow(RangeError);
  });
});
