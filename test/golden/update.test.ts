/**
 * Regenerates the golden outputs: `npm run golden:update` (sets GOLDEN_UPDATE=1). Skipped in the
 * normal suite. Run it only when a change is meant to alter results.
 */
import { copyFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { GOLDEN_CASES } from './cases.js';
import { makeTempDir, removeTempDirs, runCli } from '../cli/run-cli.js';

afterAll(removeTempDirs);

describe.runIf(process.env['GOLDEN_UPDATE'] === '1')('update golden outputs', () => {
  for (const c of GOLDEN_CASES) {
    it(c.name, () => {
      const out = makeTempDir();
      const r = runCli(['run', ...c.args, '--out', out, '--quiet', '--workers', '1'], { timeoutMs: 300_000 });
      expect(r.status, r.stderr).toBe(0);
      const dir = join('test', 'golden', c.name);
      mkdirSync(dir, { recursive: true });
      for (const file of ['summary.json', 'replications.csv']) copyFileSync(join(out, file), join(dir, file));
    }, 300_000);
  }
});
