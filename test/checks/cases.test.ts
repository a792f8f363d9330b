/**
 * Every built-in check case of `jostle check` runs through the simulator and passes: each compares a
 * simulated metric with a closed form or a published table named beside it in src/checks/cases.ts
 * (slotted ALOHA, the occasion occupancy law, barring, Beta(3,4) arrivals, retries, power ramping,
 * queueing under configured grants, random grants, Age of Information, TR 37.868 bands). The pass
 * rule is the 99 % Student-t half-width plus the case's stated tolerance (src/checks/runner.ts).
 */
import { describe, expect, it } from 'vitest';
import { checkCases } from '../../src/checks/cases.js';
import { runCheckCase } from '../../src/checks/runner.js';

describe('built-in check cases', () => {
  it('there are cases for each family of reference values', () => {
    const ids = checkCases.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const prefix of ['aloha-', 'occasion-', 'barring-', 'beta-burst', 'retries-', 'power-ramping', 'configured-grant', 'random-grant', 'round-robin-age', 'oracle-', 'tr37868-']) {
      expect(ids.some((id) => id.startsWith(prefix)), prefix).toBe(true);
    }
  });

  for (const c of checkCases) {
    it(`${c.id}: ${c.title}`, () => {
      const lines = runCheckCase(c);
      expect(lines.length).toBeGreaterThan(0);
      for (const line of lines) expect(line.verdict, `${line.metric}: ${JSON.stringify(line.simulated)} vs ${JSON.stringify(line.expected)} (${line.source})`).toBe('pass');
    }, 60_000);
  }
});
