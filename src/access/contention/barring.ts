/**
 * Access class barring (3GPP TS 36.331 5.3.3.11): before an attempt the device draws u ~ U[0,1); it
 * proceeds if u < factor, otherwise it waits (0.7 + 0.6·u′)·barring_time and draws again.
 */
import type { Stream } from '../../random/index.js';
import type { BarringParams } from './params.js';

export class Barring {
  readonly everyAttempt: boolean;
  private readonly factor: number;
  private readonly time: number;
  private readonly stream: Stream;

  constructor(params: BarringParams, stream: Stream) {
    this.factor = params.factor;
    this.time = params.time;
    this.everyAttempt = params.apply_to === 'every-attempt';
    this.stream = stream;
  }

  /**
   * The instant (ms) at which a device that starts its check at `t` passes barring. The factor is
   * static, so the whole sequence of checks can be drawn at once (the draws are the device's own).
   */
  passTime(t: number): number {
    let at = t;
    while (this.stream.next() >= this.factor) at += (0.7 + 0.6 * this.stream.next()) * this.time;
    return at;
  }
}
