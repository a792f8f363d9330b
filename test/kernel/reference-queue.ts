/**
 * Test oracle: the discrete-event ordering rule written as plainly as possible (common practice: a
 * future-event list ordered by (time, insertion number)): the next event is the one with the smallest
 * (time, scheduling number); equal times leave first in, first out. Linear scans, no cleverness.
 */
export interface RefEvent {
  readonly time: number;
  readonly seq: number;
  readonly kind: number;
  readonly subject: number;
}

export class ReferenceQueue {
  private readonly events: RefEvent[] = [];
  private nextSeq = 0;

  get size(): number {
    return this.events.length;
  }

  push(time: number, kind: number, subject: number): void {
    this.events.push({ time, seq: this.nextSeq++, kind, subject });
  }

  /** Removes and returns the earliest event by (time, seq), or undefined when empty. */
  pop(): RefEvent | undefined {
    let best = -1;
    for (let i = 0; i < this.events.length; i++) {
      const e = this.events[i]!;
      const b = this.events[best];
      if (b === undefined || e.time < b.time || (e.time === b.time && e.seq < b.seq)) best = i;
    }
    return best < 0 ? undefined : this.events.splice(best, 1)[0];
  }

  peekTime(): number {
    let t = Infinity;
    for (const e of this.events) if (e.time < t) t = e.time;
    return t;
  }
}

/** Indices 0..n-1 ordered by a stable sort on times[i]: the (time, seq) order when seq = index. */
export function stableOrder(times: readonly number[]): number[] {
  return times.map((_, i) => i).sort((a, b) => times[a]! - times[b]!);
}
