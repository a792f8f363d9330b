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

/**
 * A city cell (our own scenario): 52,547 devices — the TR 45.820 cell dimensioning, from memory —
 * of which 50,000 meters with the TR 45.820 periodic mix (1 d / 2 h / 1 h / 30 min at 40/40/15/5 %,
 * from memory) on configured grants, and 2,547 alarm sensors with correlated alarms contending.
 */
const CITY_GROUPS = `groups:
  meters:
    count: 50000
    traffic:
      model: periodic
      mix:
        - { period: 1d, share: 0.4 }
        - { period: 2h, share: 0.4 }
        - { period: 1h, share: 0.15 }
        - { period: 30min, share: 0.05 }
      jitter: 30s
    access: { policy: configured-grant, period: 30min }
  alarms:
    count: 2547
    layout: { model: clustered }
    traffic: { model: alarm-field, event_interval: 10min, sigma: 100m, report_delay: 2s }
`;

const CITY = `experiment: bench-city
description: 52,547 devices, 24 h, periodic meters on configured grants and correlated alarms contending.
seed: 45820
horizon: 24h
${CITY_GROUPS}`;

/** The city's traffic with ten times as many devices that never send. */
const IDLE = `${CITY.replace('experiment: bench-city', 'experiment: bench-idle')}  bystanders:
    count: 525470
    traffic: { model: silent }
`;

/**
 * IMT-2020 density (1,000,000 devices per km², ITU-R M.2410, from memory) in one cell for an hour:
 * 950,000 reporters every 15 min with jitter on predicted grants (periodic predictor) and 50,000
 * alarm sensors on predicted grants (neighbour predictor), both falling back to contention.
 */
const MILLION = `experiment: bench-million
description: 1,000,000 devices, 1 h, periodic reports and an alarm field on predicted grants with contention fallback.
seed: 2410
horizon: 1h
cell:
  radius: 564m
  uplink: { capacity: 20 }
groups:
  reporters:
    count: 950000
    traffic: { model: periodic, period: 15min, jitter: 1min }
    access: { policy: predicted-grant, predictor: { model: periodic }, fallback_after: 30ms }
  alarms:
    count: 50000
    traffic: { model: alarm-field, event_interval: 5min, sigma: 50m, report_delay: 1s }
    access: { policy: predicted-grant, predictor: { model: neighbour }, grants_per_occasion: 4, fallback_after: 30ms }
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
    { id: 'city', description: '52,547 devices (TR 45.820 mix on configured grants + alarms), 24 h', yaml: CITY, replications: 2 },
    { id: 'idle', description: 'the city traffic with 525,470 more devices that never send', yaml: IDLE, replications: 2 },
    { id: 'million', description: '1,000,000 devices, 1 h, predicted grants with contention fallback', yaml: MILLION, replications: 1 },
  ];
}
