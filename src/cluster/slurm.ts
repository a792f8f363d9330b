/**
 * Batch scripts that run one experiment on a Slurm cluster: a job array whose task i runs shard i
 * of N (`jostle run --shard i/N`), a merge job that combines the shard folders into the files an
 * unsharded run writes (`jostle merge`), and a submit script that queues both, the merge job
 * depending on the whole array (`--dependency=afterok:<array id>`). Pure text generation: nothing
 * here touches files or runs commands.
 *
 * Layout under the output folder OUT: `cluster/` the scripts, `logs/` the job logs,
 * `shards/<i>/` the partial result of shard i, and the merged files in OUT itself.
 */
import { posix } from 'node:path';
import { sbatchQuote, shellQuote } from './shell.js';
import { extraLine, slurmOptionProblems, type SlurmResources } from './slurm-options.js';

export type { SlurmResources } from './slurm-options.js';

/** File names of the generated scripts inside OUT/cluster/. */
export const SCRIPT_FILES = { shards: 'shards.sbatch', merge: 'merge.sbatch', submit: 'submit.sh' } as const;

/** Everything the scripts need; every path absolute. */
export interface SlurmJobSpec {
  /** The experiment's name (jobs are named `jostle-<name>` and `jostle-<name>-merge`). */
  readonly experiment: string;
  /** Number of array tasks N (≥ 1); task i runs shard i/N. */
  readonly shards: number;
  /** Absolute path of the node executable. */
  readonly node: string;
  /** Absolute path of jostle's entry script (bin/jostle.js). */
  readonly jostle: string;
  /** Absolute path of the experiment file. */
  readonly experimentFile: string;
  /** Absolute path of the output folder OUT. */
  readonly outDir: string;
  /** Options of `jostle run` (`--set`, `--vary`, `--combine`, `--reps`, `--seed`) with their values, passed on unchanged to every shard. */
  readonly runArgs: ReadonlyArray<readonly [string, string]>;
  readonly resources: SlurmResources;
}

/** The three generated scripts (bash text). */
export interface SlurmScripts {
  readonly shards: string;
  readonly merge: string;
  readonly submit: string;
}

/** Every problem with a spec (empty when the scripts can be written). */
export function slurmSpecProblems(spec: SlurmJobSpec): string[] {
  const problems = slurmOptionProblems(spec.shards, spec.resources);
  for (const [what, path] of [['node', spec.node], ['jostle entry', spec.jostle], ['experiment file', spec.experimentFile], ['output folder', spec.outDir]] as const) {
    if (!posix.isAbsolute(path)) problems.push(`the ${what} path must be absolute, got ${path}`);
    if (/[\n\r\0]/.test(path)) problems.push(`the ${what} path cannot contain a line break`);
  }
  if (spec.outDir.includes('%')) problems.push(`the output folder path cannot contain '%' (Slurm reads it as a log-name pattern): ${spec.outDir}`);
  for (const [flag, value] of spec.runArgs) if (value.includes('\0')) problems.push(`a ${flag} value cannot contain a NUL character`);
  return problems;
}

/** Thrown by {@link slurmScripts} for a spec with problems; `problems` lists them all. */
class SlurmSpecError extends Error {
  constructor(readonly problems: readonly string[]) {
    super(problems.join('\n'));
    this.name = 'SlurmSpecError';
  }
}

/** The three scripts for `spec`; throws {@link SlurmSpecError} listing every problem. */
export function slurmScripts(spec: SlurmJobSpec): SlurmScripts {
  const problems = slurmSpecProblems(spec);
  if (problems.length > 0) throw new SlurmSpecError(problems);
  return { shards: shardScript(spec), merge: mergeScript(spec), submit: submitScript(spec) };
}

/** `#SBATCH` lines shared by both jobs: site options, then the user's own lines (last, so they win). */
function siteLines(r: SlurmResources): string[] {
  const lines: string[] = [];
  if (r.partition !== undefined) lines.push(`#SBATCH --partition=${r.partition}`);
  if (r.account !== undefined) lines.push(`#SBATCH --account=${r.account}`);
  if (r.time !== undefined) lines.push(`#SBATCH --time=${r.time}`);
  if (r.mem !== undefined) lines.push(`#SBATCH --mem=${r.mem.toUpperCase()}`);
  return lines;
}

function userLines(r: SlurmResources): string[] {
  return r.extra.map((line) => extraLine(line)).flatMap((x) => ('line' in x ? [`#SBATCH ${x.line}`] : []));
}

/** Shell variables holding the absolute paths (quoted once, used as "$NAME" below). */
function pathVariables(spec: SlurmJobSpec, names: readonly ('NODE' | 'JOSTLE' | 'EXPERIMENT' | 'OUT')[]): string[] {
  const values = { NODE: spec.node, JOSTLE: spec.jostle, EXPERIMENT: spec.experimentFile, OUT: spec.outDir };
  return names.map((name) => `${name}=${shellQuote(values[name])}`);
}

function logPath(spec: SlurmJobSpec, name: string): string {
  return sbatchQuote(posix.join(spec.outDir, 'logs', name));
}

/** The job-array script: task i runs shard i/N into OUT/shards/i. */
function shardScript(spec: SlurmJobSpec): string {
  const r = spec.resources;
  const sets = spec.runArgs.map(([flag, value]) => ` \\\n  ${flag} ${shellQuote(value)}`).join('');
  return [
    '#!/usr/bin/env bash',
    `#SBATCH --job-name=jostle-${spec.experiment}`,
    `#SBATCH --array=1-${spec.shards}`,
    `#SBATCH --output=${logPath(spec, 'shard-%A_%a.out')}`,
    `#SBATCH --error=${logPath(spec, 'shard-%A_%a.err')}`,
    ...(r.cpus === undefined ? [] : [`#SBATCH --cpus-per-task=${r.cpus}`]),
    ...siteLines(r),
    ...userLines(r),
    `# Generated by \`jostle cluster slurm\` for experiment ${spec.experiment}.`,
    `# Array task i (1..${spec.shards}) runs shard i of ${spec.shards}: its share of the (point, replication)`,
    '# tasks, written to OUT/shards/i/. Submit with submit.sh, which also queues the merge job.',
    'set -euo pipefail',
    ...pathVariables(spec, ['NODE', 'JOSTLE', 'EXPERIMENT', 'OUT']),
    '# A resubmitted task (after a time limit or a node failure) continues its journal.',
    '# An empty array under `set -u` is an error before bash 4.4: expand it only when set.',
    'RESUME=()',
    'if [ -f "$OUT/shards/$SLURM_ARRAY_TASK_ID/journal/run.json" ]; then RESUME=(--resume); fi',
    `"$NODE" "$JOSTLE" run "$EXPERIMENT" --shard "$SLURM_ARRAY_TASK_ID/${spec.shards}" --out "$OUT/shards/$SLURM_ARRAY_TASK_ID" --workers "\${SLURM_CPUS_PER_TASK:-1}" --quiet \${RESUME[@]+"\${RESUME[@]}"}${sets}`,
    '',
  ].join('\n');
}

/** The merge script: combines OUT/shards/1..N into OUT. */
function mergeScript(spec: SlurmJobSpec): string {
  const r = spec.resources;
  return [
    '#!/usr/bin/env bash',
    `#SBATCH --job-name=jostle-${spec.experiment}-merge`,
    `#SBATCH --output=${logPath(spec, 'merge-%j.out')}`,
    `#SBATCH --error=${logPath(spec, 'merge-%j.err')}`,
    ...siteLines(r),
    ...userLines(r),
    `# Generated by \`jostle cluster slurm\`: merges the ${spec.shards} shard folders of experiment`,
    `# ${spec.experiment} into the files an unsharded \`jostle run\` writes. Queued by submit.sh to run`,
    '# after every array task has succeeded. Every shard folder is named, so a missing one is an error.',
    'set -euo pipefail',
    ...pathVariables(spec, ['NODE', 'JOSTLE', 'OUT']),
    'SHARDS=()',
    `for ((i = 1; i <= ${spec.shards}; i++)); do SHARDS+=("$OUT/shards/$i"); done`,
    '"$NODE" "$JOSTLE" merge "${SHARDS[@]}" --out "$OUT"',
    '',
  ].join('\n');
}

/**
 * The submit script: queues the array, then the merge job with `afterok` on the array (cancelled by
 * Slurm if a task fails), prints both job ids. With `--wait` it polls `squeue` (every
 * JOSTLE_SLURM_POLL seconds, default 5) until the merge job has left the queue and exits 0 only if
 * it completed. It does not use sacct, which needs Slurm's accounting database.
 */
function submitScript(spec: SlurmJobSpec): string {
  const cluster = posix.join(spec.outDir, 'cluster');
  return `#!/usr/bin/env bash
# Generated by \`jostle cluster slurm\`: submits the ${spec.shards} shard jobs of experiment ${spec.experiment}
# as one job array, and the merge job that runs once all of them have succeeded.
# Usage: bash submit.sh [--wait]
#   --wait  return when the merge job has ended; exit 0 only if it completed
#           (polls squeue every JOSTLE_SLURM_POLL seconds, default 5)
set -euo pipefail
${pathVariables(spec, ['OUT']).join('\n')}
CLUSTER=${shellQuote(cluster)}
WAIT=0
for arg in "$@"; do
  case "$arg" in
    --wait) WAIT=1 ;;
    *) echo "usage: $0 [--wait]" >&2; exit 2 ;;
  esac
done
for tool in sbatch squeue scontrol; do
  command -v "$tool" >/dev/null 2>&1 || { echo "submit.sh: $tool not found; run this where Slurm's commands are available (a login node)" >&2; exit 2; }
done
mkdir -p "$OUT/logs" "$OUT/shards"
ARRAY_ID=$(sbatch --parsable "$CLUSTER/${SCRIPT_FILES.shards}") || { echo "submit.sh: sbatch could not queue the shard array (see its message above); nothing was queued" >&2; exit 1; }
ARRAY_ID=\${ARRAY_ID%%;*}
MERGE_ID=$(sbatch --parsable --dependency="afterok:$ARRAY_ID" --kill-on-invalid-dep=yes "$CLUSTER/${SCRIPT_FILES.merge}") || {
  echo "submit.sh: the shard array $ARRAY_ID is queued but sbatch could not queue the merge job (see above); cancel the array with: scancel $ARRAY_ID" >&2
  exit 1
}
MERGE_ID=\${MERGE_ID%%;*}
echo "$ARRAY_ID $MERGE_ID" > "$CLUSTER/job-ids"
echo "shard array job: $ARRAY_ID (${spec.shards} tasks)"
echo "merge job: $MERGE_ID (runs after all shards succeed; logs in $OUT/logs)"
[ "$WAIT" = 1 ] || exit 0
POLL=\${JOSTLE_SLURM_POLL:-5}
while [ -n "$(squeue -h -j "$MERGE_ID" -o %i 2>/dev/null)" ]; do sleep "$POLL"; done
STATE=$(scontrol -o show job "$MERGE_ID" 2>/dev/null | sed -n 's/.* JobState=\\([A-Z_]*\\).*/\\1/p' || true)
if [ "$STATE" = COMPLETED ] || { [ -z "$STATE" ] && [ "$OUT/summary.json" -nt "$CLUSTER/job-ids" ]; }; then
  echo "merged results in $OUT"
  exit 0
fi
echo "submit.sh: merge job $MERGE_ID ended as \${STATE:-unknown}; results not merged. Logs: $OUT/logs" >&2
scontrol -o show job "$ARRAY_ID" 2>/dev/null | grep -v 'JobState=COMPLETED' | sed -n 's/.* ArrayTaskId=\\([0-9]*\\) .* JobState=\\([A-Z_]*\\).*/  shard \\1: \\2/p' >&2 || true
exit 1
`;
}
