// `jostle cluster slurm`: the generated job-array, merge and submit scripts, checked as text, run by
// bash with stand-ins for jostle and Slurm, and end to end on a private single-node Slurm (skipped
// where Slurm cannot be started), where the merged summary.json must equal an unsharded run's.
// Sources: common practice (Slurm sbatch documentation: `#SBATCH` lines, `--array=1-N`, the %A/%a log
// name patterns, SLURM_ARRAY_TASK_ID, `--parsable`, `--dependency=afterok:ID`, `--kill-on-invalid-dep`,
// the --time and --mem formats); exact (bash single-quote rules, POSIX Shell Command Language 2.2.2:
// inside single quotes no character is special).
import { mkdirSync, readdirSync, readFileSync, writeFileSync, type Dirent } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memProblem, slurmOptionProblems, timeProblem } from '../../src/cluster/slurm-options.js';
import { slurmScripts, type SlurmJobSpec } from '../../src/cluster/slurm.js';
import { makeTempDir, removeTempDirs, repoFile, runCliAsync } from '../cli/run-cli.js';
import { HOW_TO_ENABLE, slurmAvailability, startSlurm, type SlurmCluster } from './slurm-harness.js';
import { runBash, runJostle, writeArgvEcho, writeFakeSlurm } from './stand-ins.js';

const MODEL2 = repoFile('configs/reference/tr37868-model2.yaml');
/** A small run: 2000 devices, 6 replications (1 point × 6 = 6 tasks). */
const SMALL = ['--set', 'groups.mtc.count=2000', '--set', 'replications=6'];
/** A --set value that breaks out of careless quoting (the echo would show on stderr). */
const TRICKY = `description=a "quoted" it's $HOME \`pwd\` !x; echo INJECTED >&2`;

function spec(dir: string, overrides: Partial<SlurmJobSpec> = {}): SlurmJobSpec {
  return {
    experiment: 'demo',
    shards: 3,
    node: process.execPath,
    jostle: writeArgvEcho(dir),
    experimentFile: '/data/exp one.yaml',
    outDir: join(dir, 'out dir'),
    runArgs: [
      ['--set', 'groups.mtc.count=2000'],
      ['--set', TRICKY],
      ['--vary', 'cell.random_access.preambles=[10, 20]'],
      ['--seed', '007'],
    ],
    resources: { extra: [] },
    ...overrides,
  };
}

/** Writes the three scripts of `s` into OUT/cluster/ (where the CLI puts them) and returns their paths. */
function writeScripts(s: SlurmJobSpec): { shards: string; merge: string; submit: string; text: ReturnType<typeof slurmScripts> } {
  const text = slurmScripts(s);
  const dir = join(s.outDir, 'cluster');
  mkdirSync(dir, { recursive: true });
  const paths = { shards: join(dir, 'shards.sbatch'), merge: join(dir, 'merge.sbatch'), submit: join(dir, 'submit.sh') };
  for (const key of ['shards', 'merge', 'submit'] as const) writeFileSync(paths[key], text[key]);
  return { ...paths, text };
}

afterAll(removeTempDirs);

/** Files under `dir`, relative, without the run's working journal/ (merge writes no journal). */
function resultFiles(dir: string): string[] {
  return (readdirSync(dir, { recursive: true, withFileTypes: true }) as Dirent[])
    .filter((e) => e.isFile())
    .map((e) => relative(dir, join(e.parentPath, e.name)))
    .filter((f) => !f.startsWith(`journal${sep}`))
    .sort();
}

describe('generated Slurm scripts', () => {
  it('the array script asks for tasks 1..N and writes logs under OUT/logs with %A_%a', () => {
    // common practice (Slurm sbatch documentation: --array, filename patterns %A job id, %a task index)
    const dir = makeTempDir();
    const { text } = writeScripts(spec(dir, { resources: { cpus: 4, time: '1:30:00', mem: '2g', partition: 'short', account: 'radio', extra: ['#SBATCH --qos=long', '--constraint=avx2'] } }));
    const directives = text.shards.split('\n').filter((l) => l.startsWith('#SBATCH'));
    expect(directives).toEqual([
      '#SBATCH --job-name=jostle-demo',
      '#SBATCH --array=1-3',
      `#SBATCH --output="${join(dir, 'out dir', 'logs', 'shard-%A_%a.out')}"`,
      `#SBATCH --error="${join(dir, 'out dir', 'logs', 'shard-%A_%a.err')}"`,
      '#SBATCH --cpus-per-task=4',
      '#SBATCH --partition=short',
      '#SBATCH --account=radio',
      '#SBATCH --time=1:30:00',
      '#SBATCH --mem=2G',
      '#SBATCH --qos=long',
      '#SBATCH --constraint=avx2',
    ]);
    // sbatch reads #SBATCH lines only before the first command: they must directly follow the shebang
    expect(text.shards.split('\n').slice(1, directives.length + 1)).toEqual(directives);
    expect(text.shards).toContain('set -euo pipefail');
    expect(text.merge.split('\n').filter((l) => l.startsWith('#SBATCH'))).not.toContain('#SBATCH --cpus-per-task=4');
  });

  it('bash runs task i as `run FILE --shard i/N --out OUT/shards/i`, with --set, --vary and --seed values intact', () => {
    // exact: single-quoted words reach the program byte for byte (POSIX 2.2.2)
    const dir = makeTempDir();
    const s = spec(dir);
    const { shards } = writeScripts(s);
    const r = runBash(shards, [], { SLURM_ARRAY_TASK_ID: '2' });
    expect(r.stderr).toBe('');
    expect(JSON.parse(r.stdout)).toEqual([
      'run', '/data/exp one.yaml', '--shard', '2/3', '--out', join(s.outDir, 'shards', '2'), '--workers', '1', '--quiet',
      '--set', 'groups.mtc.count=2000', '--set', TRICKY, '--vary', 'cell.random_access.preambles=[10, 20]', '--seed', '007',
    ]);
    const withCpus = runBash(shards, [], { SLURM_ARRAY_TASK_ID: '3', SLURM_CPUS_PER_TASK: '4' });
    expect((JSON.parse(withCpus.stdout) as string[]).slice(2, 8)).toEqual(['--shard', '3/3', '--out', join(s.outDir, 'shards', '3'), '--workers', '4']);
  });

  it('the merge script names every shard folder 1..N and writes into OUT', () => {
    const dir = makeTempDir();
    const s = spec(dir);
    const r = runBash(writeScripts(s).merge, [], {});
    expect(r.status).toBe(0);
    const shardDirs = [1, 2, 3].map((i) => join(s.outDir, 'shards', String(i)));
    expect(JSON.parse(r.stdout)).toEqual(['merge', ...shardDirs, '--out', s.outDir]);
  });

  it('the submit script queues the array, then the merge job with afterok on it, and prints both ids', () => {
    // common practice (Slurm sbatch documentation: --parsable prints the id; afterok:ID; --kill-on-invalid-dep=yes)
    const dir = makeTempDir();
    const s = spec(dir);
    const paths = writeScripts(s);
    const fake = writeFakeSlurm(dir, {});
    const r = runBash(paths.submit, [], { PATH: fake.path });
    expect(r.status).toBe(0);
    const sbatch = fake.calls().filter((c) => c[0] === 'sbatch');
    expect(sbatch).toEqual([
      ['sbatch', '--parsable', join(s.outDir, 'cluster', 'shards.sbatch')],
      ['sbatch', '--parsable', '--dependency=afterok:101', '--kill-on-invalid-dep=yes', join(s.outDir, 'cluster', 'merge.sbatch')],
    ]);
    expect(r.stdout).toMatch(/array job: 101[^]*merge job: 102/);
    expect(fake.calls().some((c) => c[0] === 'squeue')).toBe(false); // no --wait: no polling
  });

  it('submit --wait exits 0 only when the merge job completed, and names failed shards otherwise', () => {
    const dir = makeTempDir();
    const s = spec(dir);
    const paths = writeScripts(s);
    const done = writeFakeSlurm(dir, { '102': 'JobId=102 JobName=jostle-demo-merge JobState=COMPLETED Reason=None\n' });
    const ok = runBash(paths.submit, ['--wait'], { PATH: done.path, JOSTLE_SLURM_POLL: '0' });
    expect(ok.status).toBe(0);
    expect(done.calls().find((c) => c[0] === 'squeue')).toEqual(['squeue', '-h', '-j', '102', '-o', '%i']);
    const failed = writeFakeSlurm(dir, {
      '101': 'JobId=103 ArrayJobId=101 ArrayTaskId=1 JobName=jostle-demo JobState=COMPLETED Reason=None\nJobId=101 ArrayJobId=101 ArrayTaskId=2 JobName=jostle-demo JobState=FAILED Reason=NonZeroExitCode\n',
      '102': 'JobId=102 JobName=jostle-demo-merge JobState=CANCELLED Reason=DependencyNeverSatisfied\n',
    });
    const bad = runBash(paths.submit, ['--wait'], { PATH: failed.path, JOSTLE_SLURM_POLL: '0' });
    expect(bad.status).toBe(1);
    expect(bad.stderr).toContain('ended as CANCELLED');
    expect(bad.stderr).toContain('shard 2: FAILED');
  });
});

describe('Slurm option checks', () => {
  it('accepts the six sbatch time formats and rejects others', () => {
    // common practice (sbatch documentation, --time)
    for (const t of ['30', '90:00', '1:30:00', '2-12', '2-12:30', '2-12:30:15', 'UNLIMITED']) expect(timeProblem(t), t).toBeUndefined();
    for (const t of ['1h', '1:2:3:4', '1:60:00', '2-24:00', '', '-5']) expect(timeProblem(t), t).toMatch(/--time/);
  });

  it('accepts memory sizes with K/M/G/T suffixes and suggests the fix for 2GB', () => {
    // common practice (sbatch documentation, --mem: megabytes by default, suffixes K|M|G|T)
    for (const m of ['500', '500M', '2G', '2g', '1T', '64K']) expect(memProblem(m), m).toBeUndefined();
    expect(memProblem('2GB')).toContain('write `2G`');
    for (const m of ['0', '2.5G', 'lots', '-1G']) expect(memProblem(m), m).toMatch(/--mem/);
  });

  it('rejects shard counts that are not whole numbers ≥ 1, bad names and an --array of the user', () => {
    const problems = slurmOptionProblems(0, { cpus: 1.5, partition: 'a b', extra: ['--array=1-4', 'qos=x'] });
    expect(problems.join('\n')).toMatch(/--shards[^]*--cpus[^]*--partition[^]*--array[^]*not an sbatch option/);
    expect(slurmOptionProblems(1, { partition: 'gpu,cpu', extra: [] })).toEqual([]);
  });
});

describe.concurrent('jostle cluster slurm (built command)', () => {
  it('writes the scripts to results/<experiment>/cluster/ by default and says what to run next', async () => {
    const r = await runCliAsync(['cluster', 'slurm', MODEL2, '--shards', '3', '--set', 'replications=6']);
    expect(r.status).toBe(0);
    expect(readdirSync(join(r.cwd, 'results', 'tr37868-model2', 'cluster')).sort()).toEqual(['merge.sbatch', 'shards.sbatch', 'submit.sh']);
    expect(r.stdout).toContain(`bash ${join(r.cwd, 'results', 'tr37868-model2', 'cluster', 'submit.sh')}`);
    expect(r.stdout).toContain('6 tasks: 1 point × 6 replications');
  });

  it('a bad experiment file fails with the usual problem report (exit 2) and writes nothing', async () => {
    const r = await runCliAsync(['cluster', 'slurm', MODEL2, '--shards', '2', '--set', 'groups.mtc.cuont=5', '--out', 'o']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('groups.mtc.cuont');
    expect(r.stderr).not.toContain('    at ');
    expect(readdirSync(r.cwd)).toEqual([]);
  });

  it('rejects more shards than tasks and malformed options with exit 2', async () => {
    const many = await runCliAsync(['cluster', 'slurm', MODEL2, '--shards', '7', '--set', 'replications=6']);
    expect(many.status).toBe(2);
    expect(many.stderr).toContain('use --shards 6 or fewer');
    const bad = await runCliAsync(['cluster', 'slurm', MODEL2, '--shards', '2', '--time', '2h', '--mem', '2GB']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/--time[^]*--mem/);
  });
});

const available = slurmAvailability();
if (!available.ok) console.log(`Slurm end-to-end test skipped: ${available.reason}. To enable it, ${HOW_TO_ENABLE}.`);

describe.skipIf(!available.ok)('on a real single-node Slurm', () => {
  let slurm: SlurmCluster | undefined;
  beforeAll(async () => {
    slurm = await startSlurm();
  }, 60_000);
  afterAll(async () => {
    await slurm?.stop();
  }, 60_000);

  it('3 array tasks plus the merge job write the files of an unsharded run, byte for byte', async () => {
    // common practice: sharding changes where replications run, never their values (seeds depend on
    // (root, point, replication) only); the unsharded `jostle run` is the reference
    const dir = makeTempDir();
    const out = join(dir, 'sharded out'); // a space: checks the quoting of #SBATCH --output
    const started = Date.now();
    const [cluster, single] = await Promise.all([
      runJostle(['cluster', 'slurm', MODEL2, '--shards', '3', '--out', out, ...SMALL, '--wait'], { cwd: dir, env: slurm!.env({ JOSTLE_SLURM_POLL: '0.2' }), timeoutMs: 110_000 }),
      runCliAsync(['run', MODEL2, ...SMALL, '--out', join(dir, 'single'), '--quiet'], { cwd: dir }),
    ]);
    console.log(`Slurm end-to-end: cluster slurm --wait took ${Date.now() - started} ms`);
    expect(single.status, single.stderr).toBe(0);
    expect(cluster.status, `${cluster.stdout}${cluster.stderr}\n${slurm!.logs()}`).toBe(0);
    expect(cluster.stdout).toMatch(/shard array job: \d+ \(3 tasks\)[^]*merged results in/);
    const files = resultFiles(join(dir, 'single'));
    expect(files).toContain('summary.json');
    for (const file of files) expect(readFileSync(join(out, file), 'utf8'), file).toBe(readFileSync(join(dir, 'single', file), 'utf8'));
    expect(readdirSync(join(out, 'logs')).filter((f) => /^shard-\d+_[123]\.out$/.test(f))).toHaveLength(3);
  }, 120_000);

  it('a failed shard cancels the merge job and submit.sh --wait exits 1 naming the shard', async () => {
    // common practice (sbatch documentation: afterok is never satisfied when a task fails, and
    // --kill-on-invalid-dep=yes then cancels the dependent job)
    const dir = makeTempDir();
    const out = join(dir, 'out');
    const written = await runJostle(['cluster', 'slurm', MODEL2, '--shards', '3', '--out', out, ...SMALL], { cwd: dir, env: slurm!.env(), timeoutMs: 30_000 });
    expect(written.status, written.stderr).toBe(0);
    mkdirSync(join(out, 'shards'));
    writeFileSync(join(out, 'shards', '2'), 'a file where shard 2 wants its folder\n');
    const r = runBash(join(out, 'cluster', 'submit.sh'), ['--wait'], slurm!.env({ JOSTLE_SLURM_POLL: '0.2' }) as Record<string, string>);
    expect(r.status, `${r.stdout}${r.stderr}\n${slurm!.logs()}`).toBe(1);
    expect(r.stderr).toContain('ended as CANCELLED');
    expect(r.stderr).toContain('shard 2: FAILED');
    expect(readdirSync(out)).not.toContain('summary.json');
  }, 120_000);
});
