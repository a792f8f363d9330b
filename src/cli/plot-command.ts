/** `jostle plot DIR`: redraw plots/ and report.html from a result folder's summary.json. */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { writePlotsAndReport, type FullSummaryDoc } from '../report/report-page.js';
import { EXIT_FAILED, EXIT_OK, UserFacingError } from './exit.js';

export function plotCommand(dir: string): number {
  const path = join(dir, 'summary.json');
  if (!existsSync(path)) throw new UserFacingError(`${path} not found: name a folder written by jostle run or jostle merge`, EXIT_FAILED);
  let doc: FullSummaryDoc;
  try {
    doc = JSON.parse(readFileSync(path, 'utf8')) as FullSummaryDoc;
  } catch (error) {
    throw new UserFacingError(`${path} is not valid JSON (${error instanceof Error ? error.message : String(error)})`, EXIT_FAILED);
  }
  const files = writePlotsAndReport(dir, doc);
  process.stdout.write(`wrote ${files.map((f) => join(dir, f)).join(', ')}\n`);
  return EXIT_OK;
}
