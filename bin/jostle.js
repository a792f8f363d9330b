#!/usr/bin/env node
// The jostle command. The TypeScript sources are compiled to dist/ by `npm ci` (prepare script).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const entry = new URL('../dist/src/cli/main.js', import.meta.url);
if (!existsSync(fileURLToPath(entry))) {
  process.stderr.write('jostle: the compiled code is missing; run `npm ci` (or `npm run build`) in the jostle folder first.\n');
  process.exit(2);
}
await import(entry.href);
