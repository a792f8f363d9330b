/**
 * `jostle cluster slurm FILE --shards N`: checks the experiment, writes a Slurm job array (one shard
 * per task), a merge job and a submit script into OUT/cluster/, and with --submit runs the submit
 * script (with --wait, until the merged results are in OUT).
 */
import { spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { SCRIPT_FILES, slurmScripts, slurmSpecProblems, type SlurmJobSpec, type SlurmResources } from '../cluster/slurm.js';
import { slurmOptionProblems } from '../cluster/slurm-options.js';
import { replicationRule, withReplications } from '../experiment/plan.js';
import { EXIT_FAILED, EXIT_OK, EXIT_USAGE, UserFacingError } from './exit.js';
import { loadOrFail } from './load-or-fail.js';
import { seedValue } from './seed.js';

export interface ClusterCommandOptions {
  readonly scheduler: string;
  readonly file: string;
  readonly shards: number;
  readonly sets: readonly string[];
  readonly vary: readonly string[];
  readonly combine?: 'grid' | 'zip';
  readonly reps?: number;
  readonly seed?: string;
  readonly resources: SlurmResources;
  readonly out?: string;
  readonly submit: boolean;
  readonly wait: boolean;
}

/** Absolute path of this install's bin/jostle.js (from src/cli/ or dist/src/cli/). */
function jostleEntry(): string {
  for (const relative of ['../../bin/jostle.js', '../../../bin/jostle.js']) {
    const path = fileURLToPath(new URL(relative, import.meta.url));
    if (existsSync(path)) return path;
  }
  throw new UserFacingError('cannot find bin/jostle.js of this install next to the code', EXIT_FAILED);
}

/** Number of independent units the shards share: (point, replication) tasks, or points under a stopping rule. */
function shardUnits(points: number, rule: ReturnType<typeof replicationRule>): { count: number; what: string } {
  if (rule.kind === 'fixed') return { count: points * rule.count, what: `${points} point${points === 1 ? '' : 's'} × ${rule.count} replications` };
  return { count: points, what: `${points} point${points === 1 ? '' : 's'}, each with its own stopping rule` };
}

export function clusterCommand(o: ClusterCommandOptions): number {
  if (o.scheduler !== 'slurm') throw new UserFacingError(`unknown scheduler '${o.scheduler}'; supported: slurm`, EXIT_USAGE);
  const early = slurmOptionProblems(o.shards, o.resources);
  if (early.length > 0) throw new UserFacingError(early.join('\n'), EXIT_USAGE);
  const sets = o.seed === undefined ? o.sets : [...o.sets, `seed=${seedValue(o.seed)}`];
  const loaded = loadOrFail(o.file, { sets, vary: o.vary, ...(o.combine === undefined ? {} : { combine: o.combine }) });
  const units = shardUnits(loaded.points.length, replicationRule(o.reps === undefined ? loaded.config : withReplications(loaded.config, o.reps)));
  if (o.shards > units.count) {
    throw new UserFacingError(`--shards ${o.shards} is more than the ${units.count} independent tasks of this experiment (${units.what}); use --shards ${units.count} or fewer`, EXIT_USAGE);
  }
  const outDir = resolve(o.out ?? join('results', loaded.config.experiment));
  const spec: SlurmJobSpec = {
    experiment: loaded.config.experiment,
    shards: o.shards,
    node: process.execPath,
    jostle: jostleEntry(),
    experimentFile: resolve(o.file),
    outDir,
    runArgs: [
      ...o.sets.map((item) => ['--set', item] as const),
      ...o.vary.map((item) => ['--vary', item] as const),
      ...(o.combine === undefined ? [] : [['--combine', o.combine] as const]),
      ...(o.reps === undefined ? [] : [['--reps', String(o.reps)] as const]),
      ...(o.seed === undefined ? [] : [['--seed', o.seed] as const]),
    ],
    resources: o.resources,
  };
  const problems = slurmSpecProblems(spec);
  if (problems.length > 0) throw new UserFacingError(problems.join('\n'), EXIT_USAGE);
  const submit = writeScripts(spec);
  const submitting = o.submit || o.wait;
  describe(spec, units, submitting ? undefined : submit);
  if (!submitting) return EXIT_OK;
  process.stdout.write(`submitting: bash ${submit}${o.wait ? ' --wait' : ''}\n`);
  return runSubmit(submit, o.wait);
}

/** Writes the scripts into OUT/cluster/ (and makes OUT/logs/, which Slurm does not create); returns the submit script's path. */
function writeScripts(spec: SlurmJobSpec): string {
  const scripts = slurmScripts(spec);
  const dir = join(spec.outDir, 'cluster');
  mkdirSync(dir, { recursive: true });
  mkdirSync(join(spec.outDir, 'logs'), { recursive: true });
  for (const key of ['shards', 'merge', 'submit'] as const) {
    const path = join(dir, SCRIPT_FILES[key]);
    writeFileSync(path, scripts[key]);
    chmodSync(path, 0o755);
  }
  return join(dir, SCRIPT_FILES.submit);
}

/** Says what was written and, unless submitting now (`submit` undefined), what to run next. */
function describe(spec: SlurmJobSpec, units: { count: number; what: string }, submit: string | undefined): void {
  const perShard = units.count / spec.shards;
  const dir = join(spec.outDir, 'cluster');
  process.stdout.write(
    `wrote ${join(dir, SCRIPT_FILES.shards)} (job array of ${spec.shards} shard${spec.shards === 1 ? '' : 's'}, ` +
      `${units.count} tasks: ${units.what}), ${SCRIPT_FILES.merge} and ${SCRIPT_FILES.submit}\n`,
  );
  if (submit !== undefined) {
    process.stdout.write(
      `next: bash ${submit}          # queue the shards and the merge job\n` +
        `  or: bash ${submit} --wait   # … and wait until the merged results are in ${spec.outDir}\n`,
    );
  }
  if (perShard < 2 && units.count > 1) {
    process.stdout.write(`note: about ${perShard.toFixed(1)} task per shard; every scheduling round costs the cluster time, so fewer shards with several replications each usually finish sooner\n`);
  }
}

function runSubmit(script: string, wait: boolean): number {
  const child = spawnSync('bash', [script, ...(wait ? ['--wait'] : [])], { stdio: 'inherit' });
  if (child.error !== undefined) throw new UserFacingError(`cannot run ${script}: ${child.error.message}`, EXIT_FAILED);
  return child.status === 0 ? EXIT_OK : child.status === 2 ? EXIT_USAGE : EXIT_FAILED;
}
