#!/usr/bin/env node
// The jostle command. `npm ci` (prepare script) compiles the TypeScript sources to dist/ and
// bundles the command into dist/bundle/ (one file to load instead of a hundred: faster start-up).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const entry = new URL('../dist/bundle/main.mjs', import.meta.url);
if (!existsSync(fileURLToPath(entry))) {
  process.stderr.write('jostle: the compiled code is missing; run `npm ci` (or `npm run build`) in the jostle folder first.\n');
  process.exit(2);
}
await import(entry.href);
