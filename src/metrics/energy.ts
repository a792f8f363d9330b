/**
 * The device power-state model (`cell.energy`): power drawn while transmitting, receiving or
 * monitoring, awake but idle, and asleep. Defaults are the levels of the 3GPP TR 45.820 (Cellular IoT)
 * battery-life evaluation as recalled (from memory): transmit 500 mW (23 dBm output), receive 80 mW,
 * light sleep 3 mW, deep sleep 0.015 mW. Change them to your module's data sheet.
 */
import { z } from 'zod';

export const energySchema = z
  .strictObject({
    transmit_mw: z.number().nonnegative().default(500).describe('Power while transmitting, mW (TR 45.820, from memory: 500 mW at 23 dBm).'),
    receive_mw: z.number().nonnegative().default(80).describe('Power while receiving or monitoring for a response or grant, mW (TR 45.820, from memory: 80 mW).'),
    idle_mw: z.number().nonnegative().default(3).describe('Power while awake but idle (waiting for an occasion, backoff, barring), mW (TR 45.820 light sleep, from memory: 3 mW).'),
    sleep_mw: z.number().nonnegative().default(0.015).describe('Power while asleep between accesses, mW (TR 45.820 deep sleep, from memory: 0.015 mW).'),
  })
  .describe('Device power-state model for the energy metrics.');

export type EnergyParams = z.output<typeof energySchema>;
