/**
 * Golden outputs: small runs of the shipped configs whose summary.json must stay byte-identical
 * across refactors and optimisations (common practice: regression pins on deterministic output).
 * When a change is *meant* to alter results, regenerate with `npm run golden:update` and say why in
 * the commit message.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { GOLDEN_CASES } from './cases.js';
import { makeTempDir, removeTempDirs, runCli } from '../cli/run-cli.js';
import { afterAll } from 'vitest';

afterAll(removeTempDirs);

describe('golden outputs', () => {
  for (const c of GOLDEN_CASES) {
    it(`${c.name}: summary.json and replications.csv unchanged`, () => {
      const out = makeTempDir();
      const r = runCli(['run', ...c.args, '--out', out, '--quiet', '--workers', '1'], { timeoutMs: 120_000 });
      expect(r.status, r.stderr).toBe(0);
      for (const file of ['summary.json', 'replications.csv']) {
        const expected = readFileSync(join('test', 'golden', c.name, file), 'utf8');
        expect(readFileSync(join(out, file), 'utf8'), `${c.name}/${file}`).toBe(expected);
      }
    }, 120_000);
  }
});
