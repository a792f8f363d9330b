/** `jostle plot DIR`: redraw plots/ and report.html from a result folder's summary.json. */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { writePlotsAndReport, type FullSummaryDoc } from '../report/report-page.js';
import { EXIT_OK, EXIT_USAGE, UserFacingError } from './exit.js';

export function plotCommand(dir: string): number {
  const path = join(dir, 'summary.json');
  if (!existsSync(path)) throw new UserFacingError(`${path} not found: name a folder written by jostle run or jostle merge`, EXIT_USAGE);
  let doc: FullSummaryDoc;
  try {
    doc = JSON.parse(readFileSync(path, 'utf8')) as FullSummaryDoc;
  } catch (error) {
    throw new UserFacingError(`${path} is not valid JSON (${error instanceof Error ? error.message : String(error)})`, EXIT_USAGE);
  }
  const d = doc as unknown as Record<string, unknown> | null;
  const looksRight =
    d !== null &&
    typeof d === 'object' &&
    typeof d['experiment'] === 'string' &&
    typeof d['config'] === 'object' &&
    d['config'] !== null &&
    Array.isArray(d['points']) &&
    (d['points'] as unknown[]).every((p) => typeof p === 'object' && p !== null && typeof (p as Record<string, unknown>)['metrics'] === 'object');
  if (!looksRight) throw new UserFacingError(`${path} is not a jostle summary (it needs experiment, config and points with metrics): name a folder written by jostle run or jostle merge`, EXIT_USAGE);
  const files = writePlotsAndReport(dir, doc);
  process.stdout.write(`wrote ${files.map((f) => join(dir, f)).join(', ')}\n`);
  return EXIT_OK;
}
