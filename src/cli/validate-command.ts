/** `jostle validate FILE`: report every problem, or print the fully resolved experiment as YAML. */
import { stringify } from 'yaml';
import { renderConfig } from '../config/load.js';
import { EXIT_OK } from './exit.js';
import { loadOrFail } from './load-or-fail.js';

export function validateCommand(file: string, sets: readonly string[]): number {
  const { config } = loadOrFail(file, sets);
  process.stdout.write(`# ${file}: valid. Fully resolved experiment (every default filled in):\n`);
  process.stdout.write(stringify(renderConfig(config), { lineWidth: 0 }));
  return EXIT_OK;
}
