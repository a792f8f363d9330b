/**
 * The built-in validation cases of `jostle check`. Each names its source beside the expected value, in
 * the words of the project's reference list. Exact values are recomputed from src/analytic.
 */
import {
  batchArrivalSojourn,
  betaMoments,
  roundRobinAverageAge,
  expectedIdle,
  expectedSuccesses,
  expectedSuccessesWithBarring,
  meanAttemptsGivenSuccess,
  meanBarringDelay,
  slottedAlohaThroughput,
  successWithinAttempts,
} from '../analytic/index.js';
import type { CheckCase } from './case.js';

/** Perfect detection, unlimited responses, no HARQ errors, one attempt: multichannel slotted ALOHA. */
const ideal = (preambles: number, attempts = 1): string => `
cell:
  random_access:
    preambles: ${preambles}
    detection: perfect
    answers_per_subframe: unlimited
    msg3: { error_probability: 0 }
    msg4: { error_probability: 0 }
    preamble_trans_max: ${attempts}
`;

function alohaCase(G: number): CheckCase {
  const devices = 20_000;
  // Aggregate Poisson rate G per 5 ms occasion, spread over many devices (superposition).
  const meanIntervalMs = (devices * 5) / G;
  return {
    id: `aloha-g${G}`,
    title: `Slotted ALOHA, one preamble, Poisson load G = ${G} per occasion`,
    yaml: `experiment: check-aloha-g${G}
seed: 11
replications: 10
horizon: 100s
${ideal(1)}
groups:
  stations:
    count: ${devices}
    traffic: { model: poisson, mean_interval: ${meanIntervalMs}ms }
`,
    expectations: [
      {
        metric: 'throughput_per_rao',
        expected: slottedAlohaThroughput(G),
        tolerance: 0,
        source: 'S = G·e^(−G) (Roberts 1975; Bertsekas & Gallager, Data Networks, 2nd ed., ch. 4) — exact',
      },
      { metric: 'attempts_per_rao', expected: G, tolerance: 0, source: 'offered load G of the Poisson arrivals — exact' },
    ],
  };
}

function oneOccasionCase(N: number): CheckCase {
  return {
    id: `occasion-m54-n${N}`,
    title: `One occasion, M = 54 preambles, N = ${N} devices`,
    yaml: `experiment: check-occasion-n${N}
seed: 12
replications: 1000
${ideal(54)}
groups:
  burst:
    count: ${N}
    traffic: { model: uniform-window, window: 1ms }
`,
    expectations: [
      {
        metric: 'accesses_completed',
        expected: expectedSuccesses(N, 54),
        tolerance: 0,
        source: 'E[S] = N(1−1/M)^(N−1), uniform preamble choice (reference-values §2) — exact',
      },
      {
        metric: 'idle_preamble_probability',
        expected: expectedIdle(N, 54),
        scale: 54,
        tolerance: 0,
        source: 'E[idle] = M(1−1/M)^N (reference-values §2) — exact',
      },
    ],
  };
}

const barringCase: CheckCase = {
  id: 'barring-optimal-n200',
  title: 'Access class barring at the optimal factor: N = 200, M = 54, p = 0.27',
  yaml: `experiment: check-barring-n200
seed: 13
replications: 1000
horizon: 2s
${ideal(54)}
    barring: { factor: 0.27, time: 4s }
groups:
  burst:
    count: 200
    traffic: { model: uniform-window, window: 1ms }
`,
  expectations: [
    {
      metric: 'accesses_completed',
      expected: expectedSuccessesWithBarring(200, 0.27, 54),
      tolerance: 0,
      source: 'E[S] = N·p·(1 − p/M)^(N−1), p* = M/N (Duan, Shah-Mansouri, Wong, GLOBECOM 2013; reference-values §3) — exact for this model',
    },
  ],
};

const barringDelayCase: CheckCase = {
  id: 'barring-delay',
  title: 'Mean access-barring delay, p = 0.5, T = 4 s',
  yaml: `experiment: check-barring-delay
seed: 14
replications: 10
${ideal(54, 10)}
    barring: { factor: 0.5, time: 4s }
groups:
  meters:
    count: 2000
    traffic: { model: uniform-window, window: 10s }
`,
  expectations: [
    {
      metric: 'barring_delay_mean_ms',
      expected: meanBarringDelay(0.5, 4000),
      tolerance: 0,
      source: 'mean wait ((1−p)/p)·T_barring given the rule of TS 36.331 5.3.3.11 (reference-values §3) — exact',
    },
  ],
};

const beta = betaMoments(3, 4, 10_000);
const betaCase: CheckCase = {
  id: 'beta-burst-moments',
  title: 'TR 37.868 model 2 arrivals: Beta(3, 4) over 10 s',
  yaml: `experiment: check-beta-moments
seed: 15
replications: 10
groups:
  mtc:
    count: 30000
    traffic: { model: beta-burst }
`,
  expectations: [
    { metric: 'arrival_time_mean_ms', expected: beta.mean, tolerance: 0, source: 'Beta(3,4) mean over 10 s = 4.285714 s (reference-values §5) — exact' },
    { metric: 'arrival_time_sd_ms', expected: beta.sd, tolerance: 0, source: 'Beta(3,4) sd over 10 s = 1.749636 s (reference-values §5) — exact' },
  ],
};

const retriesCase: CheckCase = {
  id: 'retries-p0.5-k3',
  title: 'Retries with constant per-attempt success 0.5, at most 3 attempts',
  yaml: `experiment: check-retries
seed: 16
replications: 10
cell:
  random_access:
    preambles: 4096
    detection: perfect
    answers_per_subframe: unlimited
    msg3: { error_probability: 0.5, max_transmissions: 1 }
    msg4: { error_probability: 0 }
    preamble_trans_max: 3
groups:
  meters:
    count: 4000
    traffic: { model: uniform-window, window: 100s }
`,
  expectations: [
    {
      metric: 'access_success_probability',
      expected: successWithinAttempts(0.5, 3),
      tolerance: 0,
      source: 'P(success) = 1 − (1−p_s)^K (reference-values §4) — exact',
    },
    {
      metric: 'mean_preamble_transmissions',
      expected: meanAttemptsGivenSuccess(0.5, 3),
      tolerance: 0,
      source: 'E[attempts | success] (reference-values §4) — exact',
    },
  ],
};

/** Power ramping: a lone preamble at attempt k is detected with probability 1 − e^(−k) (TR 37.868). */
const rampingMean = (() => {
  let sum = 0;
  let reach = 1;
  for (let k = 1; k <= 10; k++) {
    sum += reach;
    reach *= Math.exp(-k);
  }
  return sum;
})();

const rampingCase: CheckCase = {
  id: 'power-ramping',
  title: 'Detection with power ramping, no contention',
  yaml: `experiment: check-power-ramping
seed: 17
replications: 10
cell:
  random_access:
    preambles: 4096
    answers_per_subframe: unlimited
    msg3: { error_probability: 0 }
    msg4: { error_probability: 0 }
groups:
  meters:
    count: 4000
    traffic: { model: uniform-window, window: 100s }
`,
  expectations: [
    {
      metric: 'mean_preamble_transmissions',
      expected: rampingMean,
      tolerance: 0,
      source: 'E[transmissions] = Σ_k Π_{j<k} e^(−j) for detection probability 1 − e^(−k) (3GPP TR 37.868 detection model) — exact',
    },
  ],
};

const model2Case: CheckCase = {
  id: 'tr37868-model2-30000',
  title: 'TR 37.868 model 2, 30,000 devices, default procedure (loose bands, from memory)',
  yaml: `experiment: check-tr37868-model2
seed: 18
replications: 5
groups:
  mtc:
    count: 30000
    traffic: { model: beta-burst }
`,
  expectations: [],
  bands: [
    { metric: 'access_success_probability', low: 0.2, high: 0.4, source: 'TR 37.868 model 2, 30,000 devices: ≈ 29–30 % (from memory, low confidence; loose band)' },
    { metric: 'collision_probability_per_rao', low: 0.35, high: 0.6, source: 'TR 37.868 per-opportunity collision ≈ 45–48 % (from memory, low confidence; loose band)' },
    { metric: 'mean_preamble_transmissions', low: 2.5, high: 5, source: 'TR 37.868: 3–4 preamble transmissions (from memory; loose band)' },
  ],
};

const model1Case: CheckCase = {
  id: 'tr37868-model1-30000',
  title: 'TR 37.868 model 1, 30,000 devices, default procedure',
  yaml: `experiment: check-tr37868-model1
seed: 19
replications: 5
groups:
  mtc:
    count: 30000
    traffic: { model: uniform-window }
`,
  expectations: [],
  bands: [{ metric: 'access_success_probability', low: 0.99, high: 1, source: 'TR 37.868 model 1, 30,000 devices: success ≈ 100 % (from memory; loose band)' }],
};

function configuredQueueCase(lambda: number): CheckCase {
  return {
    id: `configured-grant-queue-l${lambda}`,
    title: `Configured grant every 1 ms slot, Poisson arrivals λ = ${lambda} per slot`,
    yaml: `experiment: check-configured-queue
seed: 21
replications: 8
horizon: 120s
warmup: 2s
cell:
  uplink: { capacity: 1, harq: { error_probability: 0 } }
groups:
  meter:
    count: 1
    traffic: { model: poisson, mean_interval: ${1 / lambda}ms }
    access: { policy: configured-grant, period: 1ms }
`,
    expectations: [
      {
        metric: 'delay_mean_ms',
        // The sojourn counts whole slots from the arrival slot; arrivals are uniform inside it: + 1/2.
        expected: batchArrivalSojourn(lambda, lambda + lambda * lambda) + 0.5,
        tolerance: 0,
        source: 'W = 1 + λ/(2(1−λ)) slots (batch arrivals, one grant per slot; reference-values §7) + ½ slot of arrival phase — exact',
      },
    ],
  };
}

const randomGrantCase: CheckCase = {
  id: 'random-grant-kq',
  title: 'Random grant: K = 10 grants among N = 100 devices, each with data with probability q = 0.3',
  yaml: `experiment: check-random-grant
seed: 22
replications: 2000
horizon: 1500us
warmup: 1ms
cell:
  uplink: { capacity: 20 }
groups:
  sensors:
    count: 100
    traffic: { model: uniform-window, window: 1ms, active_share: 0.3 }
    access: { policy: random-grant, grants_per_occasion: 10 }
`,
  expectations: [
    { metric: 'grants_used', expected: 3, tolerance: 0, source: 'E[used] = K·q (linearity of expectation) — exact' },
    { metric: 'grants_wasted', expected: 7, tolerance: 0, source: 'E[wasted] = K·(1−q) — exact' },
  ],
};

const roundRobinAgeCase: CheckCase = {
  id: 'round-robin-age',
  title: 'Age of Information, round robin over n = 10 always-fresh sources',
  yaml: `experiment: check-round-robin-age
seed: 23
replications: 2
horizon: 10s
warmup: 100ms
cell:
  uplink: { capacity: 1, harq: { error_probability: 0 } }
groups:
  sources:
    count: 10
    traffic: { model: always-fresh }
    access: { policy: configured-grant, period: 10ms }
`,
  expectations: [
    {
      metric: 'aoi_mean_ms',
      expected: roundRobinAverageAge(10),
      // The window ends mid-cycle: at most one partial sawtooth in 10 s.
      tolerance: 0.01,
      source: 'Δ = n/2 + 1 slots (Yates & Kaul, ISIT 2017; reference-values §8) — exact',
    },
  ],
};

const oracleRecallCase: CheckCase = {
  id: 'oracle-recall',
  title: 'Predicted grants with the oracle at recall 0.7',
  yaml: `experiment: check-oracle-recall
seed: 24
replications: 5
horizon: 30s
warmup: 1s
cell:
  uplink: { capacity: 20, harq: { error_probability: 0 } }
groups:
  alarms:
    count: 2000
    traffic: { model: poisson, mean_interval: 20s }
    access: { policy: predicted-grant, predictor: { model: oracle, recall: 0.7 }, fallback_after: 20ms }
`,
  expectations: [
    { metric: 'predictor_recall', expected: 0.7, tolerance: 0, source: 'each packet foreseen with probability r (binomial) — exact' },
    { metric: 'fallback_share', expected: 0.3, tolerance: 0, source: 'missed packets fall back: 1 − r — exact' },
  ],
};

export const checkCases: readonly CheckCase[] = [
  ...[0.25, 0.5, 1, 2].map(alohaCase),
  ...[10, 54, 100].map(oneOccasionCase),
  barringCase,
  barringDelayCase,
  betaCase,
  retriesCase,
  rampingCase,
  ...[0.5, 0.8].map(configuredQueueCase),
  randomGrantCase,
  roundRobinAgeCase,
  oracleRecallCase,
  model1Case,
  model2Case,
];
