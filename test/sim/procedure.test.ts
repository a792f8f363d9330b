/**
 * Timing of the 4-step procedure, exactly as the reference procedure states it: occasions at
 * t = 5k + 1 ms (TS 36.211 Table 5.7.1-2, PRACH configuration index 6); response 3 subframes after the
 * occasion (TS 36.321 5.1.4); Msg3 6 ms after the response (TS 36.213 8.2, k1 = 6); Msg4 5 ms after
 * the decoded Msg3 (modelling choice); HARQ round trip 8 ms; contention-resolution timer 48 ms;
 * failure at the end of the 5-subframe window.
 */
import { describe, expect, it } from 'vitest';
import { metricOf, runYaml } from './run-yaml.js';

const lone = (cell: string, window = '1ms'): string => `experiment: timing
seed: 808
replications: 3
cell:
  random_access:
    preambles: 4096
${cell}groups:
  one:
    count: 200
    traffic: { model: uniform-window, window: ${window} }
`;

describe('procedure timing', () => {
  it('lone preamble, no errors: Msg4 arrives 3 + 6 + 5 = 14 ms after the occasion', () => {
    // 200 devices spread over 100 s: occasions almost never hold two devices.
    const r = runYaml(
      lone('    detection: perfect\n    answers_per_subframe: unlimited\n    msg3: { error_probability: 0 }\n    msg4: { error_probability: 0 }\n', '100s'),
    );
    expect(metricOf(r, 'delay_from_first_preamble_mean_ms').mean).toBeCloseTo(14, 6);
    expect(metricOf(r, 'delay_from_first_preamble_p95_ms').mean).toBeCloseTo(14, 1);
    // Arrival to occasion: uniform over the 5 ms period, so delay from arrival is 14 + U(0, 5), mean 16.5
    // (standard error over 600 packets ≈ 0.06 ms).
    const d = metricOf(r, 'delay_mean_ms').mean;
    expect(Math.abs(d - 16.5)).toBeLessThan(0.3);
  });

  it('answers are spread 3 per subframe: 15 lone devices end 14 … 18 ms after the occasion (mean 16)', () => {
    const yaml = `experiment: spread
seed: 809
replications: 1
cell:
  random_access:
    preambles: 4096
    detection: perfect
    msg3: { error_probability: 0 }
    msg4: { error_probability: 0 }
groups:
  one:
    count: 15
    traffic: { model: uniform-window, window: 1ms }
`;
    const r = runYaml(yaml);
    const completed = metricOf(r, 'accesses_completed').mean;
    // With 4096 preambles a collision among 15 devices has probability ≈ 2.6 %; this seed has none.
    expect(completed).toBe(15);
    expect(metricOf(r, 'delay_from_first_preamble_mean_ms').mean).toBeCloseTo(16, 6);
  });

  it('Msg3 always lost: each attempt fails when the timer expires after the 5th Msg3 (6 + 4·8 + 48 ms after the response)', () => {
    const r = runYaml(
      lone('    detection: perfect\n    answers_per_subframe: unlimited\n    msg3: { error_probability: 1 }\n    backoff_indicator: 0\n    preamble_trans_max: 2\n'),
    );
    expect(metricOf(r, 'accesses_dropped').mean).toBe(200);
    expect(metricOf(r, 'mean_preamble_transmissions').mean).toBeNaN();
    // Attempt 1 at the occasion at 1 ms fails 3 + 6 + 4·8 + 48 = 89 ms later, at 90 ms; with zero
    // backoff the retry uses the next occasion, at 91 ms, and fails at 91 + 89 = 180 ms, where the
    // run ends (the observation window).
    expect(metricOf(r, 'observation_time_s').mean).toBeCloseTo(0.18, 9);
  });

  it('preamble transmissions of lone devices follow the power-ramping detection law (TR 37.868: p_k = 1 − e^(−k))', () => {
    // Alone on its preamble, a device needs K transmissions with P(K > k) = Π_{i≤k} e^(−i) = e^(−k(k+1)/2):
    // P(K ≤ 1) = 0.632, P(K ≤ 2) = 1 − e^(−3) = 0.950, P(K ≤ 3) = 1 − e^(−6) = 0.9975, so the median is 1,
    // the 90th percentile 2 and the 99th 3; E[K] = Σ_k e^(−k(k−1)/2) = 1.4202.
    const r = runYaml(
      lone('    answers_per_subframe: unlimited\n    msg3: { error_probability: 0 }\n    msg4: { error_probability: 0 }\n', '100s').replace(
        'count: 200',
        'count: 2000',
      ),
    );
    const mean = Array.from({ length: 12 }, (_, k) => Math.exp((-k * (k + 1)) / 2)).reduce((a, b) => a + b, 0);
    expect(mean).toBeCloseTo(1.4202, 4);
    const m = metricOf(r, 'mean_preamble_transmissions');
    // 3 × 2000 accesses, sd of K ≈ 0.55: the 95 % interval of the mean is about ±0.02.
    expect(Math.abs(m.mean - mean)).toBeLessThan(Math.max(m.half_width, 0.02));
    expect(metricOf(r, 'preamble_transmissions_p50').mean).toBe(1);
    expect(metricOf(r, 'preamble_transmissions_p90').mean).toBe(2);
    expect(metricOf(r, 'preamble_transmissions_p99').mean).toBe(3);
  });

  it('undetected or unanswered preambles fail at the end of the response window (3 + 5 = 8 ms)', () => {
    const yaml = `experiment: window
seed: 810
replications: 1
cell:
  random_access:
    preambles: 1
    preamble_trans_max: 1
groups:
  pair:
    count: 2
    traffic: { model: uniform-window, window: 1ms }
`;
    const r = runYaml(yaml);
    // Both devices collide on the single preamble at t = 1 ms and fail at 1 + 8 = 9 ms.
    expect(metricOf(r, 'accesses_dropped').mean).toBe(2);
    expect(metricOf(r, 'observation_time_s').mean).toBeCloseTo(0.009, 9);
  });
});
