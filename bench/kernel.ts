/**
 * Event-queue throughput, hold model: keep ~10^4 events pending; each step pops the earliest
 * and pushes one at (popped time + random increment). Increments come from an inline xorshift32
 * (fixed seed), uniform over [0, 4096) ms: whole numbers for the wheel run, fractional for the
 * heap run. Run directly (`node dist/bench/kernel.js`) to print the figures.
 */
import { pathToFileURL } from 'node:url';
import { EventQueue } from '../src/kernel/index.js';

const PAIRS = 10_000_000;
const PENDING = 10_000;
const WARMUP_PAIRS = 1_000_000;
/** Turns a uint32 into a fractional increment in [0, 4096). */
const FRACTION_SCALE = 4096 / 2 ** 32;

/** Result: pairs, seconds and pairsPerSecond of the whole-number (wheel) run; the fractional (heap) run's rate. */
export interface KernelBenchResult {
  pairs: number;
  seconds: number;
  pairsPerSecond: number;
  heapOnlyPairsPerSecond: number;
}

function xorshift32(x: number): number {
  x ^= x << 13;
  x ^= x >>> 17;
  x ^= x << 5;
  return x;
}

/** Fills a queue with PENDING events at whole or fractional times in [0, 4096). */
function filledQueue(whole: boolean): EventQueue {
  const queue = new EventQueue({ wheelSpan: 4096, initialCapacity: 2 * PENDING });
  let x = 0x2545f491;
  for (let i = 0; i < PENDING; i++) {
    x = xorshift32(x);
    queue.push(whole ? x & 4095 : (x >>> 0) * FRACTION_SCALE, 0, i);
  }
  return queue;
}

/** Hold loop with whole-number increments in [0, 4095]; returns the xorshift state. */
function holdWhole(queue: EventQueue, pairs: number, seed: number): number {
  let x = seed;
  for (let i = 0; i < pairs; i++) {
    queue.pop();
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    queue.push(queue.lastTime + (x & 4095), queue.lastKind, queue.lastSubject);
  }
  return x;
}

/** Hold loop with fractional increments in [0, 4096); returns the xorshift state. */
function holdFractional(queue: EventQueue, pairs: number, seed: number): number {
  let x = seed;
  for (let i = 0; i < pairs; i++) {
    queue.pop();
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    queue.push(queue.lastTime + (x >>> 0) * FRACTION_SCALE, queue.lastKind, queue.lastSubject);
  }
  return x;
}

/** Seconds taken by `pairs` push+pop pairs on a warmed-up queue. */
function timeHold(whole: boolean, pairs: number): number {
  const queue = filledQueue(whole);
  const hold = whole ? holdWhole : holdFractional;
  const x = hold(queue, WARMUP_PAIRS, 88172645);
  const start = process.hrtime.bigint();
  hold(queue, pairs, x);
  const seconds = Number(process.hrtime.bigint() - start) / 1e9;
  if (queue.size !== PENDING) throw new Error(`bench: queue size ${queue.size}, expected ${PENDING}`);
  return seconds;
}

/** Measures 10^7 push+pop pairs with whole-number times (wheel) and with fractional times (heap). */
export async function benchKernel(): Promise<KernelBenchResult> {
  const seconds = timeHold(true, PAIRS);
  const heapSeconds = timeHold(false, PAIRS);
  return { pairs: PAIRS, seconds, pairsPerSecond: PAIRS / seconds, heapOnlyPairsPerSecond: PAIRS / heapSeconds };
}

const direct = process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href;
if (direct) {
  const r = await benchKernel();
  const m = (v: number): string => (v / 1e6).toFixed(2);
  console.log(`event queue, hold model, ${PENDING} pending, ${r.pairs} push+pop pairs`);
  console.log(`  whole-number times (wheel): ${r.seconds.toFixed(3)} s, ${m(r.pairsPerSecond)} M pairs/s`);
  console.log(`  fractional times (heap):    ${m(r.heapOnlyPairsPerSecond)} M pairs/s`);
}
