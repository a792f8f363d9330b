/**
 * `jostle run FILE`: run every point × replication (or one shard of them) on worker threads, with
 * progress, a journal that survives interruption (`--resume`), and the result files at the end.
 */
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { renderConfig } from '../config/load.js';
import { runTasks } from '../experiment/engine.js';
import { Journal, newManifest, readManifest, readRecords, type Shard } from '../experiment/journal.js';
import { pointsWithReplications, replicationRule, withReplications } from '../experiment/plan.js';
import { ReplicationError } from '../experiment/replicate.js';
import type { ExperimentResult } from '../experiment/run.js';
import { writeRunOutputs } from '../report/outputs.js';
import { resultTable } from '../report/table.js';
import { EXIT_FAILED, EXIT_OK, EXIT_USAGE, UserFacingError } from './exit.js';
import { loadOrFail } from './load-or-fail.js';
import { seedValue } from './seed.js';
import { createProgress } from './progress.js';

export interface RunCommandOptions {
  readonly file: string;
  readonly sets: readonly string[];
  readonly vary: readonly string[];
  readonly combine?: 'grid' | 'zip';
  readonly quiet: boolean;
  readonly out?: string;
  readonly reps?: number;
  readonly seed?: string;
  readonly workers?: number;
  readonly shard?: string;
  readonly resume: boolean;
  readonly restart: boolean;
}

export const EXIT_INTERRUPTED = 130;

function parseShard(text: string): Shard {
  const m = /^(\d+)\/(\d+)$/.exec(text.trim());
  const index = Number(m?.[1]);
  const count = Number(m?.[2]);
  if (m === null || count < 1 || index < 1 || index > count) {
    throw new UserFacingError(`--shard takes i/N with 1 ≤ i ≤ N (e.g. --shard 2/8), got '${text}'`, EXIT_USAGE);
  }
  return { index, count };
}


export async function runCommand(o: RunCommandOptions): Promise<number> {
  const sets = o.seed === undefined ? o.sets : [...o.sets, `seed=${seedValue(o.seed)}`];
  const loaded = loadOrFail(o.file, { sets, vary: o.vary, ...(o.combine === undefined ? {} : { combine: o.combine }) });
  const config = o.reps === undefined ? loaded.config : withReplications(loaded.config, o.reps);
  const points = o.reps === undefined ? loaded.points : pointsWithReplications(loaded.points, o.reps);
  const rule = replicationRule(config);
  const shard = o.shard === undefined ? null : parseShard(o.shard);
  const outDir = o.out ?? (shard === null ? join('results', config.experiment) : join('results', config.experiment, `shard-${shard.index}-of-${shard.count}`));
  const workers = o.workers ?? availableParallelism();
  const journal = openJournal(outDir, newManifest(config, points, rule, shard, loaded.baseDir), o);

  const progress = createProgress({ quiet: o.quiet });
  const controller = new AbortController();
  const stop = (): void => {
    if (controller.signal.aborted) process.exit(EXIT_INTERRUPTED);
    controller.abort();
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  const started = Date.now();
  try {
    const outcome = await runTasks(points, loaded.baseDir, rule, {
      workers,
      shard,
      journal,
      signal: controller.signal,
      onProgress: (done, total) => progress.update(done, total),
    });
    progress.finish();
    if (outcome.interrupted) {
      const saved = readRecords(outDir).length;
      process.stderr.write(
        `jostle: interrupted. ${saved} finished replications are saved in ${join(outDir, 'journal')}; continue with the same command and --resume${o.out === undefined ? '' : ` (--out ${o.out})`}.\n`,
      );
      return EXIT_INTERRUPTED;
    }
    journal.markComplete();
    const seconds = ((Date.now() - started) / 1000).toFixed(1);
    if (shard !== null) {
      process.stdout.write(`${config.experiment}: shard ${shard.index}/${shard.count} complete (${outcome.ran} replications run, ${seconds} s) in ${outDir}\ncombine all shards with: jostle merge <shard folders…> --out <folder>\n`);
      return EXIT_OK;
    }
    const result: ExperimentResult = { config, rule, points: outcome.points };
    const written = writeRunOutputs(outDir, result, renderConfig(config));
    process.stdout.write(`${config.experiment} · seed ${String(config.seed)} · ${Math.round(config.confidence_level * 100)} % Student-t intervals over replications\n\n`);
    process.stdout.write(resultTable(result));
    if (!o.quiet) process.stderr.write(`wrote ${written.files.map((f) => join(outDir, f)).join(', ')} (${outcome.ran} replications run, ${seconds} s, ${workers} worker${workers === 1 ? '' : 's'})\n`);
    return EXIT_OK;
  } catch (error) {
    progress.finish();
    if (error instanceof ReplicationError) throw new UserFacingError(`${error.message}. Finished replications are kept in ${join(outDir, 'journal')}.`, EXIT_FAILED);
    throw error;
  } finally {
    process.off('SIGINT', stop);
    process.off('SIGTERM', stop);
  }
}

/** A new journal, or the one to resume; refuses to silently discard an interrupted run. */
function openJournal(outDir: string, manifest: ReturnType<typeof newManifest>, o: RunCommandOptions): Journal {
  // --restart discards whatever is there, readable or not.
  if (o.restart && !o.resume) return Journal.fresh(outDir, manifest);
  const existing = readManifest(outDir);
  if (o.resume) {
    if (existing === undefined) throw new UserFacingError(`nothing to resume: ${outDir} holds no journal of an earlier run`, EXIT_USAGE);
    if (existing.fingerprint !== manifest.fingerprint) {
      throw new UserFacingError(
        `the journal in ${outDir} belongs to a different run (the experiment, its --set/--vary/--reps/--seed, or the jostle version differ); resume with the same command, or use --restart to discard it`,
        EXIT_USAGE,
      );
    }
    const was = existing.shard === null ? 'a whole run' : `shard ${existing.shard.index}/${existing.shard.count}`;
    const now = manifest.shard === null ? 'a whole run' : `shard ${manifest.shard.index}/${manifest.shard.count}`;
    if (was !== now) throw new UserFacingError(`the journal in ${outDir} is ${was}, but this command runs ${now}: resume it with the same --shard`, EXIT_USAGE);
    return Journal.resume(outDir, manifest);
  }
  if (existing !== undefined && !existing.complete && !o.restart) {
    const saved = readRecords(outDir).length;
    throw new UserFacingError(
      `${outDir} holds ${saved} finished replications of an interrupted run of '${existing.experiment}': add --resume to continue it, or --restart to discard them`,
      EXIT_USAGE,
    );
  }
  return Journal.fresh(outDir, manifest);
}

