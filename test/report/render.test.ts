/**
 * report.html renders in a real browser: headless Chromium (Debian's chromium package) loads the page
 * from disk, with the network and scripts out of the picture, and the screenshot shows figures —
 * plenty of non-white pixels in several colours (Okabe–Ito series, bands). Skipped, with a message,
 * where Chromium is not installed (.ci/run installs it). Source: common practice (browser smoke test).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { makeTempDir, removeTempDirs, repoFile, runCli } from '../cli/run-cli.js';
import { inkStats, readPng } from './png.js';

const CHROMIUM = ['/usr/bin/chromium', '/usr/bin/chromium-browser'].find((p) => existsSync(p));
if (CHROMIUM === undefined) console.warn('report rendering test skipped: no Chromium (install Debian\'s `chromium` package to run it)');

afterAll(removeTempDirs);

describe.skipIf(CHROMIUM === undefined)('report.html in headless Chromium', () => {
  it('renders the figures of a sweep (a screenshot with substantial, coloured content)', () => {
    const out = makeTempDir();
    const run = runCli(['run', repoFile('configs/reference/tr37868-model2.yaml'), '--set', 'groups.mtc.count=2000', '--reps', '3', '--vary', 'groups.mtc.count=1000,10000,30000', '--out', out, '--quiet', '--workers', '1'], { timeoutMs: 60_000 });
    expect(run.status).toBe(0);
    const page = join(out, 'report.html');
    const profile = mkdtempSync(join(tmpdir(), 'jostle-chromium-'));
    const shot = join(out, 'report.png');
    const flags = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', `--user-data-dir=${profile}`];
    try {
      const r = spawnSync(CHROMIUM as string, [...flags, `--screenshot=${shot}`, '--window-size=1100,2200', '--hide-scrollbars', pathToFileURL(page).href], { timeout: 60_000, encoding: 'utf8' });
      expect(existsSync(shot), r.stderr).toBe(true);
      const img = readPng(readFileSync(shot));
      expect(img.width).toBe(1100);
      const { ink, colours } = inkStats(img);
      expect(ink).toBeGreaterThan(0.03);
      expect(colours).toBeGreaterThan(20);
      const dom = spawnSync(CHROMIUM as string, [...flags, '--dump-dom', pathToFileURL(page).href], { timeout: 60_000, encoding: 'utf8' });
      const svgCount = (dom.stdout.match(/<svg/g) ?? []).length;
      expect(svgCount).toBeGreaterThanOrEqual(5);
    } finally {
      rmSync(profile, { recursive: true, force: true });
    }
  }, 120_000);
});
