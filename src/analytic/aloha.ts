/**
 * ALOHA throughput (Abramson 1970; Roberts 1975; Bertsekas & Gallager, Data Networks, 2nd ed.,
 * ch. 4). Throughput is in successful packets per slot (per packet time for pure ALOHA).
 */
import { requireInteger, requireNonNegative, requireProbability } from './validate.js';

/** Slotted ALOHA with Poisson offered load G attempts per slot: S = G·e^(−G). Exact; max 1/e at G = 1. */
export function slottedAlohaThroughput(G: number): number {
  requireNonNegative('G', G);
  return G * Math.exp(-G);
}

/** Pure (unslotted) ALOHA with Poisson offered load G per packet time: S = G·e^(−2G). Exact; max 1/(2e) at G = 1/2. */
export function pureAlohaThroughput(G: number): number {
  requireNonNegative('G', G);
  return G * Math.exp(-2 * G);
}

/** N saturated nodes, each sending with probability p per slot: S = N·p·(1−p)^(N−1). Exact. */
export function saturatedSlottedThroughput(N: number, p: number): number {
  requireInteger('N', N, 0);
  requireProbability('p', p);
  if (N === 0) return 0;
  return N * p * Math.pow(1 - p, N - 1);
}
