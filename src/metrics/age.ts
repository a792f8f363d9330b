/**
 * Age of Information (Kaul, Yates, Gruteser, INFOCOM 2012): at time s the age of a device's
 * information at the base station is s − u(s), u(s) the generation time of the freshest packet
 * delivered so far. Per device the age is integrated from its first delivery (or the warm-up, if
 * later) to the end of the run; peaks are the ages just before each update. Memory: three numbers per
 * device; work: O(1) per delivery and one pass over the devices at the end.
 */
export interface AgeSummary {
  /** Sum over reporting devices of their time-average age (ms). */
  readonly ageSum: number;
  readonly reportingDevices: number;
  /** Sum and count of peak ages (ms), over all updates after a device's first. */
  readonly peakSum: number;
  readonly peakCount: number;
}

export class AgeTracker {
  private readonly freshest: Float64Array;
  private readonly since: Float64Array;
  private readonly area: Float64Array;
  private readonly firstUpdate: Float64Array;
  private readonly peakSum: Float64Array;
  private readonly peakCount: Float64Array;
  private readonly warmup: number;
  private readonly groupOf: Uint16Array;

  constructor(groupOf: Uint16Array, groups: number, warmup: number) {
    const n = groupOf.length;
    this.groupOf = groupOf;
    this.freshest = new Float64Array(n).fill(Number.NaN);
    this.since = new Float64Array(n).fill(Number.NaN);
    this.area = new Float64Array(n);
    this.firstUpdate = new Float64Array(n).fill(Number.NaN);
    this.peakSum = new Float64Array(groups);
    this.peakCount = new Float64Array(groups);
    this.warmup = warmup;
  }

  /** Integral of the age s − f over [a, b]. */
  private static integral(f: number, a: number, b: number): number {
    return b > a ? (b - a) * ((a + b) / 2 - f) : 0;
  }

  /** A packet generated at `generated` was delivered at `t`. */
  delivered(device: number, generated: number, t: number): void {
    const f = this.freshest[device] as number;
    if (!(generated > f) && !Number.isNaN(f)) return; // older than what the base station already has
    if (!Number.isNaN(f)) {
      const from = Math.max(this.since[device] as number, this.warmup);
      this.area[device] = (this.area[device] as number) + AgeTracker.integral(f, from, t);
      if (t >= this.warmup) {
        const g = this.groupOf[device] as number;
        this.peakSum[g] = (this.peakSum[g] as number) + (t - f);
        this.peakCount[g] = (this.peakCount[g] as number) + 1;
      }
    } else {
      this.firstUpdate[device] = t;
    }
    this.freshest[device] = generated;
    this.since[device] = t;
  }

  /** Per-group summaries at the end of the run (`end` in ms). */
  summarize(groupFirst: readonly number[], groupCount: readonly number[], end: number): AgeSummary[] {
    return groupFirst.map((first, g) => {
      let sum = 0;
      let devices = 0;
      for (let d = first; d < first + (groupCount[g] as number); d++) {
        const f = this.freshest[d] as number;
        if (Number.isNaN(f)) continue;
        const start = Math.max(this.firstUpdate[d] as number, this.warmup);
        if (!(end > start)) continue;
        const area = (this.area[d] as number) + AgeTracker.integral(f, Math.max(this.since[d] as number, this.warmup), end);
        sum += area / (end - start);
        devices++;
      }
      return { ageSum: sum, reportingDevices: devices, peakSum: this.peakSum[g] as number, peakCount: this.peakCount[g] as number };
    });
  }
}
