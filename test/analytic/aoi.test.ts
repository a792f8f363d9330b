import { describe, it, expect } from 'vitest';
import { mm1AverageAge, mm1PeakAge, roundRobinAverageAge, slottedAlohaAverageAge } from '../../src/analytic/index.js';

describe('Age of Information (Kaul, Yates, Gruteser, INFOCOM 2012; Yates & Kaul, ISIT 2017)', () => {
  it.each([
    [0.25, 5.083333],
    [0.5, 3.5],
    [0.75, 4.583333],
  ])('M/M/1 FCFS, μ = 1, ρ = %f → Δ = %f (Kaul, Yates, Gruteser, INFOCOM 2012)', (rho, age) => {
    expect(mm1AverageAge(rho, 1)).toBeCloseTo(age, 6);
  });

  it('M/M/1 peak age 1/λ + 1/(μ − λ) (Kaul, Yates, Gruteser, INFOCOM 2012)', () => {
    expect(mm1PeakAge(0.5, 1)).toBeCloseTo(4, 12);
    expect(mm1PeakAge(1, 2)).toBeCloseTo(2, 12);
    expect(mm1AverageAge(1, 1)).toBe(Infinity);
  });

  it('round robin of n fresh sources: n/2 + 1 slots; slotted ALOHA τ = 1/n, n = 10 → 26.3117 (Yates & Kaul, ISIT 2017)', () => {
    expect(roundRobinAverageAge(10)).toBe(6);
    expect(slottedAlohaAverageAge(10, 0.1)).toBeCloseTo(26.3117, 4);
    expect(slottedAlohaAverageAge(10, 0)).toBe(Infinity);
  });
});
