/**
 * Scheduled uplink resources (`cell.uplink`): grant occasions, their capacity, the grant-to-transmission
 * delay and the HARQ of granted transmissions.
 */
import { z } from 'zod';
import { duration } from '../../config/duration.js';

const wholeMs = (ms: number): boolean => Number.isInteger(ms);
const subframes = { message: 'must be a whole number of milliseconds (subframes)' };

export const uplinkSchema = z
  .strictObject({
    capacity: z
      .number()
      .int()
      .min(0)
      .default(6)
      .describe('Uplink transmissions per subframe the scheduler can hand out (grants of all groups, and Msg3 when shared).'),
    grant_period: duration({ positive: true, description: 'Time between two grant occasions (scheduling decisions).' })
      .default(1)
      .refine(wholeMs, subframes),
    grant_delay: duration({ description: 'From a grant to the transmission it allows (LTE FDD: 4 subframes, TS 36.213 8.0).' })
      .default(4)
      .refine(wholeMs, subframes),
    tti: duration({ positive: true, description: 'Transmission time interval: a transmission in subframe u is received at u + tti.' })
      .default(1)
      .refine(wholeMs, subframes),
    harq: z
      .strictObject({
        error_probability: z.number().min(0).max(1).default(0.1).describe('Probability that one granted transmission is not decoded (as Msg3: 0.1).'),
        max_transmissions: z.number().int().min(1).max(64).default(5).describe('Most transmissions of one packet (as Msg3: 5).'),
        round_trip: duration({ positive: true, description: 'Time between HARQ transmissions (synchronous uplink HARQ: 8ms).' })
          .default(8)
          .refine(wholeMs, subframes),
      })
      .prefault({})
      .describe('HARQ of granted transmissions (same defaults as Msg3).'),
    reserved_for_grants: z
      .number()
      .int()
      .min(0)
      .default(0)
      .describe('With msg3: shared, units of each subframe that Msg3 may not use (kept for grants): the price contending devices pay for grant capacity.'),
    msg3: z
      .enum(['separate', 'shared'])
      .default('separate')
      .describe(
        'separate: Msg3 of the contention procedure uses its own resources (limited only by the response capacity); shared: every Msg3 transmission also takes one unit of `capacity`, so resources reserved for grants cost the contending devices.',
      ),
  })
  .refine((u) => u.reserved_for_grants <= u.capacity, { message: 'reserved_for_grants cannot exceed capacity', path: ['reserved_for_grants'] })
  .describe('Scheduled uplink resources: grant occasions and their capacity.');

export type UplinkParams = z.output<typeof uplinkSchema>;
