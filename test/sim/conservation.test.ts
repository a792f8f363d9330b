/**
 * Conservation of packets: started = completed + dropped + still in progress, per group and for the
 * cell, in every replication, whatever the traffic, horizon and procedure settings. "In progress" is
 * counted from device state at the end, independently of the other counters (common practice: flow
 * balance of a closed accounting).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { runYaml } from './run-yaml.js';

const trafficArb = fc.oneof(
  fc.record({ model: fc.constant('uniform-window'), window: fc.integer({ min: 1, max: 5000 }) }).map((t) => `{ model: uniform-window, window: ${t.window}ms }`),
  fc.record({ model: fc.constant('beta-burst'), window: fc.integer({ min: 10, max: 5000 }) }).map((t) => `{ model: beta-burst, window: ${t.window}ms }`),
  fc.integer({ min: 50, max: 5000 }).map((ms) => `{ model: poisson, mean_interval: ${ms * 10}ms }`),
  fc.integer({ min: 100, max: 2000 }).map((ms) => `{ model: periodic, period: ${ms}ms, jitter: ${Math.floor(ms / 2)}ms }`),
);

// Access policies, with the grant-side paths that can lose track of a packet: HARQ failures that send
// a packet back to waiting, fallback to contention, giving up after max_wait.
const accessArb = fc.oneof(
  fc.constant('{ policy: contention }'),
  fc.record({ k: fc.integer({ min: 1, max: 6 }), rule: fc.constantFrom('', ', fallback_after: 20ms', ', max_wait: 300ms') }).map(
    (a) => `{ policy: random-grant, grants_per_occasion: ${a.k}${a.rule} }`,
  ),
  fc.record({
    predictor: fc.constantFrom('{ model: oracle, recall: 0.7, false_alarm: 0.001 }', '{ model: periodic }'),
    rule: fc.constantFrom('', ', fallback_after: 20ms', ', max_wait: 200ms'),
  }).map((a) => `{ policy: predicted-grant, predictor: ${a.predictor}${a.rule} }`),
  // period ≥ devices per group (300): at most one reserved unit per group and subframe, within capacity ≥ 3.
  fc.integer({ min: 300, max: 600 }).map((ms) => `{ policy: configured-grant, period: ${ms}ms }`),
);

const cellArb = fc.record({
  preambles: fc.integer({ min: 1, max: 64 }),
  attempts: fc.integer({ min: 1, max: 10 }),
  answered: fc.boolean(),
  barring: fc.boolean(),
  horizonMs: fc.integer({ min: 50, max: 3000 }),
  warmupMs: fc.integer({ min: 0, max: 40 }),
  groups: fc.array(fc.record({ count: fc.integer({ min: 1, max: 400 }), traffic: trafficArb }), { minLength: 1, maxLength: 3 }),
});

const grantCellArb = fc.record({
  capacity: fc.integer({ min: 3, max: 8 }),
  harqError: fc.constantFrom(0, 0.3, 1),
  msg3: fc.constantFrom('separate', 'shared'),
  horizonMs: fc.integer({ min: 50, max: 3000 }),
  warmupMs: fc.integer({ min: 0, max: 40 }),
  groups: fc.array(
    fc.record({ count: fc.integer({ min: 1, max: 300 }), traffic: fc.oneof(trafficArb, fc.constant('{ model: always-fresh }')), access: accessArb }),
    { minLength: 1, maxLength: 3 },
  ),
});

function expectConserved(yaml: string): void {
  const result = runYaml(yaml);
  for (const record of result.points[0]?.records ?? []) {
    for (const m of [record.metrics, ...Object.values(record.groups)]) {
      expect(m['accesses_started']).toBe((m['accesses_completed'] ?? 0) + (m['accesses_dropped'] ?? 0) + (m['accesses_in_progress'] ?? 0));
    }
    // Grants carrying a packet can never outnumber the grants issued.
    for (const m of Object.values(record.groups)) {
      if (m['grants_issued'] !== undefined) expect(m['grants_used'] ?? 0).toBeLessThanOrEqual(m['grants_issued']);
    }
  }
}

describe('conservation of packets', () => {
  it('started = completed + dropped + in progress, for the cell and each group (property)', () => {
    fc.assert(
      fc.property(cellArb, (c) => {
        const groups = c.groups.map((g, i) => `  g${i}:\n    count: ${g.count}\n    traffic: ${g.traffic}\n    deadline: 100ms\n`).join('');
        const yaml = `experiment: conservation
seed: 505
replications: 2
horizon: ${c.horizonMs}ms
warmup: ${c.warmupMs}ms
cell:
  random_access:
    preambles: ${c.preambles}
    preamble_trans_max: ${c.attempts}
    collided_preambles: ${c.answered ? 'answered' : 'unanswered'}
${c.barring ? '    barring: { factor: 0.5, time: 4s }\n' : ''}groups:
${groups}`;
        expectConserved(yaml);
      }),
      { seed: 5050, numRuns: 40 },
    );
  });

  it('the same with grant policies, HARQ failures, fallback, max_wait and generate-at-will traffic (property)', () => {
    fc.assert(
      fc.property(grantCellArb, (c) => {
        const groups = c.groups
          .map((g, i) => `  g${i}:\n    count: ${g.count}\n    traffic: ${g.traffic}\n    access: ${g.access}\n    deadline: 100ms\n`)
          .join('');
        expectConserved(`experiment: conservation-grants
seed: 507
replications: 2
horizon: ${c.horizonMs}ms
warmup: ${c.warmupMs}ms
cell:
  uplink: { capacity: ${c.capacity}, msg3: ${c.msg3}, harq: { error_probability: ${c.harqError}, max_transmissions: 2 } }
groups:
${groups}`);
      }),
      { seed: 5051, numRuns: 40 },
    );
  });

  it('without a horizon every access is resolved (none left in progress)', () => {
    const r = runYaml(`experiment: drained
seed: 506
replications: 3
groups:
  mtc:
    count: 5000
    traffic: { model: beta-burst }
`);
    for (const record of r.points[0]?.records ?? []) {
      expect(record.metrics['accesses_in_progress']).toBe(0);
      expect(record.metrics['accesses_started']).toBe(5000);
    }
  });
});
