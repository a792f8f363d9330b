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

/**
 * The contents of every data file the configs name, in a fixed order (for the run fingerprint: a
 * file changed between an interrupted run and its resumption, or between shards, changes the run).
 */
export function dataFileContents(configs: readonly ExperimentConfig[], baseDir: string): string[] {
  const paths = new Set<string>();
  for (const config of configs) {
    for (const g of Object.values(config.groups)) {
      if (g.layout.model === 'csv') paths.add(resolveDataFile(baseDir, g.layout.file));
      if (g.traffic.model === 'trace') paths.add(resolveDataFile(baseDir, g.traffic.file));
    }
  }
  return [...paths].sort().flatMap((path) => {
    try {
      return [readFileSync(path, 'utf8')];
    } catch {
      return ['(unreadable)'];
    }
  });
}
