/**
 * The `jostle` command line. Thin: parse arguments, call experiment/report code, map failures to exit
 * codes (0 success, 1 a check or a replication failed, 2 bad usage or a bad experiment file).
 * Command modules are imported lazily so that `jostle --help` answers at once.
 */
import yargs from 'yargs';
import { hideBin } from 'yargs/helpers';
import { toolInfo } from '../version.js';
import { EXIT_USAGE, runGuarded } from './exit.js';

const setOption = {
  type: 'string',
  array: true,
  default: [] as string[],
  describe: 'Override a key of the experiment file: --set path=value (repeatable), e.g. --set groups.meters.count=20000',
} as const;

export async function main(argv: string[]): Promise<void> {
  await yargs(argv)
    .scriptName('jostle')
    .usage('$0 <command> [options]\n\nSimulates uplink access (random access and granted uplink) of massive IoT cells.')
    .version(toolInfo().version)
    .command(
      'run <file>',
      'Run an experiment file (every point × replication) and write its results',
      (y) =>
        y
          .positional('file', { type: 'string', demandOption: true, describe: 'Experiment YAML file' })
          .option('out', { type: 'string', describe: 'Output folder (default: results/<experiment name>/)' })
          .option('reps', { type: 'number', describe: 'Replications per point (replaces the file’s count or stopping rule)' })
          .option('seed', { type: 'string', describe: 'Root seed (replaces the file’s seed)' })
          .option('set', setOption)
          .option('vary', {
            type: 'string',
            array: true,
            default: [] as string[],
            describe: 'Add or replace a sweep axis: --vary path=v1,v2 | path=[{…},{…}] | path=FROM..TO/COUNT[/log] | path=FROM..TO+STEP (repeatable)',
          })
          .option('combine', { choices: ['grid', 'zip'] as const, describe: 'How sweep axes combine (replaces the file’s choice)' })
          .option('workers', { type: 'number', describe: 'Worker threads (default: the machine’s cores); results do not depend on it' })
          .option('shard', { type: 'string', describe: 'Run only slice i of N of the tasks (e.g. 2/8) into --out; combine with `jostle merge`' })
          .option('resume', { type: 'boolean', default: false, describe: 'Continue an interrupted run in --out without redoing finished replications' })
          .option('restart', { type: 'boolean', default: false, describe: 'Discard the finished replications of an interrupted run in --out' })
          .option('quiet', { type: 'boolean', default: false, describe: 'No progress; print only the result table' })
          .check((a) => {
            if (a.reps !== undefined && !(Number.isInteger(a.reps) && a.reps >= 1)) throw new Error(`--reps must be a whole number ≥ 1, got ${String(a.reps)}`);
            if (a.workers !== undefined && !(Number.isInteger(a.workers) && a.workers >= 1)) throw new Error(`--workers must be a whole number ≥ 1, got ${String(a.workers)}`);
            if (a.resume && a.restart) throw new Error('--resume and --restart exclude each other');
            return true;
          }),
      async (a) => {
        const { runCommand } = await import('./run-command.js');
        await runGuarded(() =>
          runCommand({
            file: a.file,
            sets: a.set,
            vary: a.vary,
            quiet: a.quiet,
            resume: a.resume,
            restart: a.restart,
            ...(a.combine === undefined ? {} : { combine: a.combine }),
            ...(a.out === undefined ? {} : { out: a.out }),
            ...(a.reps === undefined ? {} : { reps: a.reps }),
            ...(a.seed === undefined ? {} : { seed: a.seed }),
            ...(a.workers === undefined ? {} : { workers: a.workers }),
            ...(a.shard === undefined ? {} : { shard: a.shard }),
          }),
        );
      },
    )
    .command(
      'merge <folders..>',
      'Combine the folders written by `jostle run --shard i/N` into the files a single run writes',
      (y) =>
        y
          .positional('folders', { type: 'string', array: true, demandOption: true, describe: 'Shard output folders' })
          .option('out', { type: 'string', demandOption: true, describe: 'Folder for the combined results' })
          .option('quiet', { type: 'boolean', default: false, describe: 'Print only the result table' }),
      async (a) => {
        const { mergeCommand } = await import('./merge-command.js');
        await runGuarded(() => mergeCommand(a.folders, a.out, a.quiet));
      },
    )
    .command(
      'plot <folder>',
      'Redraw the plots and report.html of a result folder from its summary.json, without re-running',
      (y) => y.positional('folder', { type: 'string', demandOption: true, describe: 'Folder written by run or merge' }),
      async (a) => {
        const { plotCommand } = await import('./plot-command.js');
        await runGuarded(() => plotCommand(a.folder));
      },
    )
    .command(
      'validate <file>',
      'Check an experiment file and print it fully resolved (every default filled in)',
      (y) =>
        y
          .positional('file', { type: 'string', demandOption: true, describe: 'Experiment YAML file' })
          .option('set', setOption)
          .option('vary', { type: 'string', array: true, default: [] as string[], describe: 'Add or replace a sweep axis (as for run)' })
          .option('combine', { choices: ['grid', 'zip'] as const, describe: 'How sweep axes combine' }),
      async (a) => {
        const { validateCommand } = await import('./validate-command.js');
        await runGuarded(() => validateCommand(a.file, { sets: a.set, vary: a.vary, ...(a.combine === undefined ? {} : { combine: a.combine }) }));
      },
    )
    .command(
      'schema',
      'Print the JSON Schema of experiment files (for editor completion and checking)',
      (y) => y,
      async () => {
        const { schemaCommand } = await import('./schema-command.js');
        await runGuarded(() => schemaCommand());
      },
    )
    .command(
      'check',
      'Run the built-in validation cases through the simulator against closed forms and published values',
      (y) =>
        y
          .option('only', { type: 'string', array: true, describe: 'Run only the cases whose id starts with this text (repeatable)' })
          .option('list', { type: 'boolean', default: false, describe: 'List the cases and exit' }),
      async (a) => {
        const { checkCommand } = await import('./check-command.js');
        await runGuarded(() => checkCommand({ only: a.only ?? [], list: a.list }));
      },
    )
    .command(
      'cluster <scheduler> <file>',
      'Write batch scripts that run an experiment as shards on a cluster (Slurm) and merge them; optionally submit',
      (y) =>
        y
          .positional('scheduler', { type: 'string', choices: ['slurm'], demandOption: true, describe: 'Batch system' })
          .positional('file', { type: 'string', demandOption: true, describe: 'Experiment YAML file' })
          .option('shards', { type: 'number', demandOption: true, describe: 'Array tasks N; task i runs shard i/N. Give each several replications: every scheduling round costs about a second or more' })
          .option('out', { type: 'string', describe: 'Output folder (default: results/<experiment name>/); scripts go to OUT/cluster/, logs to OUT/logs/' })
          .option('partition', { type: 'string', describe: 'Slurm partition (--partition)' })
          .option('time', { type: 'string', describe: 'Time limit per job, e.g. 30, 1:30:00, 2-00:00:00 (--time)' })
          .option('cpus', { type: 'number', describe: 'CPUs per shard (--cpus-per-task); the shard runs that many workers' })
          .option('mem', { type: 'string', describe: 'Memory per job, e.g. 2G or 500M (--mem)' })
          .option('account', { type: 'string', describe: 'Account to charge (--account)' })
          .option('sbatch', { type: 'string', array: true, default: [] as string[], describe: 'Extra #SBATCH option line, e.g. --sbatch=--qos=long (repeatable)' })
          .option('set', setOption)
          .option('vary', { type: 'string', array: true, default: [] as string[], describe: 'Add or replace a sweep axis (as for run); passed to every shard' })
          .option('combine', { choices: ['grid', 'zip'] as const, describe: 'How sweep axes combine (as for run)' })
          .option('reps', { type: 'number', describe: 'Replications per point (as for run)' })
          .option('seed', { type: 'string', describe: 'Root seed (as for run)' })
          .option('submit', { type: 'boolean', default: false, describe: 'Submit the jobs (runs OUT/cluster/submit.sh)' })
          .option('wait', { type: 'boolean', default: false, describe: 'Submit and wait until the merged results are written (implies --submit)' }),
      async (a) => {
        const { clusterCommand } = await import('./cluster-command.js');
        await runGuarded(() =>
          clusterCommand({
            scheduler: a.scheduler,
            file: a.file,
            shards: a.shards,
            sets: a.set,
            vary: a.vary,
            ...(a.combine === undefined ? {} : { combine: a.combine }),
            ...(a.reps === undefined ? {} : { reps: a.reps }),
            ...(a.seed === undefined ? {} : { seed: a.seed }),
            submit: a.submit,
            wait: a.wait,
            ...(a.out === undefined ? {} : { out: a.out }),
            resources: {
              extra: a.sbatch,
              ...(a.partition === undefined ? {} : { partition: a.partition }),
              ...(a.time === undefined ? {} : { time: a.time }),
              ...(a.cpus === undefined ? {} : { cpus: a.cpus }),
              ...(a.mem === undefined ? {} : { mem: a.mem }),
              ...(a.account === undefined ? {} : { account: a.account }),
            },
          }),
        );
      },
    )
    .demandCommand(1, 'Name a command: run, merge, plot, validate, schema, check or cluster (see --help).')
    .strict()
    .recommendCommands()
    .help()
    .alias('h', 'help')
    .wrap(Math.min(100, process.stdout.columns || 100))
    .fail((message, error) => {
      if (error !== undefined && error !== null && message === null) throw error;
      const text = message ?? String(error);
      const unknown = /^Did you mean/.test(text) ? `unknown command '${process.argv[2] ?? ''}'. ` : '';
      process.stderr.write(`jostle: ${unknown}${text}\nRun 'jostle --help' for usage.\n`);
      process.exit(EXIT_USAGE);
    })
    .parseAsync();
}

// A reader that stops early (`jostle schema | head`) closes the pipe: that is not an error.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
}

await main(hideBin(process.argv));
