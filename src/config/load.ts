/**
 * Loading an experiment: read the YAML file, apply `--set` overrides, validate against the schema.
 * Returns the typed config or every problem found; never throws for bad input.
 */
import { readFileSync } from 'node:fs';
import { applyOverrides } from './overrides.js';
import type { Problem } from './problems.js';
import { DEFAULT_REPLICATIONS, experimentSchema, type ExperimentConfig } from './schema.js';
import { validateSource } from './validate.js';
import { parseYamlSource, readYamlSource, type YamlSource } from './yaml-source.js';
import { deepFreeze } from './deep-freeze.js';
import { renderForYaml } from './render.js';

export type LoadResult =
  | { readonly ok: true; readonly config: ExperimentConfig; readonly source: YamlSource }
  | { readonly ok: false; readonly problems: readonly Problem[]; readonly sources: ReadonlyMap<string, string> };

function finish(parsed: { ok: true; source: YamlSource } | { ok: false; problems: Problem[] }, sets: readonly string[]): LoadResult {
  if (!parsed.ok) return { ok: false, problems: parsed.problems, sources: new Map() };
  const sources = new Map([[parsed.source.file, parsed.source.text]]);
  const overridden = applyOverrides(parsed.source, sets);
  if (!overridden.ok) return { ok: false, problems: overridden.problems, sources };
  const validated = validateSource(overridden.source, experimentSchema, overridden.overridden);
  if (!validated.ok) return { ok: false, problems: validated.problems, sources };
  return { ok: true, config: deepFreeze(validated.value), source: overridden.source };
}

export function loadExperimentFile(file: string, sets: readonly string[] = []): LoadResult {
  const result = finish(readYamlSource(file), sets);
  if (result.ok || result.sources.size > 0) return result;
  // A syntax error: keep the text for the caret excerpt.
  let text: string | undefined;
  try {
    text = readFileSync(file, 'utf8');
  } catch {
    text = undefined;
  }
  return text === undefined ? result : { ...result, sources: new Map([[file, text]]) };
}

export function loadExperimentText(file: string, text: string, sets: readonly string[] = []): LoadResult {
  return finish(parseYamlSource(file, text), sets);
}

/** The resolved config in its YAML input form (durations with units). */
export function renderConfig(config: ExperimentConfig): Record<string, unknown> {
  const filled = config.replications === undefined && config.stopping === undefined ? { ...config, replications: DEFAULT_REPLICATIONS } : config;
  const rendered = renderForYaml(experimentSchema, filled) as Record<string, unknown>;
  // Keep the key order of the schema (replications after seed).
  const ordered: Record<string, unknown> = {};
  for (const key of Object.keys(experimentSchema.shape)) if (rendered[key] !== undefined) ordered[key] = rendered[key];
  return ordered;
}
