/** Kernel: simulated clock, event queue ordered by (time, scheduling order), run loop. */
export { EventQueue } from './event-queue.js';
export type { EventQueueOptions } from './event-queue.js';
export { Simulator } from './simulator.js';
export type { Handler, RunResult, SimulatorOptions, StopReason } from './simulator.js';
