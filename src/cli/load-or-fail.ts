/** Loads an experiment for a command, turning problems into a ConfigError (printed by the guard). */
import { loadExperimentFile, type LoadedExperiment } from '../config/load.js';
import { ConfigError } from '../config/problems.js';

export function loadOrFail(file: string, sets: readonly string[]): LoadedExperiment {
  const loaded = loadExperimentFile(file, sets);
  if (!loaded.ok) throw new ConfigError(loaded.problems, loaded.sources);
  return loaded;
}
