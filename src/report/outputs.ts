/**
 * Writing the files of a finished run (or merge): summary.json, replications.csv, points.csv,
 * report.html and, for experiments with a sweep, plots/. Every file is written atomically.
 */
import { join } from 'node:path';
import type { ExperimentResult } from '../experiment/run.js';
import { replicationsCsv } from './csv.js';
import { writeFileAtomic } from './files.js';
import { pointsCsv } from './points-csv.js';
import { summaryDocument } from './summary.js';
import { writePlotsAndReport, type FullSummaryDoc } from './report-page.js';

export interface WrittenFiles {
  readonly files: readonly string[];
}

export function writeRunOutputs(outDir: string, result: ExperimentResult, renderedConfig: unknown): WrittenFiles {
  const files: string[] = [];
  const write = (name: string, text: string): void => {
    writeFileAtomic(join(outDir, name), text);
    files.push(name);
  };
  const doc = summaryDocument(result, renderedConfig);
  const json = `${JSON.stringify(doc, null, 2)}\n`;
  write('summary.json', json);
  write('replications.csv', replicationsCsv(result.points.flatMap((p) => p.records)));
  write('points.csv', pointsCsv(result));
  // The figures are drawn from the document as saved (as `jostle plot` does).
  files.push(...writePlotsAndReport(outDir, JSON.parse(json) as FullSummaryDoc));
  return { files };
}
