/**
 * The run journal (`<out>/journal/`): a manifest describing the run and one JSON line per finished
 * replication, appended as soon as it finishes. An interrupted run keeps every finished replication;
 * `--resume` reads them back and runs only what is missing. The manifest's fingerprint (a hash of the
 * tool version, the resolved experiment, its points, the replication rule and the contents of its data
 * files) makes sure a journal is only resumed, or merged, with the same experiment.
 */
import { appendFileSync, existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { dataFileContents } from '../config/data-files.js';
import type { ExperimentConfig } from '../config/schema.js';
import { hashParts } from '../random/index.js';
import { writeFileAtomic } from '../report/files.js';
import { toolInfo } from '../version.js';
import type { PointSpec, ReplicationRule } from './plan.js';
import { recordFromJson, recordToJson } from './records.js';
import type { ReplicationRecord } from './replicate.js';

export interface Shard {
  /** 1-based slice number. */
  readonly index: number;
  readonly count: number;
}

export interface RunManifest {
  readonly format: 1;
  readonly tool: { readonly name: string; readonly version: string };
  readonly experiment: string;
  readonly fingerprint: string;
  readonly rule: ReplicationRule;
  readonly shard: Shard | null;
  readonly baseDir: string;
  readonly config: ExperimentConfig;
  readonly points: readonly PointSpec[];
  readonly complete: boolean;
}

/** Hash of what decides a run's results: tool version, experiment, points, rule and data files' contents. */
function fingerprintOf(config: ExperimentConfig, points: readonly PointSpec[], rule: ReplicationRule, baseDir: string): string {
  const data = dataFileContents([config, ...points.map((p) => p.config)], baseDir);
  return hashParts([toolInfo().version, JSON.stringify(config), JSON.stringify(points), JSON.stringify(rule), ...data]);
}

export function newManifest(config: ExperimentConfig, points: readonly PointSpec[], rule: ReplicationRule, shard: Shard | null, baseDir: string): RunManifest {
  const tool = toolInfo();
  return {
    format: 1,
    tool: { name: tool.name, version: tool.version },
    experiment: config.experiment,
    fingerprint: fingerprintOf(config, points, rule, baseDir),
    rule,
    shard,
    baseDir,
    config,
    points,
    complete: false,
  };
}

const MANIFEST = 'run.json';
/** What a finished run writes next to its journal (removed when a new run starts in the folder). */
const RESULT_FILES = ['summary.json', 'replications.csv', 'points.csv', 'report.html', 'plots'];
const TASKS = 'tasks.jsonl';

function journalDir(outDir: string): string {
  return join(outDir, 'journal');
}

/** A journal that cannot be read (a file damaged or edited by hand). */
export class JournalError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'JournalError';
  }
}

/** Reads a journal folder's manifest, or undefined when there is none. */
export function readManifest(outDir: string): RunManifest | undefined {
  const path = join(journalDir(outDir), MANIFEST);
  if (!existsSync(path)) return undefined;
  let manifest: unknown;
  try {
    manifest = JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    throw new JournalError(`${path} is damaged (${(error instanceof Error ? error.message : String(error)).replace(/\s+/g, ' ').trim()})`);
  }
  const m = manifest as Partial<RunManifest> | null;
  if (m === null || typeof m !== 'object' || m.format !== 1 || typeof m.fingerprint !== 'string' || !Array.isArray(m.points)) {
    throw new JournalError(`${path} is not a journal this version of jostle can read`);
  }
  return m as RunManifest;
}

/** Finished replications in a journal; a last line cut short by an interruption is ignored. */
export function readRecords(outDir: string): ReplicationRecord[] {
  const path = join(journalDir(outDir), TASKS);
  if (!existsSync(path)) return [];
  const lines = readFileSync(path, 'utf8').split('\n');
  const records: ReplicationRecord[] = [];
  lines.forEach((line, i) => {
    if (line.trim() === '') return;
    try {
      records.push(recordFromJson(line));
    } catch (error) {
      if (i < lines.length - 1 && lines.slice(i + 1).some((l) => l.trim() !== '')) {
        throw new JournalError(`${path}:${i + 1}: damaged line (${error instanceof Error ? error.message : String(error)})`);
      }
    }
  });
  return records;
}

export class Journal {
  private constructor(
    readonly outDir: string,
    private manifest: RunManifest,
    readonly previous: readonly ReplicationRecord[],
  ) {}

  /**
   * Starts a new journal, removing any earlier one and the result files of an earlier run in the
   * folder, so that an interrupted new run never sits next to the old run's results.
   */
  static fresh(outDir: string, manifest: RunManifest): Journal {
    const dir = journalDir(outDir);
    rmSync(dir, { recursive: true, force: true });
    for (const name of RESULT_FILES) rmSync(join(outDir, name), { recursive: true, force: true });
    mkdirSync(dir, { recursive: true });
    writeFileAtomic(join(dir, MANIFEST), `${JSON.stringify(manifest)}\n`);
    return new Journal(outDir, manifest, []);
  }

  /** Continues a journal of the same run; the caller checked the fingerprint. */
  static resume(outDir: string, manifest: RunManifest): Journal {
    const records = readRecords(outDir);
    writeFileAtomic(join(journalDir(outDir), MANIFEST), `${JSON.stringify({ ...manifest, complete: false })}\n`);
    return new Journal(outDir, manifest, records);
  }

  /** Appends one finished replication as a single write of one line. */
  append(record: ReplicationRecord): void {
    appendFileSync(join(journalDir(this.outDir), TASKS), `${recordToJson(record)}\n`);
  }

  markComplete(): void {
    this.manifest = { ...this.manifest, complete: true };
    writeFileAtomic(join(journalDir(this.outDir), MANIFEST), `${JSON.stringify(this.manifest)}\n`);
  }
}
