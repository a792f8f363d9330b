/**
 * Named random streams. A Stream is one seedrandom `alea` generator: seedrandom seeds it (Baagøe's
 * Mash hash of the seed string), then the Stream steps the same recurrence on its own fields, which
 * gives exactly alea's numbers at a fraction of the cost of calling it through a closure. A StreamSet
 * holds all named streams of one replication, each seeded from
 * `hashParts([replicationSeed, name])`, so a stream's draws depend only on its name
 * and the replication seed, never on which other streams exist or when they were made.
 */
import seedrandom from 'seedrandom';
import { hashParts } from './seeds.js';

/** 2^32, the resolution of one alea draw. */
const TWO_POW_32 = 4294967296;
/** Largest n for which `x * n` (x < 2^32) is exact in a double: x * n < 2^53. */
const EXACT_PRODUCT_MAX_N = 2097152; // 2^21

/** One seeded sequence of uniform numbers. */
interface AleaState {
  c: number;
  s0: number;
  s1: number;
  s2: number;
}

export class Stream {
  readonly name: string;
  /** alea's state [c, s0, s1, s2]: a carry and three fractions in [0, 1) (unboxed in a typed array). */
  private readonly st: Float64Array;

  /** @param seed any string; the stream is `alea(seed)`. */
  constructor(name: string, seed: string) {
    this.name = name;
    const state = (seedrandom.alea(seed, { state: true }) as seedrandom.PRNG & { state(): AleaState }).state();
    this.st = Float64Array.of(state.c, state.s0, state.s1, state.s2);
  }

  /**
   * Uniform in [0, 1). Resolution 2^-32: every value is a multiple of 2^-32, the
   * largest is 1 - 2^-32, so `1 - next()` is never 0. The recurrence of alea (Baagøe 2010)
   * exactly as seedrandom computes it.
   */
  next(): number {
    const st = this.st;
    const t = 2091639 * (st[1] as number) + (st[0] as number) * 2.3283064365386963e-10; // 2^-32
    const c = t | 0;
    const s2 = t - c;
    st[0] = c;
    st[1] = st[2] as number;
    st[2] = st[3] as number;
    st[3] = s2;
    return s2;
  }

  /**
   * Exactly uniform integer in [0, n); n must be an integer with 1 <= n < 2^32
   * (RangeError otherwise). Rejection removes the modulo bias (Lemire's
   * multiply-and-reject for n <= 2^21, modulo-and-reject above).
   */
  int(n: number): number {
    if (n >>> 0 !== n || n === 0) throw new RangeError(`Stream.int: n must be an integer in [1, 2^32), got ${n}`);
    return n <= EXACT_PRODUCT_MAX_N ? this.intSmall(n) : this.intLarge(n);
  }

  /** Lemire (2019): high word of x*n, rejecting the low words below 2^32 mod n. */
  private intSmall(n: number): number {
    for (;;) {
      const m = this.next() * TWO_POW_32 * n; // exact: < 2^53
      const high = Math.floor(m / TWO_POW_32);
      const low = m - high * TWO_POW_32;
      if (low >= n || low >= TWO_POW_32 % n) return high;
    }
  }

  /** x mod n, accepted only when the whole block [x - r, x - r + n) lies below 2^32. */
  private intLarge(n: number): number {
    for (;;) {
      const x = this.next() * TWO_POW_32;
      const r = x % n;
      if (x - r + n <= TWO_POW_32) return r;
    }
  }
}

/** All named streams of one replication. */
export class StreamSet {
  /** The replication seed every stream seed is derived from. */
  readonly seed: string;
  private readonly streams = new Map<string, Stream>();

  constructor(replicationSeed: string) {
    this.seed = replicationSeed;
  }

  /** The stream called `name`, created on first use from `hashParts([seed, name])` and cached. */
  stream(name: string): Stream {
    let s = this.streams.get(name);
    if (s === undefined) {
      s = new Stream(name, hashParts([this.seed, name]));
      this.streams.set(name, s);
    }
    return s;
  }

  /** Names of the streams created so far, sorted. */
  names(): string[] {
    return [...this.streams.keys()].sort();
  }
}
