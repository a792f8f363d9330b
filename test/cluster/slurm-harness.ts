/**
 * A private single-node Slurm for end-to-end tests, under a fresh temporary folder: munged (as user
 * munge, with its own key and socket), slurmctld and slurmd in the foreground as child processes, and
 * a slurm.conf that client commands find through SLURM_CONF (use {@link SlurmCluster.env}). Nothing of
 * the machine's own Slurm or munge set-up is read or changed. The daemons are stopped by the PIDs
 * this module started (slurmd, slurmctld, then munged), never by name — also when the process exits.
 *
 * Needs root (munged is started as user munge; slurmd runs jobs as their owner) and the Debian
 * packages slurm-wlm and munge; {@link slurmAvailability} says why a test has to be skipped.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { chmodSync, chownSync, closeSync, existsSync, mkdirSync, mkdtempSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { availableParallelism, tmpdir, totalmem } from 'node:os';
import { join } from 'node:path';

/** Commands the harness runs; sbin folders are searched too, since slurmctld, slurmd and munged live there. */
const NEEDED = ['sbatch', 'squeue', 'sinfo', 'scontrol', 'scancel', 'slurmctld', 'slurmd', 'munged', 'setpriv'] as const;
const SEARCH_PATH = [process.env['PATH'] ?? '', '/usr/sbin', '/sbin', '/usr/local/sbin'].filter((p) => p !== '').join(':');

export const HOW_TO_ENABLE = 'run as root with the Debian packages slurm-wlm and munge installed (apt-get install slurm-wlm munge)';

export type Availability = { readonly ok: true; readonly paths: Readonly<Record<(typeof NEEDED)[number], string>> } | { readonly ok: false; readonly reason: string };

/** Whether a private Slurm can be started here, and if not, why. */
export function slurmAvailability(): Availability {
  if (process.platform !== 'linux') return { ok: false, reason: `Slurm tests run on Linux only (this is ${process.platform})` };
  if (process.getuid?.() !== 0) return { ok: false, reason: 'not running as root (munged must be started as user munge)' };
  const paths: Partial<Record<(typeof NEEDED)[number], string>> = {};
  const missing: string[] = [];
  for (const name of NEEDED) {
    const found = spawnSync('which', [name], { encoding: 'utf8', env: { ...process.env, PATH: SEARCH_PATH } });
    const path = found.status === 0 ? found.stdout.trim().split('\n')[0] : undefined;
    if (path === undefined || path === '') missing.push(name);
    else paths[name] = path;
  }
  if (missing.length > 0) return { ok: false, reason: `not installed: ${missing.join(', ')}` };
  if (spawnSync('id', ['-u', 'munge']).status !== 0) return { ok: false, reason: 'there is no user munge (install the munge package)' };
  return { ok: true, paths: paths as Record<(typeof NEEDED)[number], string> };
}

/** A running private Slurm. */
export interface SlurmCluster {
  /** The temporary folder holding configuration, state and logs. */
  readonly dir: string;
  /** Environment for client commands (SLURM_CONF set, sbin on PATH). */
  env(extra?: Record<string, string>): NodeJS.ProcessEnv;
  /** The last lines of the daemons' logs (for failure messages). */
  logs(): string;
  /** Cancels our jobs, stops slurmd, slurmctld and munged by PID, removes the folder. Idempotent. */
  stop(): Promise<void>;
}

/** A free TCP port on the loopback interface (asked of the OS). */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => (typeof address === 'object' && address !== null ? resolve(address.port) : reject(new Error('no port'))));
    });
  });
}

function slurmConf(dir: string, ports: readonly [number, number]): string {
  const cpus = Math.max(1, Math.min(2, availableParallelism()));
  const memory = Math.max(100, Math.min(2000, Math.floor((totalmem() / 2 ** 20) * 0.8)));
  return [
    'ClusterName=jostletest',
    'SlurmctldHost=localhost',
    `SlurmctldPort=${ports[0]}`,
    `SlurmdPort=${ports[1]}`,
    'SlurmUser=root',
    'SlurmdUser=root',
    'AuthType=auth/munge',
    'CredType=cred/munge',
    `AuthInfo=socket=${join(dir, 'munge', 'munge.socket')}`,
    'MpiDefault=none',
    'ProctrackType=proctrack/linuxproc',
    'TaskPlugin=task/none',
    'JobAcctGatherType=jobacct_gather/none',
    'AccountingStorageType=accounting_storage/none',
    'SelectType=select/cons_tres',
    'SelectTypeParameters=CR_Core',
    'SchedulerParameters=batch_sched_delay=0,sched_min_interval=0',
    'ReturnToService=2',
    `StateSaveLocation=${join(dir, 'state')}`,
    `SlurmdSpoolDir=${join(dir, 'spool')}`,
    `SlurmctldPidFile=${join(dir, 'slurmctld.pid')}`,
    `SlurmdPidFile=${join(dir, 'slurmd.pid')}`,
    `SlurmctldLogFile=${join(dir, 'log', 'slurmctld.log')}`,
    `SlurmdLogFile=${join(dir, 'log', 'slurmd.log')}`,
    `NodeName=localhost NodeAddr=127.0.0.1 CPUs=${cpus} RealMemory=${memory} State=UNKNOWN`,
    'PartitionName=debug Nodes=localhost Default=YES MaxTime=INFINITE State=UP',
    '',
  ].join('\n');
}

/** The munge folder: key (0400) and socket folder (0755), owned by munge. */
function prepareMunge(dir: string): void {
  const munge = join(dir, 'munge');
  mkdirSync(munge);
  const ids = spawnSync('id', ['-u', 'munge'], { encoding: 'utf8' });
  const gids = spawnSync('id', ['-g', 'munge'], { encoding: 'utf8' });
  const [uid, gid] = [Number(ids.stdout.trim()), Number(gids.stdout.trim())];
  writeFileSync(join(munge, 'munge.key'), randomBytes(1024), { mode: 0o400 });
  chownSync(join(munge, 'munge.key'), uid, gid);
  chownSync(munge, uid, gid);
  chmodSync(munge, 0o755);
}

function sleep(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

/** Starts munged, slurmctld and slurmd; resolves when sinfo shows the node idle (throws after `timeoutMs`). */
export async function startSlurm(timeoutMs = 30_000): Promise<SlurmCluster> {
  const available = slurmAvailability();
  if (!available.ok) throw new Error(`cannot start Slurm: ${available.reason}`);
  const p = available.paths;
  const dir = mkdtempSync(join(tmpdir(), 'jostle-slurm-'));
  chmodSync(dir, 0o755); // munged (user munge) must reach its folder
  for (const sub of ['state', 'spool', 'log']) mkdirSync(join(dir, sub));
  prepareMunge(dir);
  const conf = join(dir, 'slurm.conf');
  writeFileSync(conf, slurmConf(dir, [await freePort(), await freePort()]));
  const env = (extra: Record<string, string> = {}): NodeJS.ProcessEnv => ({ ...process.env, PATH: SEARCH_PATH, SLURM_CONF: conf, ...extra });
  const children: ChildProcess[] = [];
  const daemon = (name: string, command: string, args: readonly string[]): void => {
    const log = openSync(join(dir, 'log', `${name}.out`), 'a');
    children.push(spawn(command, args, { env: env(), stdio: ['ignore', log, log] }));
    closeSync(log);
  };
  const m = join(dir, 'munge');
  daemon('munged', p.setpriv, ['--reuid=munge', '--regid=munge', '--init-groups', p.munged, '-F', `--key-file=${join(m, 'munge.key')}`, `--socket=${join(m, 'munge.socket')}`, `--pid-file=${join(m, 'munged.pid')}`, `--seed-file=${join(m, 'munged.seed')}`, `--log-file=${join(m, 'munged.log')}`]);
  const cluster = makeCluster(dir, children, env, p);
  try {
    await waitFor(() => existsSync(join(m, 'munge.socket')), timeoutMs, 'munged did not create its socket');
    daemon('slurmctld', p.slurmctld, ['-D']);
    daemon('slurmd', p.slurmd, ['-D', '-N', 'localhost']);
    await waitFor(() => spawnSync(p.sinfo, ['-h', '-n', 'localhost', '-o', '%t'], { env: env(), encoding: 'utf8' }).stdout?.trim() === 'idle', timeoutMs, 'the node did not become idle');
  } catch (error) {
    const logs = cluster.logs();
    await cluster.stop();
    throw new Error(`${(error as Error).message}\n${logs}`);
  }
  return cluster;
}

async function waitFor(ready: () => boolean, timeoutMs: number, what: string): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!ready()) {
    if (Date.now() > end) throw new Error(`${what} within ${timeoutMs} ms`);
    await sleep(100);
  }
}

function tail(path: string, lines = 15): string {
  if (!existsSync(path)) return '';
  return `--- ${path}\n${readFileSync(path, 'utf8').trimEnd().split('\n').slice(-lines).join('\n')}\n`;
}

function alive(child: ChildProcess): boolean {
  return child.exitCode === null && child.signalCode === null;
}

function makeCluster(dir: string, children: ChildProcess[], env: SlurmCluster['env'], p: Record<(typeof NEEDED)[number], string>): SlurmCluster {
  let stopped = false;
  // Last resort when the test process ends without afterAll: stop by PID, newest daemon first.
  const onExit = (): void => {
    for (const child of [...children].reverse()) if (alive(child) && child.pid !== undefined) process.kill(child.pid, 'SIGTERM');
  };
  process.once('exit', onExit);
  return {
    dir,
    env,
    logs: () => ['munged.out', 'slurmctld.out', 'slurmd.out', 'slurmctld.log', 'slurmd.log'].map((f) => tail(join(dir, 'log', f))).join(''),
    async stop() {
      if (stopped) return;
      stopped = true;
      process.removeListener('exit', onExit);
      if (children.length >= 2) cancelOurJobs(env, p);
      for (const child of [...children].reverse()) await stopChild(child);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Cancels, by job id, every job still known to our private controller (all of them are ours). */
function cancelOurJobs(env: SlurmCluster['env'], p: Record<(typeof NEEDED)[number], string>): void {
  const listed = spawnSync(p.squeue, ['-h', '-o', '%A'], { env: env(), encoding: 'utf8', timeout: 5_000 });
  const ids = (listed.stdout ?? '').split('\n').map((s) => s.trim()).filter((s) => /^\d+$/.test(s));
  if (ids.length > 0) spawnSync(p.scancel, ids, { env: env(), timeout: 5_000 });
}

/** SIGTERM, then SIGKILL after 5 s; resolves when the child has exited. */
async function stopChild(child: ChildProcess): Promise<void> {
  if (!alive(child)) return;
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  child.kill('SIGTERM');
  const timer = setTimeout(() => child.kill('SIGKILL'), 5_000);
  await exited;
  clearTimeout(timer);
}
