/**
 * The uplink resource pool: `capacity` transmissions per subframe. Transmissions are booked on the
 * subframe they occupy (the first transmission and each HARQ retransmission), so a grant decided now
 * sees what Msg3 and earlier grants already hold in its transmission subframe. A ring of counters
 * indexed by subframe number; entries are reset as the ring wraps.
 *
 * Modelling choice: a booking always succeeds. HARQ retransmissions (synchronous, so their subframe is
 * fixed when the first transmission is granted) and Msg3 are booked even where they overrun the
 * capacity; the overrun only makes `freeAt` 0 for later grant decisions on that subframe. A
 * scheduler would pre-empt or adapt instead; at the loads where this matters the results overstate
 * what the uplink carries by at most the overrun.
 */
export class UplinkPool {
  readonly capacity: number;
  private readonly booked: Int32Array;
  private readonly stamp: Float64Array;
  private readonly mask: number;

  /** `horizon`: how far ahead (ms) bookings can be made; the ring covers it. */
  constructor(capacity: number, horizon: number) {
    this.capacity = capacity;
    let size = 64;
    while (size < horizon + 2) size *= 2;
    this.booked = new Int32Array(size);
    this.stamp = new Float64Array(size).fill(-1);
    this.mask = size - 1;
  }

  /** Units already booked on subframe `u` (an integer ms). */
  bookedAt(u: number): number {
    const slot = u & this.mask;
    return this.stamp[slot] === u ? (this.booked[slot] as number) : 0;
  }

  /** Units still free on subframe `u` (never negative). */
  freeAt(u: number, reserved = 0): number {
    return Math.max(0, this.capacity - reserved - this.bookedAt(u));
  }

  book(u: number, units = 1): void {
    const slot = u & this.mask;
    if (this.stamp[slot] !== u) {
      this.stamp[slot] = u;
      this.booked[slot] = 0;
    }
    this.booked[slot] = (this.booked[slot] as number) + units;
  }
}
