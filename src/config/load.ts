/**
 * Loading an experiment: read the YAML file, apply `--set` overrides, validate against the schema.
 * Returns the typed config or every problem found; never throws for bad input.
 */
import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { checkDataFiles } from './data-files.js';
import { expandSweep, type PointSpec } from './sweep.js';
import { applyOverrides } from './overrides.js';
import { applyVary } from './vary.js';
import type { Problem } from './problems.js';
import { DEFAULT_REPLICATIONS, experimentSchema, type ExperimentConfig } from './schema.js';
import { validateSource } from './validate.js';
import { parseYamlSource, readYamlSource, type YamlSource } from './yaml-source.js';
import { deepFreeze } from './deep-freeze.js';
import { renderForYaml } from './render.js';

/** A loaded experiment: the base config, its points (one without a sweep), and the folder data files are relative to. */
export interface LoadedExperiment {
  readonly config: ExperimentConfig;
  readonly points: readonly PointSpec[];
  readonly source: YamlSource;
  readonly baseDir: string;
}

export type LoadResult =
  | ({ readonly ok: true } & LoadedExperiment)
  | { readonly ok: false; readonly problems: readonly Problem[]; readonly sources: ReadonlyMap<string, string> };

/** Terminal changes to an experiment: `--set` items, `--vary` axes and `--combine`. */
export interface TerminalEdits {
  readonly sets?: readonly string[];
  readonly vary?: readonly string[];
  readonly combine?: 'grid' | 'zip';
}

function finish(parsed: { ok: true; source: YamlSource } | { ok: false; problems: Problem[] }, edits: TerminalEdits, baseDir: string): LoadResult {
  if (!parsed.ok) return { ok: false, problems: parsed.problems, sources: new Map() };
  const sources = new Map([[parsed.source.file, parsed.source.text]]);
  // A malformed --set or --vary item is reported, and the rest is still checked without it, so that
  // one typo on the command line does not hide the file's own problems.
  const early: Problem[] = [];
  const withoutBad = (items: readonly string[], problems: readonly Problem[]): string[] => {
    early.push(...problems);
    const failed = new Set(problems.map((p) => p.found));
    return items.filter((item) => !failed.has(item));
  };
  let overridden = applyOverrides(parsed.source, edits.sets ?? []);
  if (!overridden.ok) overridden = applyOverrides(parsed.source, withoutBad(edits.sets ?? [], overridden.problems));
  if (!overridden.ok) return { ok: false, problems: early, sources };
  let varied = applyVary(overridden.source, edits.vary ?? [], edits.combine);
  if (!varied.ok) varied = applyVary(overridden.source, withoutBad(edits.vary ?? [], varied.problems), edits.combine);
  if (!varied.ok) return { ok: false, problems: early, sources };
  const origins = new Map([...overridden.overridden, ...varied.edits]);
  const validated = validateSource(varied.source, experimentSchema, origins);
  if (!validated.ok) return { ok: false, problems: [...validated.problems, ...early], sources };
  const config = deepFreeze(validated.value);
  const expanded = expandSweep(varied.source, config, origins);
  if (!expanded.ok) return { ok: false, problems: [...expanded.problems, ...early], sources };
  if (early.length > 0) return { ok: false, problems: early, sources };
  const fileProblems = checkDataFiles([config, ...expanded.points.map((p) => p.config)], baseDir);
  if (fileProblems.length > 0) return { ok: false, problems: fileProblems, sources };
  const points = expanded.points.map((p) => ({ ...p, config: deepFreeze(p.config) }));
  return { ok: true, config, points, source: varied.source, baseDir };
}

export function loadExperimentFile(file: string, edits: readonly string[] | TerminalEdits = []): LoadResult {
  const terminal: TerminalEdits = Array.isArray(edits) ? { sets: edits as readonly string[] } : (edits as TerminalEdits);
  const result = finish(readYamlSource(file), terminal, dirname(resolve(file)));
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

/** Loads YAML text; data files are relative to `baseDir` (default: the working folder). */
export function loadExperimentText(file: string, text: string, sets: readonly string[] = [], baseDir = process.cwd(), edits: Omit<TerminalEdits, 'sets'> = {}): LoadResult {
  return finish(parseYamlSource(file, text), { ...edits, sets }, baseDir);
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
