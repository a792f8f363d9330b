/**
 * Data files named in an experiment (layout CSVs, arrival traces) are resolved relative to the
 * experiment file and checked when the experiment is loaded, so that a bad file is reported with its
 * own line numbers before anything runs.
 */
import { readFileSync } from 'node:fs';
import { isAbsolute, resolve } from 'node:path';
import { readLayoutCsv } from '../geometry/layout-csv.js';
import { readTraceCsv } from '../traffic/trace.js';
import type { Problem } from './problems.js';
import type { ExperimentConfig } from './schema.js';

export function resolveDataFile(baseDir: string, file: string): string {
  return isAbsolute(file) ? file : resolve(baseDir, file);
}

/** One data file named by a group: a layout CSV or an arrival trace. */
interface DataFileUse {
  readonly kind: 'layout' | 'trace';
  readonly path: string;
  /** The key path that names it (for problems). */
  readonly key: string;
  readonly count: number;
}

/** Every data file the configs name, one entry per (config, group, kind). */
function dataFileUses(configs: readonly ExperimentConfig[], baseDir: string): DataFileUse[] {
  const uses: DataFileUse[] = [];
  for (const config of configs) {
    for (const [name, g] of Object.entries(config.groups)) {
      if (g.layout.model === 'csv') uses.push({ kind: 'layout', path: resolveDataFile(baseDir, g.layout.file), key: `groups.${name}.layout.file`, count: g.count });
      if (g.traffic.model === 'trace') uses.push({ kind: 'trace', path: resolveDataFile(baseDir, g.traffic.file), key: `groups.${name}.traffic.file`, count: g.count });
    }
  }
  return uses;
}

/** Problems of every data file the config names (each file and device count checked once per call). */
export function checkDataFiles(configs: readonly ExperimentConfig[], baseDir: string): Problem[] {
  const seen = new Set<string>();
  const problems: Problem[] = [];
  for (const use of dataFileUses(configs, baseDir)) {
    const once = `${use.kind}|${use.path}|${use.count}`;
    if (seen.has(once)) continue;
    seen.add(once);
    const read = use.kind === 'layout' ? readLayoutCsv(use.path, use.count, use.key) : readTraceCsv(use.path, use.count, use.key);
    if (!read.ok) problems.push(...read.problems);
  }
  return problems;
}

/**
 * The contents of every data file the configs name, in a fixed order (for the run fingerprint: a
 * file changed between an interrupted run and its resumption, or between shards, changes the run).
 */
export function dataFileContents(configs: readonly ExperimentConfig[], baseDir: string): string[] {
  const paths = [...new Set(dataFileUses(configs, baseDir).map((u) => u.path))].sort();
  return paths.map((path) => {
    try {
      return readFileSync(path, 'utf8');
    } catch {
      return '(unreadable)';
    }
  });
}
