/**
 * Renders a resolved config back to its YAML input form: durations become text with units again
 * (`5ms`, `10s`), everything else is kept. `jostle validate` prints this, summary.json echoes it, and it
 * validates to the same config.
 */
import type { z } from 'zod';
import { formatDuration, isDurationSchema } from './duration.js';
import { formatLength, isLengthSchema } from './length.js';

type Def = { type: string; [key: string]: unknown };

const defOf = (schema: z.core.$ZodType): Def => schema._zod.def as unknown as Def;

/** Unwraps optional / default / prefault / nullable / readonly / refinement-free wrappers. */
function unwrap(schema: z.core.$ZodType): z.core.$ZodType {
  let s = schema;
  for (;;) {
    const def = defOf(s);
    if (['optional', 'default', 'prefault', 'nullable', 'readonly', 'nonoptional', 'catch'].includes(def.type)) {
      s = def['innerType'] as z.core.$ZodType;
      continue;
    }
    return s;
  }
}

function literalValues(schema: z.core.$ZodType): unknown[] {
  const def = defOf(unwrap(schema));
  return def.type === 'literal' ? (def['values'] as unknown[]) : [];
}

function pickUnionOption(options: readonly z.core.$ZodType[], value: unknown, discriminator: string | undefined): z.core.$ZodType | undefined {
  if (discriminator === undefined || typeof value !== 'object' || value === null) return undefined;
  const tag = (value as Record<string, unknown>)[discriminator];
  return options.find((o) => {
    const def = defOf(unwrap(o));
    if (def.type !== 'object') return false;
    const field = (def['shape'] as Record<string, z.core.$ZodType>)[discriminator];
    return field !== undefined && literalValues(field).includes(tag);
  });
}

export function renderForYaml(schema: z.core.$ZodType, value: unknown): unknown {
  if (value === undefined || value === null) return value;
  if (typeof value === 'number') {
    if (isDurationSchema(schema)) return formatDuration(value);
    if (isLengthSchema(schema)) return formatLength(value);
  }
  const s = unwrap(schema);
  if (typeof value === 'number') {
    if (isDurationSchema(s)) return formatDuration(value);
    if (isLengthSchema(s)) return formatLength(value);
  }
  const def = defOf(s);
  switch (def.type) {
    case 'object': {
      const shape = def['shape'] as Record<string, z.core.$ZodType>;
      const out: Record<string, unknown> = {};
      for (const [key, v] of Object.entries(value as Record<string, unknown>)) {
        const field = shape[key];
        out[key] = field === undefined ? v : renderForYaml(field, v);
      }
      return out;
    }
    case 'record': {
      const valueType = def['valueType'] as z.core.$ZodType;
      const out: Record<string, unknown> = {};
      for (const [key, v] of Object.entries(value as Record<string, unknown>)) out[key] = renderForYaml(valueType, v);
      return out;
    }
    case 'array': {
      const element = def['element'] as z.core.$ZodType;
      return (value as unknown[]).map((v) => renderForYaml(element, v));
    }
    case 'union': {
      const option = pickUnionOption(def['options'] as z.core.$ZodType[], value, def['discriminator'] as string | undefined);
      return option === undefined ? value : renderForYaml(option, value);
    }
    case 'pipe':
      return renderForYaml(def['in'] as z.core.$ZodType, value);
    default:
      return value;
  }
}
