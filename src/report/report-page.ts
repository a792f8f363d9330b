/**
 * plots/*.svg and report.html from a summary document: the same code draws them at the end of a run
 * and in `jostle plot DIR` from saved results.
 */
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { stringify } from 'yaml';
import { writeFileAtomic } from './files.js';
import { reportHtml, tableHtml } from './html.js';
import { DEFAULT_COMPARE_METRICS } from '../metrics/catalogue.js';
import { intervalText } from './numbers.js';
import { figuresOf, type SummaryDoc } from './plots.js';


export interface FullSummaryDoc extends SummaryDoc {
  readonly tool: { readonly name: string; readonly version: string };
  readonly seed: unknown;
  readonly config: SummaryDoc['config'] & { readonly report?: { readonly compare_metrics?: string[]; readonly plot_metrics?: string[] } };
}

const statText = (s: { mean: number | null; half_width: number | null } | undefined): string => intervalText(s?.mean, s?.half_width);

function resultsTable(doc: FullSummaryDoc): string {
  const metrics = (doc.config.report?.compare_metrics ?? DEFAULT_COMPARE_METRICS).filter((m) => doc.points.some((p) => p.metrics[m] !== undefined));
  const header = ['point', ...metrics];
  const rows = doc.points.map((p) => [p.label, ...metrics.map((m) => statText(p.metrics[m]))]);
  return tableHtml(header, rows, `Cell-level mean ± ${Math.round(doc.confidence_level * 1000) / 10} % half-width over replications.`);
}

/** Writes plots/ (replacing earlier plots) and report.html; returns the file names written. */
export function writePlotsAndReport(outDir: string, doc: FullSummaryDoc): string[] {
  const figures = figuresOf(doc);
  const plotsDir = join(outDir, 'plots');
  rmSync(plotsDir, { recursive: true, force: true });
  const files: string[] = [];
  for (const f of figures) {
    writeFileAtomic(join(plotsDir, f.file), f.svg);
    files.push(join('plots', f.file));
  }
  const metricFigures = figures.filter((f) => !f.file.startsWith('delay-cdf'));
  const cdfFigures = figures.filter((f) => f.file.startsWith('delay-cdf'));
  const html = reportHtml({
    title: `${doc.experiment} — jostle report`,
    subtitle: `${doc.config.description ?? ''} (${doc.tool.name} ${doc.tool.version}, seed ${String(doc.seed)}, ${doc.points.length} point${doc.points.length === 1 ? '' : 's'})`,
    sections: [
      { heading: 'Results', html: resultsTable(doc) },
      ...(metricFigures.length > 0 ? [{ heading: 'Metrics against the swept parameters', figures: metricFigures.map((f) => ({ title: f.title, svg: f.svg })) }] : []),
      ...(cdfFigures.length > 0 ? [{ heading: 'Access-delay distributions', figures: cdfFigures.map((f) => ({ title: f.title, svg: f.svg })) }] : []),
      {
        heading: 'Cautions',
        html: '<p>These figures come from a model, not from measurements. Confirm them against field data and the operator’s own engineering rules before they shape a network.</p>',
      },
      { heading: 'Resolved experiment', pre: stringify(doc.config, { lineWidth: 0 }) },
    ],
  });
  writeFileAtomic(join(outDir, 'report.html'), html);
  files.push('report.html');
  return files;
}
