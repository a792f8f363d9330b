/** Seeded randomness: seed derivation, named streams and samplers. */
export { hashParts, replicationSeed } from './seeds.js';
export type { RootSeed, SeedPart } from './seeds.js';
export { Stream, StreamSet } from './stream.js';
export {
  bernoulli,
  beta,
  binomial,
  exponential,
  gamma,
  geometricTrials,
  normal,
  poisson,
  sampleWithoutReplacement,
  shuffleInPlace,
  uniform,
} from './distributions.js';
export { logFactorial } from './log-factorial.js';
