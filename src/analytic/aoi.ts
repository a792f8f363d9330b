/**
 * Age of Information (Kaul, Yates, Gruteser, INFOCOM 2012; Yates & Kaul, ISIT 2017).
 * Rates are per time unit and ages in that time unit; the slotted forms are in slots.
 */
import { requireInteger, requireNonNegative, requireProbability, requirePositive } from './validate.js';

/**
 * M/M/1 FCFS average age (Kaul, Yates, Gruteser, INFOCOM 2012):
 * Δ = (1/μ)(1 + 1/ρ + ρ²/(1 − ρ)) with ρ = λ/μ; Infinity when ρ ≥ 1 or λ = 0.
 */
export function mm1AverageAge(lambda: number, mu: number): number {
  requireNonNegative('lambda', lambda);
  requirePositive('mu', mu);
  const rho = lambda / mu;
  if (rho >= 1 || rho === 0) return Infinity;
  return (1 + 1 / rho + (rho * rho) / (1 - rho)) / mu;
}

/** M/M/1 FCFS average peak age: 1/λ + 1/(μ − λ); Infinity when λ ≥ μ or λ = 0. */
export function mm1PeakAge(lambda: number, mu: number): number {
  requireNonNegative('lambda', lambda);
  requirePositive('mu', mu);
  if (lambda >= mu || lambda === 0) return Infinity;
  return 1 / lambda + 1 / (mu - lambda);
}

/** Round-robin scheduling of n always-fresh sources, one per slot, continuous sawtooth: n/2 + 1 slots. */
export function roundRobinAverageAge(n: number): number {
  requireInteger('n', n, 1);
  return n / 2 + 1;
}

/**
 * n always-fresh sources on slotted ALOHA, each transmitting with probability τ per slot
 * (Yates & Kaul, ISIT 2017): Δ ≈ 1/q + 1/2 slots with q = τ(1 − τ)^(n−1); Infinity when q = 0.
 */
export function slottedAlohaAverageAge(n: number, tau: number): number {
  requireInteger('n', n, 1);
  requireProbability('tau', tau);
  const q = tau * Math.pow(1 - tau, n - 1);
  return q === 0 ? Infinity : 1 / q + 0.5;
}
