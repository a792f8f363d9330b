/**
 * Benchmark harness: `node dist/bench/main.js [case ...] [--json]`.
 * Runs the named cases (all by default), prints a table (or, with --json, only the JSON) and writes
 * the figures with the machine basics to results/bench/latest.json (not a deterministic output).
 */
import { cpus, totalmem, platform, arch } from 'node:os';
import { join } from 'node:path';
import { writeFileAtomic } from '../src/report/files.js';
import { KERNEL_CASE_ID, repoRoot, simulatorCases } from './cases.js';
import { benchKernel, type KernelBenchResult } from './kernel.js';
import { runCase, type CaseResult } from './runner.js';

interface KernelResult extends KernelBenchResult {
  readonly kind: 'kernel';
  readonly id: string;
}

type Result = CaseResult | KernelResult;

interface Args {
  readonly ids: readonly string[];
  readonly json: boolean;
}

function parseArgs(argv: readonly string[], known: readonly string[]): Args {
  const ids: string[] = [];
  let json = false;
  for (const a of argv) {
    if (a === '--json') json = true;
    else if (known.includes(a)) ids.push(a);
    else throw new Error(`bench: unknown ${a.startsWith('-') ? 'option' : 'case'} '${a}'; cases: ${known.join(', ')}; option: --json`);
  }
  return { ids: ids.length > 0 ? ids : known, json };
}

interface Machine {
  readonly node: string;
  readonly platform: string;
  readonly arch: string;
  readonly cpus: number;
  readonly cpuModel: string;
  readonly totalMemoryMiB: number;
}

function machine(): Machine {
  const list = cpus();
  return {
    node: process.version,
    platform: platform(),
    arch: arch(),
    cpus: list.length,
    cpuModel: list[0]?.model.trim() ?? 'unknown',
    totalMemoryMiB: Math.round(totalmem() / (1024 * 1024)),
  };
}

const f = (x: number, digits = 0): string => x.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
const millions = (x: number): string => `${f(x / 1e6, 2)} M`;

function simulatorTable(rows: readonly CaseResult[]): string {
  const head = ['case', 'reps', 'wall ms med', 'min', 'max', 'events/rep', 'events/s', 'sim/wall', 'packets/s', 'maxRSS MiB', 'heap MiB'];
  const body = rows.map((r) => [
    r.id,
    String(r.replications),
    f(r.wallMs.median, 1),
    f(r.wallMs.min, 1),
    f(r.wallMs.max, 1),
    f(r.eventsPerReplication.median),
    millions(r.eventsPerSecond),
    `${f(r.simulatedPerWall, 1)}×`,
    f(r.packetsPerSecond),
    f(r.maxRssMiB, 1),
    f(r.heapUsedMiB, 1),
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...body.map((row) => (row[i] as string).length)));
  const line = (cells: readonly string[]): string => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i] as number) : c.padStart(widths[i] as number))).join('  ');
  return [line(head), ...body.map(line)].join('\n');
}

function kernelLines(k: KernelResult): string {
  return [
    `kernel (event queue, hold model, ${f(k.pairs)} push+pop pairs):`,
    `  whole-number times (wheel): ${millions(k.pairsPerSecond)} pairs/s (${f(k.seconds, 3)} s)`,
    `  fractional times (heap):    ${millions(k.heapOnlyPairsPerSecond)} pairs/s`,
  ].join('\n');
}

async function main(): Promise<void> {
  const cases = simulatorCases();
  const args = parseArgs(process.argv.slice(2), [...cases.map((c) => c.id), KERNEL_CASE_ID]);
  const log = (text: string): void => {
    if (!args.json) process.stderr.write(`${text}\n`);
  };
  const results: Result[] = [];
  for (const id of args.ids) {
    if (id === KERNEL_CASE_ID) {
      log('kernel …');
      results.push({ kind: 'kernel', id, ...(await benchKernel()) });
      continue;
    }
    const c = cases.find((x) => x.id === id);
    if (c === undefined) continue;
    log(`${id}: ${c.description} (warm-up + ${c.replications} replications)`);
    results.push(runCase(c, (t) => log(`  replication ${t.replication}: ${f(t.wallMs, 1)} ms, ${f(t.events)} events`)));
  }
  const document = {
    timestamp: new Date().toISOString(),
    machine: machine(),
    notes: 'Medians over timed replications; maxRssMiB is the process peak so far, read after each case (cases run in order).',
    results,
  };
  const json = `${JSON.stringify(document, null, 2)}\n`;
  // Only a run of every case replaces the kept baseline; a subset goes next to it.
  const all = args.ids.length === cases.length + 1;
  const out = join(repoRoot(), 'results', 'bench', all ? 'latest.json' : 'subset.json');
  writeFileAtomic(out, json);
  if (args.json) {
    process.stdout.write(json);
    return;
  }
  const sims = results.filter((r): r is CaseResult => r.kind === 'simulator');
  const parts = sims.length > 0 ? [simulatorTable(sims)] : [];
  for (const r of results) if (r.kind === 'kernel') parts.push(kernelLines(r));
  const m = document.machine;
  console.log(`node ${m.node}, ${m.cpus} × ${m.cpuModel}, ${f(m.totalMemoryMiB)} MiB\n`);
  console.log(parts.join('\n\n'));
  console.log(`\nwritten: ${out}`);
}

main().catch((e: unknown) => {
  process.stderr.write(`${e instanceof Error ? e.message : String(e)}\n`);
  process.exitCode = 2;
});
