// JSON Schema draft 2020-12 keywords (json-schema.org/draft/2020-12: `pattern`, `default`,
// `description`, `additionalProperties`, `anyOf`, `const`); the layout is common practice for
// editor schemas. Duration units are SI (see duration.test.ts).
import { describe, expect, it } from 'vitest';
import { toEditorSchema } from '../../src/config/json-schema.js';
import { DURATION_PATTERN, POSITIVE_DURATION_PATTERN, parseDuration } from '../../src/config/duration.js';
import { demoSchema } from './demo-schema.js';

type Json = Record<string, unknown>;
const schema = toEditorSchema(demoSchema, { title: 'Demo experiment', id: 'https://example.org/demo.json' });
const props = schema['properties'] as Record<string, Json>;

describe('toEditorSchema', () => {
  it('carries $schema, $id and title', () => {
    expect(schema['$schema']).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema['$id']).toBe('https://example.org/demo.json');
    expect(schema['title']).toBe('Demo experiment');
    expect(schema['additionalProperties']).toBe(false);
  });

  it('describes a duration as a string with a pattern (or the number 0) and a description', () => {
    const horizon = props['horizon'] as Json;
    // horizon must be positive: a unit is required and a bare 0 is not offered.
    const branches = (horizon['anyOf'] as Json[] | undefined) ?? [horizon];
    expect(branches[0]).toMatchObject({ type: 'string', pattern: POSITIVE_DURATION_PATTERN });
    expect(branches.some((b) => b['const'] === 0)).toBe(false);
    expect(horizon['description']).toMatch(/ms.*min/);
    expect(new RegExp(POSITIVE_DURATION_PATTERN, 'u').test('0')).toBe(false);
    expect(new RegExp(POSITIVE_DURATION_PATTERN, 'u').test('10ms')).toBe(true);
  });

  it('keeps descriptions and defaults, showing a duration default with its unit', () => {
    expect(props['preambles']).toMatchObject({ default: 54, description: 'Preambles per opportunity.', type: 'integer' });
    const slot = props['slot'] as Json;
    expect(slot['default']).toBe('1ms');
    expect(String(slot['description'])).toContain('Slot length.');
    expect(props['backoff']?.['default']).toEqual({ kind: 'uniform', window: '20ms' });
  });

  it('uses a pattern that agrees with parseDuration on examples', () => {
    const re = new RegExp(DURATION_PATTERN, 'u');
    for (const text of ['5ms', '2.5 s', '15min', '1h', '1d', '250µs', '0']) expect([text, re.test(text)]).toEqual([text, parseDuration(text).ok]);
    for (const text of ['5', '5 parsecs', '-1s', '5m', '1e3ms']) expect([text, re.test(text)]).toEqual([text, parseDuration(text).ok]);
  });

  it('lists the discriminated union branches and the required keys', () => {
    expect(schema['required']).toEqual(expect.arrayContaining(['name', 'horizon', 'groups']));
    expect(schema['required']).not.toContain('preambles');
    const backoff = props['backoff'] as Json;
    expect((backoff['oneOf'] ?? backoff['anyOf']) as unknown[]).toHaveLength(2);
  });
});
