/**
 * `always-fresh` (generate-at-will, Yates & Kaul's status-update model as the project defines it in
 * src/traffic/always-fresh.ts): every device gets a packet at `start`, and a new one the instant its
 * buffer empties. Checked against that definition (exact event accounting).
 */
import { describe, expect, it } from 'vitest';
import { alwaysFresh, alwaysFreshSchema } from '../../src/traffic/always-fresh.js';
import { fakeEnv } from './fake-env.js';

describe('always-fresh traffic', () => {
  it('gives every device one packet at start, then one more each time deviceIdle is called', () => {
    const params = alwaysFreshSchema.parse({ model: 'always-fresh', start: '2s' });
    expect(alwaysFresh.freshAtTransmission).toBe(true);
    expect(alwaysFresh.recurring(params)).toBe(true);
    const env = fakeEnv({ deviceCount: 3, firstDevice: 10 });
    const source = alwaysFresh.create(params, env);
    source.start();
    source.deviceIdle?.(11); // before start: ignored
    expect(env.devices).toEqual([]);
    env.sim.run();
    expect(env.devices).toEqual([10, 11, 12]);
    expect(env.times).toEqual([2000, 2000, 2000]);
    const later = env.sim.defineEvent('idle', (device) => source.deviceIdle?.(device));
    env.sim.at(2500, later, 12);
    env.sim.at(2700, later, 10);
    env.sim.run();
    expect(env.devices).toEqual([10, 11, 12, 12, 10]);
    expect(env.times).toEqual([2000, 2000, 2000, 2500, 2700]);
  });

  it('schedules nothing for an empty group', () => {
    const env = fakeEnv({ deviceCount: 0 });
    alwaysFresh.create(alwaysFreshSchema.parse({ model: 'always-fresh' }), env).start();
    expect(env.sim.pending).toBe(0);
  });
});
