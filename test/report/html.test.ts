import { describe, it, expect } from 'vitest';
import { escapeHtml, reportHtml, tableHtml, type ReportSpec } from '../../src/report/html.js';
import { lineChart, heatMap } from '../../src/report/svg/charts.js';
import { checkXml } from './xml-check.js';

// Escaping: the five characters with predefined entities in XML 1.0 §4.6 (HTML Living Standard
// accepts the same references); &#39; is the numeric reference for the apostrophe.
describe('escapeHtml', () => {
  it('escapes & < > " \' and drops characters XML forbids (XML 1.0 §2.2, §4.6)', () => {
    expect(escapeHtml(`<a href="x">Tom & Jerry's</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;Tom &amp; Jerry&#39;s&lt;/a&gt;');
    expect(escapeHtml('a\u0000b\u0007c\td')).toBe('abc\td');
    expect(escapeHtml('&amp;')).toBe('&amp;amp;');
  });
});

describe('tableHtml', () => {
  it('escapes header, cells and caption; header cells are column headers', () => {
    const html = tableHtml(['point', 'a<b'], [['x & y', '1 ± 2'], ['<script>', '3']], 'T & C');
    expect(checkXml(html)).toEqual([]);
    expect(html).toContain('<caption>T &amp; C</caption>');
    expect(html).toContain('<th scope="col">point</th>');
    expect(html).toContain('>a&lt;b</th>');
    expect(html).toContain('>x &amp; y</td>');
    expect(html).toContain('>&lt;script&gt;</td>');
    expect(html).not.toContain('<script');
  });

  it('right-aligns columns whose cells are all numbers (common practice for numeric tables)', () => {
    const html = tableHtml(['name', 'value'], [['a', '107 ± 20'], ['b', '0.694'], ['c', '—']]);
    expect(html).toContain('<th scope="col" class="num">value</th>');
    expect(html).toContain('<td class="num">0.694</td>');
    expect(html).toContain('<td>a</td>');
  });
});

describe('reportHtml', () => {
  const line = lineChart({ title: 'Success & delay', description: 'd', xLabel: 'devices', yLabel: 'delay (ms)', series: [{ name: 's', points: [{ x: 1, y: 2 }, { x: 2, y: 3 }] }] });
  const heat = heatMap({ title: 'Heat', description: 'd', xLabel: 'x', yLabel: 'y', xValues: ['a'], yValues: ['b'], cells: [[1]], valueLabel: 'v' });
  const report: ReportSpec = {
    title: 'Run <harbour> & co',
    subtitle: 'seed 2026',
    sections: [
      { heading: 'Summary', html: tableHtml(['k'], [['v']]) },
      { heading: 'Figures', figures: [{ title: 'Line <1>', svg: line }, { title: 'Heat', svg: heat }] },
      { heading: 'Configuration', pre: 'a: <b> & "c"' },
    ],
  };

  it('is one well-formed HTML5 page that contains every figure and escapes its text', () => {
    const html = reportHtml(report);
    expect(html.startsWith('<!DOCTYPE html>\n<html lang="en">')).toBe(true);
    expect(checkXml(html.replace('<!DOCTYPE html>', ''))).toEqual([]);
    expect(html).toContain(line);
    expect(html).toContain(heat);
    expect(html).toContain('<title>Run &lt;harbour&gt; &amp; co</title>');
    expect(html).toContain('Figure 1. Line &lt;1&gt;');
    expect(html).toContain('Figure 2. Heat');
    expect(html).toContain('<pre>a: &lt;b&gt; &amp; &quot;c&quot;</pre>');
    expect(html).toContain('<meta charset="utf-8" />');
  });

  it('needs no scripts and makes no external requests: no <script, no URL except the SVG namespace', () => {
    const html = reportHtml(report);
    expect(html.toLowerCase()).not.toContain('<script');
    const urls = html.match(/https?:\/\/[^"'\s)]*/g) ?? [];
    expect(urls.length).toBeGreaterThan(0);
    for (const u of urls) expect(u).toBe('http://www.w3.org/2000/svg');
    expect(html).not.toMatch(/@import|url\(|<link|<img|src=/i);
  });

  it('is deterministic and links each section from the contents list', () => {
    expect(reportHtml(report)).toBe(reportHtml(structuredClone(report)));
    const html = reportHtml(report);
    for (const i of [1, 2, 3]) {
      expect(html).toContain(`<a href="#section-${i}">`);
      expect(html).toContain(`<section id="section-${i}">`);
    }
    expect(reportHtml({ title: 't', sections: [{ heading: 'only' }] })).not.toContain('<nav');
  });
});
