/** `jostle run FILE`: run every point × replication, print the table, write the result files. */
import { join } from 'node:path';
import { renderConfig } from '../config/load.js';
import { runExperiment } from '../experiment/run.js';
import { pointsWithReplications, withReplications } from '../experiment/plan.js';
import { ReplicationError } from '../experiment/replicate.js';
import { replicationsCsv } from '../report/csv.js';
import { writeFileAtomic } from '../report/files.js';
import { summaryJson } from '../report/summary.js';
import { resultTable } from '../report/table.js';
import { EXIT_FAILED, EXIT_OK, UserFacingError } from './exit.js';
import { loadOrFail } from './load-or-fail.js';

export interface RunCommandOptions {
  readonly file: string;
  readonly sets: readonly string[];
  readonly quiet: boolean;
  readonly out?: string;
  readonly reps?: number;
  readonly seed?: string;
}

export function runCommand(o: RunCommandOptions): number {
  const sets = o.seed === undefined ? o.sets : [...o.sets, `seed=${o.seed}`];
  const loaded = loadOrFail(o.file, sets);
  const config = o.reps === undefined ? loaded.config : withReplications(loaded.config, o.reps);
  const points = o.reps === undefined ? loaded.points : pointsWithReplications(loaded.points, o.reps);
  const outDir = o.out ?? join('results', config.experiment);
  const started = Date.now();
  let done = 0;
  try {
    const result = runExperiment(config, {
      points,
      baseDir: loaded.baseDir,
      onReplication: () => {
        done++;
        if (!o.quiet && process.stderr.isTTY) process.stderr.write(`\r${done} replications done`);
      },
    });
    if (!o.quiet && process.stderr.isTTY) process.stderr.write('\r\x1b[K');
    writeFileAtomic(join(outDir, 'summary.json'), summaryJson(result, renderConfig(config)));
    writeFileAtomic(join(outDir, 'replications.csv'), replicationsCsv(result.points.flatMap((p) => p.records)));
    const seconds = ((Date.now() - started) / 1000).toFixed(1);
    process.stdout.write(`${config.experiment} · seed ${String(config.seed)} · ${Math.round(config.confidence_level * 100)} % Student-t intervals over replications\n\n`);
    process.stdout.write(resultTable(result));
    if (!o.quiet) process.stderr.write(`wrote ${join(outDir, 'summary.json')} and replications.csv (${seconds} s)\n`);
    return EXIT_OK;
  } catch (error) {
    if (error instanceof ReplicationError) throw new UserFacingError(error.message, EXIT_FAILED);
    throw error;
  }
}
