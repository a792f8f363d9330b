/**
 * The benchmark cases. A simulator case is an experiment text (loaded through the real config path)
 * plus how many timed replications to run; adding a case is one entry in {@link simulatorCases}.
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export interface SimulatorCase {
  readonly id: string;
  readonly description: string;
  /** Experiment YAML text, loaded with loadExperimentText. */
  readonly yaml: string;
  /** `--set` overrides applied to the text (same syntax as the command line). */
  readonly sets?: readonly string[];
  /** Timed replications (one untimed warm-up replication runs before them). */
  readonly replications: number;
}

/** Id of the event-queue benchmark (bench/kernel.ts), run after the simulator cases. */
export const KERNEL_CASE_ID = 'kernel';

/** The repository root: the nearest folder above this file holding package.json. */
export function repoRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  while (!existsSync(join(dir, 'package.json'))) {
    const parent = dirname(dir);
    if (parent === dir) throw new Error('bench: package.json not found above the bench folder');
    dir = parent;
  }
  return dir;
}

function referenceConfig(name: string): string {
  return readFileSync(join(repoRoot(), 'configs', 'reference', name), 'utf8');
}

const PERIODIC_50K = `experiment: bench-periodic-50k
description: 50,000 periodic reporters (every 15 min, up to 30 s late) over one hour, default contention.
seed: 15
horizon: 1h
groups:
  reporters:
    count: 50000
    traffic: { model: periodic, period: 15min, jitter: 30s }
`;

export function simulatorCases(): SimulatorCase[] {
  return [
    {
      id: 'burst',
      description: 'TR 37.868 traffic model 2, 30,000 devices, contention',
      yaml: referenceConfig('tr37868-model2.yaml'),
      sets: ['groups.mtc.count=30000'],
      replications: 10,
    },
    {
      id: 'periodic-50k',
      description: '50,000 periodic reporters (15 min, jitter 30 s), 1 h, contention',
      yaml: PERIODIC_50K,
      replications: 3,
    },
  ];
}
