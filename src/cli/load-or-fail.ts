/** Loads an experiment for a command, turning problems into a ConfigError (printed by the guard). */
import { loadExperimentFile, type LoadedExperiment, type TerminalEdits } from '../config/load.js';
import { ConfigError } from '../config/problems.js';

export function loadOrFail(file: string, edits: readonly string[] | TerminalEdits): LoadedExperiment {
  const loaded = loadExperimentFile(file, edits);
  if (!loaded.ok) throw new ConfigError(loaded.problems, loaded.sources);
  return loaded;
}
