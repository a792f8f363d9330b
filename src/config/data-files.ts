/**
 * Data files named in an experiment (layout CSVs, arrival traces) are resolved relative to the
 * experiment file and checked when the experiment is loaded, so that a bad file is reported with its
 * own line numbers before anything runs.
 */
import { isAbsolute, resolve } from 'node:path';
import { readLayoutCsv } from '../geometry/layout-csv.js';
import { readTraceCsv } from '../traffic/trace.js';
import type { Problem } from './problems.js';
import type { ExperimentConfig } from './schema.js';

export function resolveDataFile(baseDir: string, file: string): string {
  return isAbsolute(file) ? file : resolve(baseDir, file);
}

/** Problems of every data file the config names (each file and device count checked once per call). */
export function checkDataFiles(configs: readonly ExperimentConfig[], baseDir: string): Problem[] {
  const seen = new Set<string>();
  const problems: Problem[] = [];
  for (const config of configs) {
    for (const [name, g] of Object.entries(config.groups)) {
      if (g.layout.model === 'csv') {
        const path = resolveDataFile(baseDir, g.layout.file);
        const key = `layout|${path}|${g.count}`;
        if (!seen.has(key)) {
          seen.add(key);
          const read = readLayoutCsv(path, g.count, `groups.${name}.layout.file`);
          if (!read.ok) problems.push(...read.problems);
        }
      }
      if (g.traffic.model === 'trace') {
        const path = resolveDataFile(baseDir, g.traffic.file);
        const key = `trace|${path}|${g.count}`;
        if (!seen.has(key)) {
          seen.add(key);
          const read = readTraceCsv(path, g.count, `groups.${name}.traffic.file`);
          if (!read.ok) problems.push(...read.problems);
        }
      }
    }
  }
  return problems;
}
