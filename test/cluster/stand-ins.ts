/**
 * Running generated scripts with plain bash, with stand-ins in place of jostle and of Slurm's client
 * commands, so that the scripts' behaviour is checked without a cluster: the jostle stand-in prints
 * the arguments it received as JSON; the sbatch, squeue and scontrol stand-ins append their arguments
 * to a call log and answer from text files that the test writes.
 */
import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { repoFile, requireBuild } from '../cli/run-cli.js';

/** What a bash run returned. */
export interface BashResult {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

/** Runs `bash script args…` with extra environment variables. */
export function runBash(script: string, args: readonly string[], env: Record<string, string>): BashResult {
  const child = spawnSync('bash', [script, ...args], { encoding: 'utf8', env: { ...process.env, ...env }, timeout: 20_000 });
  if (child.error !== undefined) throw child.error;
  return { status: child.status, stdout: child.stdout, stderr: child.stderr };
}

/** Writes a jostle stand-in into `dir` that prints its arguments (after the script path) as JSON. */
export function writeArgvEcho(dir: string): string {
  const path = join(dir, 'argv-echo.mjs');
  writeFileSync(path, 'process.stdout.write(JSON.stringify(process.argv.slice(2)));\n');
  return path;
}

/**
 * Fake sbatch/squeue/scontrol in `dir/bin`: each call appends `name args…` (one line, arguments
 * joined by a tab) to `dir/calls`. sbatch prints the next job id from 101 up; squeue prints nothing
 * (the job has left the queue); `scontrol -o show job ID` prints `jobs[ID]` (nothing if absent).
 */
export function writeFakeSlurm(dir: string, jobs: Readonly<Record<string, string>>): { path: string; calls: () => string[][] } {
  const bin = join(dir, 'bin');
  const log = join(dir, 'calls');
  spawnSync('rm', ['-rf', bin]);
  spawnSync('mkdir', ['-p', bin]);
  for (const [id, text] of Object.entries(jobs)) writeFileSync(join(bin, `job-${id}.txt`), text);
  writeFileSync(log, '');
  const record = `(IFS=$'\\t'; echo "$(basename "$0")"$'\\t'"$*") >> '${log}'`;
  const scripts: Record<string, string> = {
    sbatch: `${record}\nn=$(grep -c '^sbatch' '${log}')\necho "$((100 + n))"\n`,
    squeue: `${record}\n`,
    scontrol: `${record}\ncat "$(dirname "$0")/job-$4.txt" 2>/dev/null || true\n`,
  };
  for (const [name, body] of Object.entries(scripts)) {
    writeFileSync(join(bin, name), `#!/usr/bin/env bash\n${body}`);
    chmodSync(join(bin, name), 0o755);
  }
  const calls = (): string[][] =>
    readFileSync(log, 'utf8')
      .trimEnd()
      .split('\n')
      .filter((l) => l !== '')
      .map((l) => l.split('\t'));
  return { path: `${bin}:${process.env['PATH'] ?? ''}`, calls };
}

/** Runs the built `node bin/jostle.js …args` with a given environment (for Slurm's SLURM_CONF); resolves on exit. */
export function runJostle(args: readonly string[], o: { cwd: string; env: NodeJS.ProcessEnv; timeoutMs: number }): Promise<BashResult> {
  requireBuild();
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [repoFile('bin/jostle.js'), ...args], { cwd: o.cwd, env: o.env, timeout: o.timeoutMs, stdio: ['ignore', 'pipe', 'pipe'] });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (chunk: Buffer) => out.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => err.push(chunk));
    child.on('error', reject);
    child.on('close', (status) => resolve({ status, stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8') }));
  });
}
