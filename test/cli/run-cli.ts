/**
 * Runs the built `jostle` command the way a user does: `node bin/jostle.js …` in a child process,
 * with a fresh temporary folder as working directory (so `results/` lands there, not in the repo).
 * The tests exercise dist/, so `npm run build` must have run first (the npm test script does it).
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Absolute path of the repository root. */
export const REPO_ROOT = fileURLToPath(new URL('../../', import.meta.url));

/** The command's entry script and the compiled code it loads. */
const BIN = join(REPO_ROOT, 'bin', 'jostle.js');
const BUILT_MAIN = join(REPO_ROOT, 'dist', 'src', 'cli', 'main.js');

/** Absolute path of a file of the repository, e.g. `configs/reference/tr37868-model2.yaml`. */
export function repoFile(relative: string): string {
  return join(REPO_ROOT, relative);
}

/** What one command run returned. `status` is null when the process was killed. */
export interface CliResult {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
  /** The working directory the command ran in. */
  readonly cwd: string;
}

/** Temporary folders made by this module, removed by {@link removeTempDirs}. */
const made: string[] = [];

/** A fresh empty folder under the OS temporary directory. */
export function makeTempDir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'jostle-cli-'));
  made.push(dir);
  return dir;
}

/** Removes every folder made by {@link makeTempDir} in this test file (call from afterAll). */
export function removeTempDirs(): void {
  for (const dir of made.splice(0)) rmSync(dir, { recursive: true, force: true });
}

/** Throws a clear message when dist/ has not been built. */
export function requireBuild(): void {
  if (!existsSync(BUILT_MAIN)) {
    throw new Error(`the compiled command is missing (${BUILT_MAIN}); run \`npm run build\` before these tests`);
  }
}

/**
 * Runs `node bin/jostle.js ...args` and waits for it. `cwd` defaults to a fresh temporary folder.
 * Colour is turned off so that outputs compare as plain text. Timeout in milliseconds.
 */
export function runCli(args: readonly string[], options: { cwd?: string; timeoutMs?: number } = {}): CliResult {
  requireBuild();
  const cwd = options.cwd ?? makeTempDir();
  const child = spawnSync(process.execPath, [BIN, ...args], {
    cwd,
    encoding: 'utf8',
    timeout: options.timeoutMs ?? 30_000,
    env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: '0' },
  });
  if (child.error !== undefined) throw child.error;
  return { status: child.status, stdout: child.stdout, stderr: child.stderr, cwd };
}

/**
 * Like {@link runCli}, but without blocking, so that the tests of one file can run their commands
 * side by side (`describe.concurrent`). Resolves when the process has exited.
 */
export function runCliAsync(args: readonly string[], options: { cwd?: string; timeoutMs?: number } = {}): Promise<CliResult> {
  requireBuild();
  const cwd = options.cwd ?? makeTempDir();
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [BIN, ...args], {
      cwd,
      timeout: options.timeoutMs ?? 30_000,
      env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: '0' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (chunk: Buffer) => out.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => err.push(chunk));
    child.on('error', reject);
    child.on('close', (status) => {
      resolve({ status, stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8'), cwd });
    });
  });
}

/** Writes `text` to `dir/name` (creating folders) and returns the path. */
export function writeText(dir: string, name: string, text: string): string {
  const path = join(dir, name);
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, text);
  return path;
}

/** Reads a UTF-8 file. */
export function readText(path: string): string {
  return readFileSync(path, 'utf8');
}

