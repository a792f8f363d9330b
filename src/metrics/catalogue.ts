/**
 * The metric catalogue: every number a replication reports, with its unit and meaning.
 *
 * A metric is a pure function of a tally (one group, or the whole cell) and the cell context. Adding a
 * metric is one entry here (plus a ledger counter if it needs a new observation). Names are snake_case
 * and carry their unit; definitions follow the reference contention procedure (3GPP TR 37.868 where it
 * defines them).
 */
import type { CellContext, Tally } from './tally.js';

/** What decides which metrics an experiment reports: known from its configuration alone. */
export type MetricConditions = Pick<CellContext, 'barring' | 'anyDeadline' | 'grants' | 'predictors' | 'fallback' | 'horizon'>;

/** The shape of a configuration that `conditionsOf` reads (an experiment config, or a point's). */
interface ConditionSource {
  readonly horizon?: number | undefined;
  readonly cell: { readonly random_access: { readonly barring?: unknown } };
  readonly groups: Readonly<Record<string, { readonly deadline?: number | undefined; readonly access: { readonly policy: string; readonly fallback_after?: number | undefined } }>>;
}

/** The metric conditions of a configuration. */
export function conditionsOf(e: ConditionSource): MetricConditions {
  const groups = Object.values(e.groups);
  return {
    barring: e.cell.random_access.barring !== undefined,
    anyDeadline: groups.some((g) => g.deadline !== undefined && Number.isFinite(g.deadline)),
    grants: groups.some((g) => g.access.policy !== 'contention'),
    predictors: groups.some((g) => g.access.policy === 'predicted-grant'),
    fallback: groups.some((g) => g.access.policy !== 'contention' && g.access.fallback_after !== undefined),
    horizon: e.horizon !== undefined && Number.isFinite(e.horizon),
  };
}

export type MetricScope = 'cell' | 'cell-and-groups';

export interface MetricDefinition {
  readonly name: string;
  readonly unit: string;
  readonly description: string;
  readonly scope: MetricScope;
  /** When present, the metric is reported only if this holds for the experiment. */
  readonly when?: (c: MetricConditions) => boolean;
  value(t: Tally, c: CellContext): number;
}

const ratio = (a: number, b: number): number => (b > 0 ? a / b : Number.NaN);
const perOccasion = (x: number, c: CellContext): number => ratio(x, c.occasionsCounted);
const perSecond = (x: number, c: CellContext): number => ratio(x, c.observationMs / 1000);
const started = (t: Tally): number => t.arrived;

const delayQuantile = (q: number) => (t: Tally): number => t.delay.quantile(q);

/**
 * q-quantile of the preamble transmissions of completed accesses that contended: the smallest k with
 * P(K ≤ k) ≥ q, from the exact counts per k (no binning).
 */
const transmissionsQuantile = (q: number) => (t: Tally): number => {
  const byTx = t.completedByTx;
  let total = 0;
  for (let k = 1; k < byTx.length; k++) total += byTx[k] as number;
  if (total === 0) return Number.NaN;
  let below = 0;
  for (let k = 1; k < byTx.length; k++) {
    below += byTx[k] as number;
    if (below >= q * total) return k;
  }
  return byTx.length - 1;
};

export const metricCatalogue: readonly MetricDefinition[] = [
  {
    name: 'access_success_probability',
    unit: '1',
    description: 'Accesses completed / accesses started (TR 37.868).',
    scope: 'cell-and-groups',
    value: (t) => ratio(t.completed, started(t)),
  },
  {
    name: 'drop_probability',
    unit: '1',
    description: 'Accesses given up (preamble transmission limit or maximum wait) / accesses started.',
    scope: 'cell-and-groups',
    value: (t) => ratio(t.dropped, started(t)),
  },
  {
    name: 'collision_probability_per_device',
    unit: '1',
    description: 'Preamble transmissions that collided / preamble transmissions.',
    scope: 'cell-and-groups',
    value: (t) => ratio(t.collidedTx, t.preambleTx),
  },
  {
    name: 'collision_probability_per_rao',
    unit: '1',
    description:
      'Collided preambles / (occasions × preambles), over the occasions from the first to the last one in which any preamble was sent (TR 37.868 per-opportunity definition).',
    scope: 'cell',
    value: (_t, c) => ratio(c.collidedPreambles, c.occasionsCounted * c.preambles),
  },
  {
    name: 'idle_preamble_probability',
    unit: '1',
    description: 'Preambles chosen by nobody / (occasions × preambles), same occasions as above.',
    scope: 'cell',
    value: (_t, c) => ratio(c.occasionsCounted * c.preambles - c.usedPreambles, c.occasionsCounted * c.preambles),
  },
  {
    name: 'singleton_preamble_probability',
    unit: '1',
    description: 'Preambles chosen by exactly one device / (occasions × preambles), same occasions as above.',
    scope: 'cell',
    value: (_t, c) => ratio(c.singletonPreambles, c.occasionsCounted * c.preambles),
  },
  {
    name: 'mean_preamble_transmissions',
    unit: 'transmissions',
    description: 'Preamble transmissions per completed access, over completed accesses that contended.',
    scope: 'cell-and-groups',
    value: (t) => {
      let n = 0;
      for (let k = 1; k < t.completedByTx.length; k++) n += t.completedByTx[k] as number;
      return ratio(t.completedPreambleTx, n);
    },
  },
  {
    name: 'preamble_transmissions_p50',
    unit: 'transmissions',
    description: 'Preamble transmissions per completed access that contended, median (smallest k with P(K ≤ k) ≥ 0.5).',
    scope: 'cell-and-groups',
    value: transmissionsQuantile(0.5),
  },
  {
    name: 'preamble_transmissions_p90',
    unit: 'transmissions',
    description: 'Preamble transmissions per completed access that contended, 90th percentile.',
    scope: 'cell-and-groups',
    value: transmissionsQuantile(0.9),
  },
  {
    name: 'preamble_transmissions_p99',
    unit: 'transmissions',
    description: 'Preamble transmissions per completed access that contended, 99th percentile.',
    scope: 'cell-and-groups',
    value: transmissionsQuantile(0.99),
  },
  {
    name: 'delay_mean_ms',
    unit: 'ms',
    description:
      'Access delay (arrival → delivery; for generate-at-will traffic, from the start of the transmission that delivered the packet), mean over completed accesses.',
    scope: 'cell-and-groups',
    value: (t) => t.delay.mean(),
  },
  { name: 'delay_p50_ms', unit: 'ms', description: 'Access delay, median.', scope: 'cell-and-groups', value: delayQuantile(0.5) },
  { name: 'delay_p90_ms', unit: 'ms', description: 'Access delay, 90th percentile.', scope: 'cell-and-groups', value: delayQuantile(0.9) },
  { name: 'delay_p95_ms', unit: 'ms', description: 'Access delay, 95th percentile.', scope: 'cell-and-groups', value: delayQuantile(0.95) },
  { name: 'delay_p99_ms', unit: 'ms', description: 'Access delay, 99th percentile.', scope: 'cell-and-groups', value: delayQuantile(0.99) },
  {
    name: 'delay_from_first_preamble_mean_ms',
    unit: 'ms',
    description: 'Delay from the first preamble transmission to delivery (the TR 37.868 access delay), mean.',
    scope: 'cell-and-groups',
    value: (t) => t.delayFromFirstPreamble.mean(),
  },
  {
    name: 'delay_from_first_preamble_p95_ms',
    unit: 'ms',
    description: 'Delay from the first preamble transmission to delivery, 95th percentile.',
    scope: 'cell-and-groups',
    value: (t) => t.delayFromFirstPreamble.quantile(0.95),
  },
  {
    name: 'deadline_met_share',
    unit: '1',
    description:
      'Packets delivered within their group deadline / packets whose outcome is known (delivered, dropped, or still waiting past the deadline). Groups without a deadline are left out.',
    scope: 'cell-and-groups',
    when: (c) => c.anyDeadline,
    value: (t) => (t.hasDeadline ? ratio(t.deadlineMet, t.deadlineJudged) : Number.NaN),
  },
  {
    name: 'throughput_per_s',
    unit: '1/s',
    description: 'Completed accesses per second of the observation window.',
    scope: 'cell-and-groups',
    value: (t, c) => perSecond(t.completed, c),
  },
  {
    name: 'throughput_per_rao',
    unit: '1/occasion',
    description: 'Completed accesses per random-access occasion (occasions counted as for collision_probability_per_rao).',
    scope: 'cell-and-groups',
    value: (t, c) => perOccasion(t.completed, c),
  },
  {
    name: 'normalised_throughput',
    unit: '1/(occasion·preamble)',
    description: 'Completed accesses per occasion per preamble.',
    scope: 'cell',
    value: (t, c) => ratio(perOccasion(t.completed, c), c.preambles),
  },
  {
    name: 'offered_load_per_s',
    unit: '1/s',
    description: 'Packets arriving per second of the observation window.',
    scope: 'cell-and-groups',
    value: (t, c) => perSecond(t.arrived, c),
  },
  {
    name: 'attempts_per_rao',
    unit: '1/occasion',
    description: 'Preamble transmissions (first attempts and retries) per occasion: the load G of slotted-ALOHA analysis.',
    scope: 'cell-and-groups',
    value: (t, c) => perOccasion(t.preambleTx, c),
  },
  {
    name: 'barring_delay_mean_ms',
    unit: 'ms',
    description: 'Time from arrival to passing access class barring, mean over packets that passed.',
    scope: 'cell-and-groups',
    when: (c) => c.barring,
    value: (t) => ratio(t.barringDelaySum, t.barringPassed),
  },
  {
    name: 'arrival_time_mean_ms',
    unit: 'ms',
    description: 'Mean arrival time of counted packets (a check on the traffic model).',
    scope: 'cell-and-groups',
    value: (t) => ratio(t.arrivalTimeSum, t.arrived),
  },
  {
    name: 'arrival_time_sd_ms',
    unit: 'ms',
    description: 'Standard deviation of arrival times of counted packets (a check on the traffic model).',
    scope: 'cell-and-groups',
    value: (t) => {
      if (t.arrived < 2) return Number.NaN;
      const mean = t.arrivalTimeSum / t.arrived;
      return Math.sqrt(Math.max(0, (t.arrivalTimeSquares - t.arrived * mean * mean) / (t.arrived - 1)));
    },
  },
  {
    name: 'packets_in_system_mean',
    unit: 'packets',
    description: 'Time-average number of packets in the system (buffered, waiting or being sent) over the observation window: L of Little’s law.',
    scope: 'cell-and-groups',
    value: (t, c) => ratio(t.backlogArea, c.observationMs),
  },
  {
    name: 'grants_issued',
    unit: 'grants',
    description: 'Grants handed out (dynamic grants, and configured-grant opportunities in the window).',
    scope: 'cell-and-groups',
    when: (c) => c.grants,
    value: (t) => t.grantsIssued,
  },
  { name: 'grants_used', unit: 'grants', description: 'Grants that carried a packet.', scope: 'cell-and-groups', when: (c) => c.grants, value: (t) => t.grantsUsed },
  {
    name: 'grants_wasted',
    unit: 'grants',
    description: 'Grants that found no packet waiting (an empty buffer, or a device already transmitting or contending).',
    scope: 'cell-and-groups',
    when: (c) => c.grants,
    value: (t) => t.grantsIssued - t.grantsUsed,
  },
  {
    name: 'grant_efficiency',
    unit: '1',
    description: 'Grants used / grants issued.',
    scope: 'cell-and-groups',
    when: (c) => c.grants,
    value: (t) => ratio(t.grantsUsed, t.grantsIssued),
  },
  {
    name: 'fallback_share',
    unit: '1',
    description: 'Packets that stopped waiting for a grant and contended instead / packets started.',
    scope: 'cell-and-groups',
    when: (c) => c.fallback,
    value: (t) => ratio(t.fellBack, t.arrived),
  },
  {
    name: 'predictor_precision',
    unit: '1',
    description: 'Over grant occasions: flagged devices holding a packet waiting for a grant / flagged devices (false alarms included).',
    scope: 'cell-and-groups',
    when: (c) => c.predictors,
    value: (t) => ratio(t.flaggedWithDataSum, t.flaggedSum),
  },
  {
    name: 'predictor_recall',
    unit: '1',
    description: 'Packets whose device was flagged while they waited for a grant / packets that waited for a grant.',
    scope: 'cell-and-groups',
    when: (c) => c.predictors,
    value: (t) => ratio(t.recallFlagged, t.recallPackets),
  },
  {
    name: 'aoi_mean_ms',
    unit: 'ms',
    description:
      'Age of Information: time-average age of the freshest delivered packet, per reporting device from its first delivery, averaged over reporting devices (Kaul, Yates, Gruteser 2012).',
    scope: 'cell-and-groups',
    when: (c) => c.horizon,
    value: (t) => ratio(t.age.ageSum, t.age.reportingDevices),
  },
  {
    name: 'aoi_peak_mean_ms',
    unit: 'ms',
    description: 'Peak Age of Information: age just before an update, averaged over updates.',
    scope: 'cell-and-groups',
    when: (c) => c.horizon,
    value: (t) => ratio(t.age.peakSum, t.age.peakCount),
  },
  {
    name: 'energy_per_delivered_packet_mj',
    unit: 'mJ',
    description:
      'Device energy spent on accesses (transmitting, receiving or monitoring, awake idle; failed and dropped attempts included) / packets delivered. Sleep is not included.',
    scope: 'cell-and-groups',
    value: (t, c) => ratio((t.txMs * c.power.transmit_mw + t.rxMs * c.power.receive_mw + t.idleMs * c.power.idle_mw) / 1000, t.completed),
  },
  {
    name: 'device_power_mean_mw',
    unit: 'mW',
    description: 'Mean power per device over the observation window: access energy plus sleep the rest of the time.',
    scope: 'cell-and-groups',
    value: (t, c) => {
      const awake = t.txMs + t.rxMs + t.idleMs;
      const energy = t.txMs * c.power.transmit_mw + t.rxMs * c.power.receive_mw + t.idleMs * c.power.idle_mw;
      const asleep = Math.max(0, t.devices * c.observationMs - awake);
      return ratio(energy + asleep * c.power.sleep_mw, t.devices * c.observationMs);
    },
  },
  { name: 'accesses_started', unit: 'packets', description: 'Packets that arrived in the observation window.', scope: 'cell-and-groups', value: (t) => t.arrived },
  { name: 'accesses_completed', unit: 'packets', description: 'Packets delivered.', scope: 'cell-and-groups', value: (t) => t.completed },
  { name: 'accesses_dropped', unit: 'packets', description: 'Packets given up.', scope: 'cell-and-groups', value: (t) => t.dropped },
  {
    name: 'accesses_in_progress',
    unit: 'packets',
    description: 'Packets still in the system when the run ended (counted from device state, independently of the other three).',
    scope: 'cell-and-groups',
    value: (t) => t.inProgress,
  },
  { name: 'observation_time_s', unit: 's', description: 'Length of the observation window.', scope: 'cell', value: (_t, c) => c.observationMs / 1000 },
  { name: 'occasions_counted', unit: 'occasions', description: 'Occasions from the first to the last active one.', scope: 'cell', value: (_t, c) => c.occasionsCounted },
];

export function metricDefinition(name: string): MetricDefinition | undefined {
  return metricCatalogue.find((m) => m.name === name);
}

export const metricNames: readonly string[] = metricCatalogue.map((m) => m.name);

/** Metrics compared side by side when an experiment has several points (`report.compare_metrics`). */
export const DEFAULT_COMPARE_METRICS: readonly string[] = ['throughput_per_s', 'delay_p95_ms', 'deadline_met_share', 'grants_wasted', 'energy_per_delivered_packet_mj'];

/** The metrics an experiment reports, in catalogue order. */
export function activeMetrics(c: MetricConditions): MetricDefinition[] {
  return metricCatalogue.filter((m) => m.when === undefined || m.when(c));
}

export interface MetricValues {
  readonly cell: Record<string, number>;
  readonly groups: Record<string, Record<string, number>>;
}

export function computeMetrics(cell: Tally, groups: ReadonlyMap<string, Tally>, c: CellContext): MetricValues {
  const defs = activeMetrics(c);
  const cellValues: Record<string, number> = {};
  for (const m of defs) cellValues[m.name] = m.value(cell, c);
  const groupValues: Record<string, Record<string, number>> = {};
  for (const [name, t] of groups) {
    const values: Record<string, number> = {};
    for (const m of defs) if (m.scope === 'cell-and-groups') values[m.name] = m.value(t, c);
    groupValues[name] = values;
  }
  return { cell: cellValues, groups: groupValues };
}
