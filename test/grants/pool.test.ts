/**
 * Sharing the uplink pool between Msg3 and grants (cell.uplink.msg3). Sources: the definition of the
 * switch (common practice: Msg3 is scheduled on the same uplink resources as data) — with capacity 0
 * a shared pool leaves no resource for any Msg3, so no contention access can complete; a separate pool
 * does not touch the contention procedure at all (byte-identical metrics).
 */
import { describe, expect, it } from 'vitest';
import { metricOf, runYaml } from '../sim/run-yaml.js';

const base = (extra: string): string => `experiment: pool
seed: 959
replications: 3
cell:
  uplink: { capacity: 0${extra} }
groups:
  mtc:
    count: 3000
    traffic: { model: beta-burst }
`;

describe('uplink pool shared with Msg3', () => {
  it('capacity 0 and a shared pool: every response is impossible, nothing completes', () => {
    const r = runYaml(base(', msg3: shared'));
    expect(metricOf(r, 'access_success_probability').mean).toBe(0);
  });

  it('a separate pool leaves the contention procedure untouched', () => {
    const separate = runYaml(base(', msg3: separate'));
    const reference = runYaml(base('').replace('cell:\n  uplink: { capacity: 0 }\n', ''));
    expect(separate.points[0]?.summary.metrics).toEqual(reference.points[0]?.summary.metrics);
  });

  it('grants taken by another group leave less for Msg3 when shared (success drops)', () => {
    const yaml = (mode: string): string => `experiment: pool-share
seed: 960
replications: 3
horizon: 15s
cell:
  uplink: { capacity: 3, msg3: ${mode} }
groups:
  mtc:
    count: 20000
    traffic: { model: beta-burst }
  trackers:
    count: 2000
    traffic: { model: beta-burst }
    access: { policy: random-grant, grants_per_occasion: 2 }
`;
    const separate = metricOf(runYaml(yaml('separate')), 'access_success_probability', 'mtc');
    const shared = metricOf(runYaml(yaml('shared')), 'access_success_probability', 'mtc');
    expect(shared.mean + shared.half_width).toBeLessThan(separate.mean - separate.half_width);
  });
});
