/**
 * The job options of `jostle cluster slurm` and their checks. Formats follow the sbatch manual:
 * `--time` as minutes, minutes:seconds, hours:minutes:seconds, days-hours, days-hours:minutes or
 * days-hours:minutes:seconds; `--mem` as a whole number with an optional K, M, G or T suffix
 * (megabytes without one).
 */

/** Resources and site options asked of Slurm for the shard jobs (and, where it makes sense, the merge job). */
export interface SlurmResources {
  /** Partition (queue) name or comma-separated list. */
  readonly partition?: string;
  /** Wall-clock limit per job, in an sbatch time format (e.g. `30`, `1:30:00`, `2-00:00:00`). */
  readonly time?: string;
  /** CPUs per shard job (`--cpus-per-task`); the shard runs that many worker threads. */
  readonly cpus?: number;
  /** Memory per node, e.g. `2G` or `500M` (`--mem`). */
  readonly mem?: string;
  /** Account to charge (`--account`). */
  readonly account?: string;
  /** Further sbatch options, one per line, written as `#SBATCH <line>` (e.g. `--qos=long`). */
  readonly extra: readonly string[];
}

const NUMBER = String.raw`\d+`;
const TWO = String.raw`\d{1,2}`;
/** The six time formats of `sbatch --time`. */
const TIME_FORMATS: readonly RegExp[] = [
  new RegExp(`^(${NUMBER})$`),
  new RegExp(`^(${NUMBER}):(${TWO})$`),
  new RegExp(`^(${NUMBER}):(${TWO}):(${TWO})$`),
  new RegExp(`^(${NUMBER})-(${TWO})$`),
  new RegExp(`^(${NUMBER})-(${TWO}):(${TWO})$`),
  new RegExp(`^(${NUMBER})-(${TWO}):(${TWO}):(${TWO})$`),
];

/** A problem with `--time`, or undefined when it is a valid sbatch time limit. */
export function timeProblem(time: string): string | undefined {
  const expected = 'expected minutes (`30`), `MM:SS`, `HH:MM:SS`, `D-HH`, `D-HH:MM` or `D-HH:MM:SS`, e.g. `1:30:00` or `2-00:00:00`';
  if (/^(UNLIMITED|INFINITE)$/i.test(time)) return undefined;
  const match = TIME_FORMATS.map((re) => re.exec(time)).find((m) => m !== null);
  if (match === undefined || match === null) return `--time: \`${time}\` is not a Slurm time limit; ${expected}`;
  const fields = match.slice(2).map(Number);
  const hasDays = time.includes('-');
  // After the first field: hours (< 24) when days are given, then minutes and seconds (< 60).
  const limits = hasDays ? [24, 60, 60] : [60, 60];
  if (fields.some((value, i) => value >= (limits[i] ?? 60))) return `--time: \`${time}\` has a field out of range (hours < 24, minutes and seconds < 60); ${expected}`;
  return undefined;
}

/** A problem with `--mem`, or undefined when it is a valid sbatch memory size. */
export function memProblem(mem: string): string | undefined {
  if (/^[1-9]\d*[KMGT]?$/i.test(mem)) return undefined;
  const hint = /^\d+\s*[KMGT]i?B$/i.test(mem) ? ` (write \`${mem.replace(/\s*([KMGT])i?B$/i, '$1').toUpperCase()}\`)` : '';
  return `--mem: \`${mem}\` is not a Slurm memory size${hint}; expected a whole number ≥ 1 with an optional K, M, G or T suffix (megabytes without one), e.g. \`2G\` or \`500M\``;
}

/** Names Slurm takes for partitions and accounts (a comma-separated list for partitions). */
const SITE_NAME = /^[A-Za-z0-9_][A-Za-z0-9_.+-]*(,[A-Za-z0-9_][A-Za-z0-9_.+-]*)*$/;

/** The extra option line without a leading `#SBATCH`, or a problem. */
export function extraLine(line: string): { line: string } | { problem: string } {
  const text = line.trim().replace(/^#SBATCH\s+/, '');
  if (/[\n\r\0]/.test(text)) return { problem: `--sbatch: an option line cannot contain a line break: ${JSON.stringify(line)}` };
  if (!text.startsWith('-')) return { problem: `--sbatch: \`${line}\` is not an sbatch option; expected an option such as \`--qos=long\` or \`--constraint=avx2\`` };
  if (/^(--array\b|-a\b)/.test(text)) return { problem: '--sbatch: the array range is set by --shards; do not give --array' };
  return { line: text };
}

/** Every problem with the number of shards and the resource options (empty when all is well). */
export function slurmOptionProblems(shards: number, r: SlurmResources): string[] {
  const problems: string[] = [];
  if (!Number.isInteger(shards) || shards < 1) problems.push(`--shards must be a whole number ≥ 1, got ${String(shards)}`);
  if (r.cpus !== undefined && !(Number.isInteger(r.cpus) && r.cpus >= 1)) problems.push(`--cpus must be a whole number ≥ 1, got ${String(r.cpus)}`);
  if (r.time !== undefined) problems.push(...optional(timeProblem(r.time)));
  if (r.mem !== undefined) problems.push(...optional(memProblem(r.mem)));
  for (const [flag, value] of [['--partition', r.partition], ['--account', r.account]] as const) {
    if (value !== undefined && !SITE_NAME.test(value)) problems.push(`${flag}: \`${value}\` is not a Slurm name (letters, digits, '_', '.', '+', '-'; partitions may be a comma-separated list)`);
  }
  for (const line of r.extra) {
    const checked = extraLine(line);
    if ('problem' in checked) problems.push(checked.problem);
  }
  return problems;
}

function optional(problem: string | undefined): string[] {
  return problem === undefined ? [] : [problem];
}
