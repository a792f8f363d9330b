/** The tool's name and version, read once from package.json (works from src/ and from dist/src/). */
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export interface ToolInfo {
  readonly name: string;
  readonly version: string;
}

let cached: ToolInfo | undefined;

export function toolInfo(): ToolInfo {
  if (cached !== undefined) return cached;
  for (const relative of ['../package.json', '../../package.json']) {
    const path = fileURLToPath(new URL(relative, import.meta.url));
    if (!existsSync(path)) continue;
    const pkg = JSON.parse(readFileSync(path, 'utf8')) as { name?: string; version?: string };
    if (pkg.name === 'jostle' && typeof pkg.version === 'string') {
      cached = { name: pkg.name, version: pkg.version };
      return cached;
    }
  }
  throw new Error('package.json of jostle not found next to the code');
}
