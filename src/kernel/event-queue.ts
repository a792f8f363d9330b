/**
 * Event queue: the earliest event leaves first.
 *
 * Ordering rule: events leave by increasing time; events with equal time leave in the order
 * they were pushed (first in, first out). Every push takes the next value of one insertion
 * counter `seq`, shared by the two structures below, so the order (time, seq) is exact.
 *
 * Structure (one queue, two stores):
 * - a binary min-heap on parallel typed arrays (time, seq, kind, subject) takes any event;
 * - a timing wheel takes events whose time is a whole number inside [base, base + span):
 *   slot `time & (span - 1)` holds a FIFO linked list. The window is exactly `span` wide, so
 *   one slot holds one time only. List nodes live in typed arrays recycled through a free list.
 * Invariant: base <= ceil(time of the last popped event); every pop sets base to that value,
 * so whole-number events near the present keep landing in the wheel (an empty wheel costs
 * nothing: a count of its entries is kept). pop() scans the wheel from a cursor (a lower bound
 * of its earliest entry), never past the heap's top time, and takes the smaller candidate by
 * (time, seq).
 */

/** Options of an EventQueue; all optional. */
export interface EventQueueOptions {
  /** Width of the timing wheel in time units; a power of two in [2, 2^30]. Default 4096. */
  wheelSpan?: number;
  /** Initial room of the heap and of the wheel's node pool, in events. Default 1024. */
  initialCapacity?: number;
}

const DEFAULT_SPAN = 4096;
const DEFAULT_CAPACITY = 1024;
/** Wheel times stay below 2^53 - 2^30 so that the cursor's `c + 1` is always exact. */
const WHEEL_TIME_MAX = 2 ** 53 - 2 ** 30;

function checkOptions(span: number, capacity: number): void {
  if (!Number.isInteger(span) || span < 2 || span > 2 ** 30 || (span & (span - 1)) !== 0) {
    throw new RangeError(`EventQueue: wheelSpan must be a power of two in [2, 2^30], got ${span}`);
  }
  if (!Number.isInteger(capacity) || capacity < 1 || capacity > 2 ** 28) {
    throw new RangeError(`EventQueue: initialCapacity must be an integer in [1, 2^28], got ${capacity}`);
  }
}

function grownF64(a: Float64Array): Float64Array {
  const b = new Float64Array(a.length * 2);
  b.set(a);
  return b;
}

function grownI32(a: Int32Array): Int32Array {
  const b = new Int32Array(a.length * 2);
  b.set(a);
  return b;
}

/** Priority queue of events (time, kind, subject) ordered by (time, insertion order). */
export class EventQueue {
  /** Time of the event removed by the last successful pop(). */
  lastTime = 0;
  /** Kind (int32) of the event removed by the last successful pop(). */
  lastKind = 0;
  /** Subject (int32) of the event removed by the last successful pop(). */
  lastSubject = 0;

  private readonly span: number;
  private readonly mask: number;
  private seq = 0;
  // Heap store.
  private hSize = 0;
  private hTime: Float64Array;
  /** Node (in the shared node pool) holding the seq, kind and subject of each heap entry. */
  private hNode: Int32Array;
  // Wheel store.
  private base = 0;
  private cursor = 0;
  private wheelCount = 0;
  private readonly heads: Int32Array;
  private readonly tails: Int32Array;
  private freeHead = 0;
  private nSeq: Float64Array;
  private nKind: Int32Array;
  private nSubject: Int32Array;
  private nNext: Int32Array;

  constructor(options: EventQueueOptions = {}) {
    const span = options.wheelSpan ?? DEFAULT_SPAN;
    const capacity = options.initialCapacity ?? DEFAULT_CAPACITY;
    checkOptions(span, capacity);
    this.span = span;
    this.mask = span - 1;
    this.hTime = new Float64Array(capacity);
    this.hNode = new Int32Array(capacity);
    this.heads = new Int32Array(span).fill(-1);
    this.tails = new Int32Array(span).fill(-1);
    this.nSeq = new Float64Array(capacity);
    this.nKind = new Int32Array(capacity);
    this.nSubject = new Int32Array(capacity);
    this.nNext = new Int32Array(capacity);
    this.linkFree(0, capacity);
  }

  /** Number of events waiting. */
  get size(): number {
    return this.hSize + this.wheelCount;
  }

  /** Hot path, no validation. time: finite, >= the time of the last popped event. kind, subject: int32. */
  push(time: number, kind: number, subject: number): void {
    const seq = this.seq++;
    const d = time - this.base;
    if (d >= 0 && d < this.span && Math.floor(time) === time && time < WHEEL_TIME_MAX) {
      this.pushWheel(time, seq, kind, subject);
    } else {
      this.pushHeap(time, seq, kind, subject);
    }
  }

  /**
   * Removes the earliest event (smallest time, ties first in first out). Returns false when
   * empty; after true, read lastTime, lastKind and lastSubject.
   */
  pop(): boolean {
    const hSize = this.hSize;
    const top = hSize !== 0 ? this.hTime[0]! : Infinity;
    if (this.wheelCount !== 0) {
      const c = this.scan(top);
      const node = this.heads[c & this.mask]!;
      if (node !== -1 && (c < top || (c === top && this.nSeq[node]! < this.nSeq[this.hNode[0]!]!))) {
        this.popWheel(c, node);
        return true;
      }
    }
    if (hSize === 0) return false;
    this.popHeap(top);
    return true;
  }

  /** Time of the earliest event; Infinity when empty. */
  peekTime(): number {
    const top = this.hSize !== 0 ? this.hTime[0]! : Infinity;
    if (this.wheelCount === 0) return top;
    const c = this.scan(top);
    return this.heads[c & this.mask] !== -1 && c < top ? c : top;
  }

  /** Removes every event and forgets the last popped time: the queue is as new. */
  clear(): void {
    this.seq = 0;
    this.hSize = 0;
    this.base = 0;
    this.cursor = 0;
    this.wheelCount = 0;
    this.heads.fill(-1);
    this.tails.fill(-1);
    this.linkFree(0, this.nNext.length);
    this.lastTime = 0;
    this.lastKind = 0;
    this.lastSubject = 0;
  }

  /** First time >= cursor whose wheel slot is non-empty, or the first one >= top; saved as cursor. */
  private scan(top: number): number {
    const heads = this.heads;
    const mask = this.mask;
    let c = this.cursor;
    while (heads[c & mask] === -1 && c < top) c++;
    this.cursor = c;
    return c;
  }

  private pushWheel(time: number, seq: number, kind: number, subject: number): void {
    if (this.freeHead === -1) this.growNodes();
    const node = this.freeHead;
    const next = this.nNext;
    this.freeHead = next[node]!;
    this.nSeq[node] = seq;
    this.nKind[node] = kind;
    this.nSubject[node] = subject;
    next[node] = -1;
    const slot = time & this.mask;
    const tail = this.tails[slot]!;
    if (tail === -1) this.heads[slot] = node;
    else next[tail] = node;
    this.tails[slot] = node;
    this.wheelCount++;
    if (time < this.cursor) this.cursor = time;
  }

  private popWheel(time: number, node: number): void {
    const slot = time & this.mask;
    const next = this.nNext;
    const after = next[node]!;
    this.heads[slot] = after;
    if (after === -1) this.tails[slot] = -1;
    this.lastTime = time;
    this.lastKind = this.nKind[node]!;
    this.lastSubject = this.nSubject[node]!;
    next[node] = this.freeHead;
    this.freeHead = node;
    this.wheelCount--;
    this.base = time; // cursor === time already (scan stopped here)
  }

  // Heap entries are (time, node): the seq, kind and subject live in the node pool shared with the
  // wheel, so a sift moves two numbers per level instead of four.
  private pushHeap(time: number, seq: number, kind: number, subject: number): void {
    if (this.hSize === this.hTime.length) this.growHeap();
    if (this.freeHead === -1) this.growNodes();
    const node = this.freeHead;
    this.freeHead = this.nNext[node]!;
    this.nSeq[node] = seq;
    this.nKind[node] = kind;
    this.nSubject[node] = subject;
    const hTime = this.hTime;
    const hNode = this.hNode;
    let i = this.hSize++;
    while (i > 0) {
      const p = (i - 1) >> 1;
      const pt = hTime[p]!;
      if (pt <= time) break; // on equal times the parent is older: seq only grows
      hTime[i] = pt;
      hNode[i] = hNode[p]!;
      i = p;
    }
    hTime[i] = time;
    hNode[i] = node;
  }

  /** Removes the heap's top (whose time is `time`), then moves base up to ceil(time). */
  private popHeap(time: number): void {
    const node = this.hNode[0]!;
    this.lastTime = time;
    this.lastKind = this.nKind[node]!;
    this.lastSubject = this.nSubject[node]!;
    this.nNext[node] = this.freeHead;
    this.freeHead = node;
    const n = --this.hSize;
    if (n > 0) this.siftDownLast(this.hTime, this.hNode, this.nSeq, n);
    const b = Math.ceil(time);
    if (this.wheelCount === 0) {
      this.base = b;
      this.cursor = b;
    } else if (b > this.base) {
      this.base = b; // cursor >= b already: pop() scanned the wheel up to this heap top
    }
  }

  /** Moves the element at index n into the hole at the root and sifts it down within [0, n). */
  private siftDownLast(hTime: Float64Array, hNode: Int32Array, nSeq: Float64Array, n: number): void {
    const t = hTime[n]!;
    const node = hNode[n]!;
    const s = nSeq[node]!;
    let i = 0;
    const half = n >> 1;
    while (i < half) {
      let c = 2 * i + 1;
      const r = c + 1;
      if (r < n) {
        const rt = hTime[r]!;
        const lt = hTime[c]!;
        c += ((rt < lt) as unknown as number) | 0; // branch-free pick of the smaller child
        if (rt === lt && nSeq[hNode[r]!]! < nSeq[hNode[c]!]!) c = r;
      }
      const ct = hTime[c]!;
      if (t < ct || (t === ct && s < nSeq[hNode[c]!]!)) break;
      hTime[i] = ct;
      hNode[i] = hNode[c]!;
      i = c;
    }
    hTime[i] = t;
    hNode[i] = node;
  }

  private growHeap(): void {
    this.hTime = grownF64(this.hTime);
    this.hNode = grownI32(this.hNode);
  }

  private growNodes(): void {
    const old = this.nNext.length;
    this.nSeq = grownF64(this.nSeq);
    this.nKind = grownI32(this.nKind);
    this.nSubject = grownI32(this.nSubject);
    this.nNext = grownI32(this.nNext);
    this.linkFree(old, old * 2);
  }

  /** Makes nodes [from, to) the whole free list (call only when the free list is empty). */
  private linkFree(from: number, to: number): void {
    const next = this.nNext;
    for (let i = from; i < to - 1; i++) next[i] = i + 1;
    next[to - 1] = -1;
    this.freeHead = from;
  }
}
