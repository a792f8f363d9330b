/** Loads an experiment for a command, turning problems into a ConfigError (printed by the guard). */
import { loadExperimentFile } from '../config/load.js';
import { ConfigError } from '../config/problems.js';
import type { ExperimentConfig } from '../config/schema.js';
import type { YamlSource } from '../config/yaml-source.js';

export function loadOrFail(file: string, sets: readonly string[]): { config: ExperimentConfig; source: YamlSource } {
  const loaded = loadExperimentFile(file, sets);
  if (!loaded.ok) throw new ConfigError(loaded.problems, loaded.sources);
  return { config: loaded.config, source: loaded.source };
}
