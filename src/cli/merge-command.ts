/** `jostle merge DIR… --out OUT`: combine shard folders into the files one unsharded run writes. */
import { join } from 'node:path';
import { renderConfig } from '../config/load.js';
import { assembleResults } from '../experiment/engine.js';
import { readManifest, readRecords, type RunManifest } from '../experiment/journal.js';
import type { ReplicationRecord } from '../experiment/replicate.js';
import { writeRunOutputs } from '../report/outputs.js';
import { resultTable } from '../report/table.js';
import { EXIT_OK, EXIT_USAGE, UserFacingError } from './exit.js';

export function mergeCommand(folders: readonly string[], outDir: string, quiet: boolean): number {
  const manifests: Array<{ folder: string; manifest: RunManifest }> = [];
  for (const folder of folders) {
    const manifest = readManifest(folder);
    if (manifest === undefined) throw new UserFacingError(`${folder} holds no jostle run (no journal/run.json)`, EXIT_USAGE);
    manifests.push({ folder, manifest });
  }
  const first = manifests[0];
  if (first === undefined) throw new UserFacingError('name at least one shard folder', EXIT_USAGE);
  for (const { folder, manifest } of manifests) {
    if (manifest.fingerprint !== first.manifest.fingerprint) {
      throw new UserFacingError(`${folder} belongs to a different run than ${first.folder} (experiment, settings or jostle version differ)`, EXIT_USAGE);
    }
    if (!manifest.complete) throw new UserFacingError(`${folder} is not complete (interrupted?): finish it with --resume first`, EXIT_USAGE);
  }
  const count = first.manifest.shard?.count ?? 1;
  const seen = new Map<number, string>();
  for (const { folder, manifest } of manifests) {
    const index = manifest.shard?.index ?? 1;
    if ((manifest.shard?.count ?? 1) !== count) throw new UserFacingError(`${folder} is a shard of ${manifest.shard?.count ?? 1}, not of ${count}`, EXIT_USAGE);
    if (seen.has(index)) throw new UserFacingError(`${folder} and ${seen.get(index) ?? ''} are both shard ${index}/${count}`, EXIT_USAGE);
    seen.set(index, folder);
  }
  const missing = Array.from({ length: count }, (_, k) => k + 1).filter((k) => !seen.has(k));
  if (missing.length > 0) throw new UserFacingError(`shard${missing.length > 1 ? 's' : ''} ${missing.map((k) => `${k}/${count}`).join(', ')} missing`, EXIT_USAGE);

  const records = new Map<string, ReplicationRecord>();
  for (const { folder } of manifests) {
    for (const record of readRecords(folder)) records.set(`${record.point}/${record.replication}`, record);
  }
  const { config, points, rule } = first.manifest;
  const results = assembleResults(points, rule, [...records.values()]);
  if (typeof results === 'string') throw new UserFacingError(`the shards are incomplete: ${results}`, EXIT_USAGE);
  const result = { config, rule, points: results };
  const written = writeRunOutputs(outDir, result, renderConfig(config));
  process.stdout.write(`${config.experiment} · seed ${String(config.seed)} · merged from ${count} shard${count === 1 ? '' : 's'}\n\n`);
  process.stdout.write(resultTable(result));
  if (!quiet) process.stderr.write(`wrote ${written.files.map((f) => join(outDir, f)).join(', ')}\n`);
  return EXIT_OK;
}
