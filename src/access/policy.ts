/**
 * Access policies: how a device with data reaches the uplink. A group chooses one. The contract is one
 * method: the cell calls `begin(device)` when the device's head-of-line packet is ready to be sent,
 * and the policy eventually calls the host's `delivered` or `dropped` for that packet.
 */
import type { Simulator } from '../kernel/index.js';
import type { StreamSet } from '../random/index.js';
import type { Ledger } from '../metrics/ledger.js';
import type { ContentionProcedure } from './contention/procedure.js';

export interface AccessPolicy {
  begin(device: number): void;
}

/** What a policy may use to build itself. */
export interface PolicyContext {
  readonly sim: Simulator;
  readonly ledger: Ledger;
  readonly streams: StreamSet;
  readonly group: string;
  readonly groupIndex: number;
  readonly firstDevice: number;
  readonly deviceCount: number;
  /** The cell's shared contention procedure (random-access channel). */
  readonly contention: ContentionProcedure;
}
