/** Closed-form results used as predictions and test oracles. */
export { slottedAlohaThroughput, pureAlohaThroughput, saturatedSlottedThroughput } from './aloha.js';
export {
  probabilityAlone,
  expectedSuccesses,
  varianceSuccesses,
  expectedIdle,
  expectedCollided,
  successDistribution,
  expectedSuccessesPoisson,
} from './occasion.js';
export { meanBarringDelay, expectedSuccessesWithBarring, optimalBarringFactor } from './barring.js';
export { successWithinAttempts, meanAttemptsGivenSuccess } from './retries.js';
export type { BetaMoments } from './beta.js';
export { betaMoments, betaWindowProbability } from './beta.js';
export { batchArrivalSojourn, md1Sojourn, md1WaitingTime } from './queues.js';
export { mm1AverageAge, mm1PeakAge, roundRobinAverageAge, slottedAlohaAverageAge } from './aoi.js';
export { lnGamma, lnBeta } from './special.js';
