/**
 * Parameters of the 4-step contention procedure (`cell.random_access` in YAML). Every default is the
 * value of the reference procedure: 3GPP TR 37.868 evaluation assumptions, TS 36.321 clause 5.1,
 * TS 36.211 Table 5.7.1-2.
 */
import { z } from 'zod';
import { duration } from '../../config/duration.js';

const wholeMs = (ms: number): boolean => Number.isInteger(ms);

const harqSchema = (what: string) =>
  z
    .strictObject({
      error_probability: z
        .number()
        .min(0)
        .max(1)
        .default(0.1)
        .describe(`Probability that one ${what} transmission is not decoded (TR 37.868: 0.1).`),
      max_transmissions: z
        .number()
        .int()
        .min(1)
        .max(64)
        .default(5)
        .describe(`Most ${what} transmissions (first + HARQ retransmissions) (TR 37.868: 5).`),
      round_trip: duration({ positive: true, description: `Time between two ${what} HARQ transmissions (synchronous uplink HARQ: 8ms).` })
        .default(8)
        .refine(wholeMs, { message: 'must be a whole number of milliseconds (subframes)' }),
    })
    .describe(`HARQ of ${what}.`);

export const barringSchema = z
  .strictObject({
    factor: z
      .number()
      .gt(0)
      .max(1)
      .describe(
        'Access class barring factor p: a device proceeds when u < p (TS 36.331 5.3.3.11). Standard values are 0.05 … 0.95; any value in (0, 1] is accepted for analysis.',
      ),
    time: duration({ positive: true, description: 'Barring time T; a barred device waits (0.7 + 0.6·u)·T (TS 36.331 5.3.3.11). Standard: 4s … 512s.' }),
    apply_to: z
      .enum(['first-attempt', 'every-attempt'])
      .default('first-attempt')
      .describe('Check barring before the first preamble only (default), or before every attempt (modelling choice).'),
  })
  .describe('Optional access class barring.');

export const randomAccessSchema = z
  .strictObject({
    occasion_period: duration({ positive: true, description: 'Time between random-access occasions (PRACH configuration index 6: 5ms).' }).default(5),
    occasion_offset: duration({ description: 'Time of the first occasion (PRACH configuration index 6: subframe 1 → 1ms).' }).default(1),
    preambles: z.number().int().min(1).max(4096).default(54).describe('Contention preambles per occasion (TR 37.868: 64 − 10 = 54).'),
    detection: z
      .enum(['power-ramping', 'perfect'])
      .default('power-ramping')
      .describe('power-ramping: a preamble sent alone at the k-th attempt is detected with probability 1 − e^(−k) (TR 37.868); perfect: always.'),
    collided_preambles: z
      .enum(['unanswered', 'answered'])
      .default('unanswered')
      .describe(
        'unanswered: a preamble chosen by two or more devices gets no response (reproduces TR 37.868 as recalled); answered: it is detected if any of its transmissions is, takes a response, and its devices collide at Msg3.',
      ),
    response_delay: duration({ description: 'From the occasion to the start of the response window (TS 36.321 5.1.4: 3 subframes).' })
      .default(3)
      .refine(wholeMs, { message: 'must be a whole number of milliseconds (subframes)' }),
    response_window: duration({ positive: true, description: 'ra-ResponseWindowSize (TR 37.868: 5 subframes).' })
      .default(5)
      .refine(wholeMs, { message: 'must be a whole number of milliseconds (subframes)' }),
    answers_per_subframe: z
      .union([z.number().int().positive(), z.literal('unlimited')])
      .default(3)
      .describe('Random-access responses the base station sends per subframe (TR 37.868: 3), or unlimited.'),
    msg3_delay: duration({ description: 'From the response to Msg3 (UL grant timing of TS 36.213 8.2, k1 = 6).' }).default(6),
    msg3: harqSchema('Msg3').default({ error_probability: 0.1, max_transmissions: 5, round_trip: 8 }),
    msg4_delay: duration({ description: 'From the decoded Msg3 to Msg4 (modelling choice: 5ms).' }).default(5),
    msg4: harqSchema('Msg4').default({ error_probability: 0.1, max_transmissions: 5, round_trip: 8 }),
    contention_resolution_timer: duration({ positive: true, description: 'mac-ContentionResolutionTimer, restarted at each Msg3 transmission (TR 37.868: 48ms).' }).default(48),
    backoff_indicator: duration({ description: 'Backoff is drawn uniformly from [0, backoff_indicator] (TS 36.321 Table 7.2-1 index 2: 20ms).' }).default(20),
    preamble_trans_max: z.number().int().min(1).max(200).default(10).describe('preambleTransMax: attempts before the access is dropped (TR 37.868: 10).'),
    barring: barringSchema.optional(),
  })
  .describe('The 4-step contention procedure (random-access channel) of the cell.');

export type RandomAccessParams = z.output<typeof randomAccessSchema>;
export type BarringParams = z.output<typeof barringSchema>;
