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
      'Run an experiment file and write summary.json and replications.csv',
      (y) =>
        y
          .positional('file', { type: 'string', demandOption: true, describe: 'Experiment YAML file' })
          .option('out', { type: 'string', describe: 'Output folder (default: results/<experiment name>/)' })
          .option('reps', { type: 'number', describe: 'Replications per point (replaces the file’s count or stopping rule)' })
          .option('seed', { type: 'string', describe: 'Root seed (replaces the file’s seed)' })
          .option('set', setOption)
          .option('quiet', { type: 'boolean', default: false, describe: 'Print only the result table' })
          .check((a) => {
            if (a.reps !== undefined && !(Number.isInteger(a.reps) && a.reps >= 1)) throw new Error(`--reps must be a whole number ≥ 1, got ${String(a.reps)}`);
            return true;
          }),
      async (a) => {
        const { runCommand } = await import('./run-command.js');
        await runGuarded(() =>
          runCommand({
            file: a.file,
            sets: a.set,
            quiet: a.quiet,
            ...(a.out === undefined ? {} : { out: a.out }),
            ...(a.reps === undefined ? {} : { reps: a.reps }),
            ...(a.seed === undefined ? {} : { seed: a.seed }),
          }),
        );
      },
    )
    .command(
      'validate <file>',
      'Check an experiment file and print it fully resolved (every default filled in)',
      (y) => y.positional('file', { type: 'string', demandOption: true, describe: 'Experiment YAML file' }).option('set', setOption),
      async (a) => {
        const { validateCommand } = await import('./validate-command.js');
        await runGuarded(() => validateCommand(a.file, a.set));
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
    .demandCommand(1, 'Name a command: run, validate, schema or check (see --help).')
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

await main(hideBin(process.argv));
