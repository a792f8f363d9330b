/**
 * Access policies: how a device with data reaches the uplink. A group chooses one. The cell calls
 * `begin(device)` when the device's head-of-line packet is ready to be sent; the policy eventually
 * calls the host's `delivered` or `dropped` for that packet (possibly through the contention
 * procedure, for hybrid access). The cell calls `finished` for every packet of the group that ends,
 * whichever way it went, so the policy can learn (predictors) and reset its state.
 */
import type { Simulator } from '../kernel/index.js';
import type { StreamSet } from '../random/index.js';
import type { Ledger } from '../metrics/ledger.js';
import type { Positions } from '../geometry/positions.js';
import type { ContentionProcedure } from './contention/procedure.js';
import type { UplinkPool } from './grants/pool.js';
import type { UplinkParams } from './grants/params.js';

export interface AccessPolicy {
  begin(device: number): void;
  /**
   * The device's current packet ended at `t`: delivered (true) or dropped (false). `seenStart` is when
   * the base station first saw that access (grant time or successful preamble occasion; NaN if never).
   */
  finished?(device: number, t: number, delivered: boolean, seenStart: number): void;
}

/** What the cell offers to policies. */
export interface PolicyHost {
  readonly sim: Simulator;
  readonly ledger: Ledger;
  readonly holArrival: Float64Array;
  delivered(device: number, t: number, preambleTx: number, firstPreamble: number, seenStart: number): void;
  dropped(device: number, t: number): void;
  /** Generate-at-will traffic: stamps the packet's generation time when its transmission starts. */
  transmissionStarts(device: number, t: number): void;
}

/** What a policy may use to build itself. */
export interface PolicyContext {
  readonly host: PolicyHost;
  readonly streams: StreamSet;
  readonly group: string;
  readonly groupIndex: number;
  readonly firstDevice: number;
  readonly deviceCount: number;
  /** The cell's shared contention procedure (random-access channel). */
  readonly contention: ContentionProcedure;
  readonly uplink: UplinkParams;
  readonly pool: UplinkPool;
  /** Positions of the group's devices (metres) — computed on first use. */
  positions(): Positions;
}
