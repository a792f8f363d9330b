// Command-line usage: help, version, unknown commands and options, bad option values.
// Sources: common practice (POSIX utility conventions; exit status 0 for success and 2 for a usage
// error, as BSD sysexits-style tools and most Unix commands do; errors go to stderr, never a stack trace).
import { afterAll, describe, expect, it } from 'vitest';
import { readText, removeTempDirs, repoFile, runCliAsync } from './run-cli.js';

afterAll(removeTempDirs);

/** A usage error: exit 2, a message on stderr, nothing that looks like a stack trace. */
async function expectUsageError(args: readonly string[]): Promise<string> {
  const r = await runCliAsync(args);
  expect(r.status).toBe(2);
  expect(r.stderr.trim()).not.toBe('');
  expect(r.stderr).not.toContain('    at ');
  return r.stderr;
}

describe.concurrent('jostle --help and --version', () => {
  it('--help exits 0 and lists the seven commands', async () => {
    // common practice: --help prints usage on stdout and succeeds
    const r = await runCliAsync(['--help']);
    expect(r.status).toBe(0);
    for (const command of ['run <file>', 'merge <folders..>', 'plot <folder>', 'validate <file>', 'schema', 'check', 'cluster']) expect(r.stdout).toContain(`jostle ${command}`);
    expect(r.stderr).toBe('');
  });

  it('--version prints the version of package.json', async () => {
    // common practice: --version prints the package version and succeeds
    const pkg = JSON.parse(readText(repoFile('package.json'))) as { version: string };
    const r = await runCliAsync(['--version']);
    expect(r.status).toBe(0);
    expect(r.stdout.trim()).toBe(pkg.version);
  });
});

describe.concurrent('usage errors exit 2 with a message', () => {
  it('no command at all', async () => {
    // common practice: a missing subcommand is a usage error
    expect(await expectUsageError([])).toMatch(/run|command/);
  });

  it('an unknown command', async () => {
    // common practice: an unknown subcommand is a usage error that points to --help
    const stderr = await expectUsageError(['frobnicate']);
    expect(stderr).toContain('--help');
    expect(stderr).toMatch(/unknown (command|argument):? '?frobnicate/i);
  });

  it('an unknown option, globally and on a command', async () => {
    // common practice: unknown options are rejected, not ignored
    expect(await expectUsageError(['schema', '--bogus'])).toContain('bogus');
    expect(await expectUsageError(['run', repoFile('configs/reference/tr37868-model2.yaml'), '--frobnicate-level', '1'])).toContain('frobnicate');
  });

  it('run without a file', async () => {
    // common practice: a missing required operand is a usage error
    await expectUsageError(['run']);
  });

  it.each(['--reps 0', '--reps abc', '--reps 1.5', '--reps=-3'])('%s is rejected', async (text) => {
    const option = text.split(' ');
    // common practice: a count option takes a whole number ≥ 1
    const stderr = await expectUsageError(['run', repoFile('configs/reference/tr37868-model2.yaml'), ...option]);
    expect(stderr).toContain('--reps');
  });
});

describe('a replication that cannot finish exits 1', () => {
  it('reaching max_events is reported with the replay coordinates, no stack trace', async () => {
    // common practice: exit status 1 for a failed run (as opposed to 2 for bad usage)
    const r = await runCliAsync(['run', repoFile('configs/reference/tr37868-model2.yaml'), '--set', 'max_events=100', '--reps', '1']);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('max_events');
    expect(r.stderr).toMatch(/seed [0-9a-f]{16}/);
    expect(r.stderr).not.toContain('    at ');
  });
});
