/**
 * Queues for the granted uplink. Times are in slots unless a name says otherwise; unstable queues
 * (load ≥ 1) give Infinity.
 */
import { requireNonNegative, requirePositive } from './validate.js';

/**
 * Mean sojourn W (slots, own service slot included) of a queue served one grant per slot with
 * i.i.d. batch arrivals A per slot, mean λ, second moment E[A²], early-departure convention:
 * E[Q] = (λ + E[A²] − 2λ²)/(2(1 − λ)) and W = E[Q]/λ (Little 1961). Poisson A: E[A²] = λ + λ², and
 * W equals the M/D/1 sojourn 1 + λ/(2(1 − λ)). Exact.
 */
export function batchArrivalSojourn(lambda: number, secondMoment: number): number {
  requirePositive('lambda', lambda);
  requireNonNegative('secondMoment', secondMoment);
  if (secondMoment < lambda) {
    throw new RangeError(`E[A²] must be ≥ E[A] for integer batches, got ${secondMoment} < ${lambda}`);
  }
  if (lambda >= 1) return Infinity;
  const queue = (lambda + secondMoment - 2 * lambda * lambda) / (2 * (1 - lambda));
  return queue / lambda;
}

/** M/D/1 mean sojourn with service time 1 slot: 1 + ρ/(2(1 − ρ)) slots (Pollaczek–Khinchine). Exact. */
export function md1Sojourn(rho: number): number {
  requireNonNegative('rho', rho);
  if (rho >= 1) return Infinity;
  return 1 + rho / (2 * (1 - rho));
}

/**
 * M/D/1 mean waiting time in queue (Pollaczek–Khinchine): W_q = ρ/(2μ(1 − ρ)) with μ = 1/D and
 * ρ = λD; arrival rate λ per time unit, service time D in the same time unit. Exact.
 */
export function md1WaitingTime(lambda: number, D: number): number {
  requireNonNegative('lambda', lambda);
  requirePositive('D', D);
  const rho = lambda * D;
  if (rho >= 1) return Infinity;
  return (rho * D) / (2 * (1 - rho));
}
