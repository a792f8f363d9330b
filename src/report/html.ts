/**
 * A self-contained HTML5 report: one file with inline CSS and inline SVG figures, no scripts and no
 * external requests, readable on screen and in print. Output is deterministic (no timestamps).
 * The markup is also well-formed XML (void elements are self-closed), which the tests check.
 */
import { escapeXml } from './svg/xml.js';

export interface ReportFigure {
  title: string;
  /** An <svg> element from the chart writers, inserted as is. */
  svg: string;
}

export interface ReportSection {
  heading: string;
  /** Trusted markup inserted as is: build it with `escapeHtml` and `tableHtml`. */
  html?: string;
  figures?: ReportFigure[];
  /** Preformatted text (a terminal table, a configuration), escaped. */
  pre?: string;
}

export interface ReportSpec {
  title: string;
  subtitle?: string;
  sections: ReportSection[];
}

/** Escapes text for HTML content and quoted attributes (& < > " '); drops characters HTML forbids. */
export function escapeHtml(text: string): string {
  return escapeXml(text);
}

/** A number, optionally "± half-width" or "%", or the dash that stands for no value. */
const NUMERIC = /^(?:[-−+]?(?:\d[\d,]*(?:\.\d+)?|\.\d+)(?:e[-+−]?\d+)?[kMG]?(?:\s*±\s*(?:\d[\d,]*(?:\.\d+)?|\.\d+)(?:e[-+−]?\d+)?[kMG]?)?\s*%?|—)$/i;

function isNumeric(cell: string): boolean {
  return NUMERIC.test(cell.trim());
}

/**
 * A table with escaped cells: header cells are column headers (scope="col"); columns whose cells
 * are all numbers are right-aligned with tabular digits. Missing cells of short rows are left empty.
 */
export function tableHtml(header: string[], rows: string[][], caption?: string): string {
  const width = Math.max(header.length, ...rows.map((r) => r.length));
  const numeric = Array.from({ length: width }, (_, c) => rows.length > 0 && rows.every((r) => isNumeric(r[c] ?? '—')));
  const cls = (c: number): string => (numeric[c] === true ? ' class="num"' : '');
  const head = header.map((h, c) => `<th scope="col"${cls(c)}>${escapeHtml(h)}</th>`).join('');
  const body = rows
    .map((r) => `<tr>${Array.from({ length: width }, (_, c) => `<td${cls(c)}>${escapeHtml(r[c] ?? '')}</td>`).join('')}</tr>`)
    .join('\n');
  const cap = caption === undefined ? '' : `<caption>${escapeHtml(caption)}</caption>`;
  return `<div class="table-wrap"><table>${cap}<thead><tr>${head}</tr></thead>\n<tbody>\n${body}\n</tbody></table></div>`;
}

const CSS = `
:root { color-scheme: light; }
body { font-family: system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif;
  color: #222; background: #fff; line-height: 1.5; max-width: 62rem; margin: 2rem auto; padding: 0 1rem; }
h1 { font-size: 1.6rem; margin: 0 0 0.25rem; }
.subtitle { color: #555; margin: 0 0 1rem; }
h2 { font-size: 1.25rem; margin: 2.2rem 0 0.8rem; padding-bottom: 0.2rem; border-bottom: 1px solid #ddd; }
nav ol { margin: 0.5rem 0 1.5rem; padding-left: 1.5rem; }
a { color: #0b5cad; }
figure { margin: 1.5rem 0; }
figure svg { display: block; max-width: 100%; height: auto; }
figcaption { font-size: 0.9rem; color: #444; margin-top: 0.4rem; }
.table-wrap { overflow-x: auto; margin: 1rem 0; }
table { border-collapse: collapse; font-size: 0.9rem; }
caption { text-align: left; font-weight: 600; padding-bottom: 0.3rem; }
th, td { padding: 0.25rem 0.6rem; border-bottom: 1px solid #e2e2e2; text-align: left; vertical-align: top; }
thead th { border-bottom: 2px solid #999; }
th.num, td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
pre { background: #f6f6f6; border: 1px solid #e6e6e6; padding: 0.75rem; overflow-x: auto; font-size: 0.85rem; }
@media print {
  body { max-width: none; margin: 0; padding: 0; font-size: 10.5pt; }
  nav { display: none; }
  a { color: inherit; text-decoration: none; }
  h2 { break-after: avoid; }
  figure, table, pre { break-inside: avoid; }
  pre { white-space: pre-wrap; }
}
`;

function sectionHtml(section: ReportSection, index: number, figureNumber: { next: number }): string {
  let out = `<section id="section-${index + 1}">\n<h2>${escapeHtml(section.heading)}</h2>\n`;
  if (section.html !== undefined) out += `${section.html}\n`;
  for (const figure of section.figures ?? []) {
    const n = figureNumber.next++;
    out += `<figure>\n${figure.svg}\n<figcaption>Figure ${n}. ${escapeHtml(figure.title)}</figcaption>\n</figure>\n`;
  }
  if (section.pre !== undefined) out += `<pre>${escapeHtml(section.pre)}</pre>\n`;
  return `${out}</section>\n`;
}

/** Contents list linking to the sections (only with two sections or more). */
function contents(sections: ReportSection[]): string {
  if (sections.length < 2) return '';
  const items = sections.map((s, i) => `<li><a href="#section-${i + 1}">${escapeHtml(s.heading)}</a></li>`).join('\n');
  return `<nav aria-label="Contents">\n<ol>\n${items}\n</ol>\n</nav>\n`;
}

/**
 * The report page. Text fields are escaped; `html` and figure `svg` are inserted as is and must come
 * from `tableHtml`, `escapeHtml` and the chart writers (which escape everything they write).
 */
export function reportHtml(spec: ReportSpec): string {
  const figureNumber = { next: 1 };
  const subtitle = spec.subtitle === undefined ? '' : `<p class="subtitle">${escapeHtml(spec.subtitle)}</p>\n`;
  return (
    '<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8" />\n' +
    '<meta name="viewport" content="width=device-width, initial-scale=1" />\n' +
    `<title>${escapeHtml(spec.title)}</title>\n<style>${CSS}</style>\n</head>\n<body>\n` +
    `<header>\n<h1>${escapeHtml(spec.title)}</h1>\n${subtitle}</header>\n` +
    contents(spec.sections) +
    `<main>\n${spec.sections.map((s, i) => sectionHtml(s, i, figureNumber)).join('')}</main>\n</body>\n</html>\n`
  );
}
