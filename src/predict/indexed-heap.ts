/**
 * A binary min-heap of device indices 0 … capacity − 1, keyed by a number per device, with
 * O(log n) insert, remove(device), update(device, key) and pop, and O(1) peek and membership, through
 * a position array. Order: smaller key first; equal keys by smaller device index (deterministic).
 * Storage is three typed arrays sized once: keys by device, the heap of devices, positions by device
 * (−1 = absent). NaN keys are rejected; ±Infinity are allowed.
 */
export class IndexedHeap {
  /** Devices are 0 … capacity − 1. */
  readonly capacity: number;
  private readonly keys: Float64Array;
  private readonly heap: Int32Array;
  private readonly pos: Int32Array;
  private n = 0;

  constructor(capacity: number) {
    if (!(Number.isInteger(capacity) && capacity >= 0 && capacity <= 0x7fffffff)) {
      throw new RangeError(`IndexedHeap: capacity must be an integer in [0, 2^31), got ${capacity}`);
    }
    this.capacity = capacity;
    this.keys = new Float64Array(capacity);
    this.heap = new Int32Array(capacity);
    this.pos = new Int32Array(capacity).fill(-1);
  }

  /** Number of devices in the heap. */
  get size(): number {
    return this.n;
  }

  /** True if `device` is in the heap. */
  has(device: number): boolean {
    return this.pos[device] !== undefined && (this.pos[device] as number) >= 0;
  }

  /** The key of `device` (meaningful only while it is in the heap). */
  keyOf(device: number): number {
    return this.keys[device] as number;
  }

  /** The device with the smallest (key, index), or −1 when empty. */
  peek(): number {
    return this.n === 0 ? -1 : (this.heap[0] as number);
  }

  /** The smallest key, or +Infinity when empty. */
  peekKey(): number {
    return this.n === 0 ? Infinity : (this.keys[this.heap[0] as number] as number);
  }

  /** Removes and returns the device with the smallest (key, index), or −1 when empty. */
  pop(): number {
    if (this.n === 0) return -1;
    const top = this.heap[0] as number;
    this.removeAt(0);
    return top;
  }

  /** Adds `device` with `key`; RangeError if it is already present, out of range, or key is NaN. */
  insert(device: number, key: number): void {
    this.check(device, key);
    if (this.has(device)) throw new RangeError(`IndexedHeap.insert: device ${device} is already present`);
    this.keys[device] = key;
    const i = this.n++;
    this.heap[i] = device;
    this.pos[device] = i;
    this.siftUp(i);
  }

  /** Changes the key of a present `device`; RangeError if absent or key is NaN. */
  update(device: number, key: number): void {
    this.check(device, key);
    const i = this.pos[device] as number;
    if (i < 0) throw new RangeError(`IndexedHeap.update: device ${device} is absent`);
    const old = this.keys[device] as number;
    this.keys[device] = key;
    if (key < old) this.siftUp(i);
    else if (key > old) this.siftDown(i);
  }

  /** Inserts `device` or updates its key. */
  set(device: number, key: number): void {
    if (this.has(device)) this.update(device, key);
    else this.insert(device, key);
  }

  /** Removes `device` if present; returns whether it was. */
  remove(device: number): boolean {
    if (!this.has(device)) return false;
    this.removeAt(this.pos[device] as number);
    return true;
  }

  /** Removes every device. O(size). */
  clear(): void {
    for (let i = 0; i < this.n; i++) this.pos[this.heap[i] as number] = -1;
    this.n = 0;
  }

  /**
   * Multiplies every key by `factor` (> 0, finite) and restores the heap order (O(size)). Scaling
   * keeps the order of distinct keys except where rounding makes them equal; the rebuild then orders
   * such ties by index, so the heap is always valid.
   */
  scaleKeys(factor: number): void {
    if (!(factor > 0 && factor < Infinity)) throw new RangeError(`IndexedHeap.scaleKeys: factor must be finite and > 0, got ${factor}`);
    for (let i = 0; i < this.n; i++) {
      const d = this.heap[i] as number;
      this.keys[d] = (this.keys[d] as number) * factor;
    }
    for (let i = (this.n >> 1) - 1; i >= 0; i--) this.siftDown(i);
  }

  private check(device: number, key: number): void {
    if (!(Number.isInteger(device) && device >= 0 && device < this.capacity)) {
      throw new RangeError(`IndexedHeap: device ${device} is not in [0, ${this.capacity})`);
    }
    if (Number.isNaN(key)) throw new RangeError(`IndexedHeap: key of device ${device} is NaN`);
  }

  /** True if device a comes before device b. */
  private before(a: number, b: number): boolean {
    const ka = this.keys[a] as number, kb = this.keys[b] as number;
    return ka < kb || (ka === kb && a < b);
  }

  private removeAt(i: number): void {
    const heap = this.heap;
    const gone = heap[i] as number;
    this.pos[gone] = -1;
    const last = --this.n;
    if (i === last) return;
    const moved = heap[last] as number;
    heap[i] = moved;
    this.pos[moved] = i;
    if (i > 0 && this.before(moved, heap[(i - 1) >> 1] as number)) this.siftUp(i);
    else this.siftDown(i);
  }

  private siftUp(i: number): void {
    const heap = this.heap, pos = this.pos;
    const d = heap[i] as number;
    while (i > 0) {
      const p = (i - 1) >> 1;
      const pd = heap[p] as number;
      if (!this.before(d, pd)) break;
      heap[i] = pd;
      pos[pd] = i;
      i = p;
    }
    heap[i] = d;
    pos[d] = i;
  }

  private siftDown(i: number): void {
    const heap = this.heap, pos = this.pos, n = this.n;
    const d = heap[i] as number;
    for (;;) {
      const l = 2 * i + 1;
      if (l >= n) break;
      const r = l + 1;
      let c = l;
      if (r < n && this.before(heap[r] as number, heap[l] as number)) c = r;
      const cd = heap[c] as number;
      if (!this.before(cd, d)) break;
      heap[i] = cd;
      pos[cd] = i;
      i = c;
    }
    heap[i] = d;
    pos[d] = i;
  }
}
