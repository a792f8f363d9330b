/** A PredictorHost for the predictor tests (not a test file itself): records flags, fixed seed. */
import { Simulator } from '../../src/kernel/index.js';
import { replicationSeed, StreamSet } from '../../src/random/index.js';
import type { Stream } from '../../src/random/index.js';
import type { Positions } from '../../src/geometry/positions.js';
import type { PredictorHost } from '../../src/predict/predictor.js';

export class FakeHost implements PredictorHost {
  readonly sim = new Simulator();
  readonly deviceCount: number;
  readonly positions: Positions | null;
  /** Current flag of each device, as reported through flag(). */
  readonly flagged: Uint8Array;
  /** flag() calls that did not change the flag (a predictor should never make them). */
  redundant = 0;
  /** Number of devices currently flagged. */
  flaggedCount = 0;
  private readonly streams: StreamSet;

  constructor(deviceCount: number, positions: Positions | null = null, seedName = 'jostle-predict-tests') {
    this.deviceCount = deviceCount;
    this.positions = positions;
    this.flagged = new Uint8Array(deviceCount);
    this.streams = new StreamSet(replicationSeed(seedName, null, 0));
  }

  stream(purpose: string): Stream {
    return this.streams.stream(purpose);
  }

  flag(device: number, on: boolean): void {
    if (!(device >= 0 && device < this.deviceCount)) throw new RangeError(`flag: device ${device} out of range`);
    const v = on ? 1 : 0;
    if (this.flagged[device] === v) this.redundant++;
    else this.flaggedCount += on ? 1 : -1;
    this.flagged[device] = v;
  }
}

/** Positions from coordinate lists (metres). */
export function positionsOf(x: readonly number[], y: readonly number[]): Positions {
  return { x: Float64Array.from(x), y: Float64Array.from(y) };
}
