/**
 * Editor JSON Schema (draft 2020-12) of a configuration schema, describing what users write
 * (`io: 'input'`): durations are strings with a pattern, defaults and descriptions are kept.
 */
import { z } from 'zod';
import { formatDuration } from './duration.js';
import { unwrapChain } from './schema-walk.js';
import { isDurationSchema } from './duration.js';

const DRAFT_2020_12 = 'https://json-schema.org/draft/2020-12/schema';

/** zod drops `.default(ms)` of a duration in input mode (its type is the output); restore it as text. */
function durationDefault(ctx: { zodSchema: z.core.$ZodType; jsonSchema: Record<string, unknown> }): void {
  const def = ctx.zodSchema._zod.def;
  if (def.type !== 'default') return;
  const value = (def as z.core.$ZodDefaultDef).defaultValue;
  if (typeof value !== 'number' || !unwrapChain(ctx.zodSchema).some(isDurationSchema)) return;
  ctx.jsonSchema['default'] = formatDuration(value);
}

/**
 * `z.toJSONSchema(schema, { io: 'input' })` plus `$schema`, `$id` (when given) and `title`.
 * Parts with no JSON Schema form (custom types, transforms without an input side) become `{}`.
 */
export function toEditorSchema(schema: z.ZodType, meta: { title: string; id?: string }): Record<string, unknown> {
  const body = z.toJSONSchema(schema, {
    io: 'input',
    target: 'draft-2020-12',
    unrepresentable: 'any',
    override: (ctx) => durationDefault(ctx as { zodSchema: z.core.$ZodType; jsonSchema: Record<string, unknown> }),
  }) as Record<string, unknown>;
  const { $schema: _ignored, ...rest } = body;
  return {
    $schema: DRAFT_2020_12,
    ...(meta.id !== undefined ? { $id: meta.id } : {}),
    title: meta.title,
    ...rest,
  };
}
