/** `jostle validate FILE`: report every problem, or print the fully resolved experiment as YAML. */
import { stringify } from 'yaml';
import { renderConfig, type TerminalEdits } from '../config/load.js';
import { EXIT_OK } from './exit.js';
import { loadOrFail } from './load-or-fail.js';

export function validateCommand(file: string, edits: TerminalEdits): number {
  const { config, points } = loadOrFail(file, edits);
  process.stdout.write(`# ${file}: valid. Fully resolved experiment (every default filled in):\n`);
  process.stdout.write(stringify(renderConfig(config), { lineWidth: 0 }));
  if (points.length > 1) {
    process.stdout.write(`# the sweep has ${points.length} points:\n`);
    for (const p of points) process.stdout.write(`#   ${p.index}: ${p.label}\n`);
  }
  return EXIT_OK;
}
