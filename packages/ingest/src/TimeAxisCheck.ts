import type { SampleRange } from './SignalChecks.js';

/** What the time column of a file says about its sampling. Times are in the file's unit. */
export interface TimeAxisSummary {
  readonly samples: number;
  readonly first: number;
  readonly last: number;
  /** Smallest, largest and mean step between consecutive samples (NaN with fewer than 2 samples). */
  readonly minStep: number;
  readonly maxStep: number;
  readonly meanStep: number;
  /** Steps that are zero or negative: the time does not increase there. */
  readonly nonIncreasingSteps: number;
  /** The first such places as (sample before, sample after), 0-based, at most `maxRanges`. */
  readonly nonIncreasingAt: readonly SampleRange[];
}

/**
 * Streaming check of a time column: step statistics and the places where time does not
 * strictly increase (a repeated or backward time stamp). O(1) memory, no allocation per sample.
 *
 * @example
 * const t = new TimeAxisCheck();
 * t.push(new Float64Array([0, 0.5, 1, 1, 2]));
 * t.summary().nonIncreasingAt;
 * // returns [{ first: 2, last: 3 }]
 */
export class TimeAxisCheck {
  private n = 0;
  private first = NaN;
  private prev = NaN;
  private minStep = Infinity;
  private maxStep = -Infinity;
  private bad = 0;
  private readonly at: Float64Array;
  private atCount = 0;

  constructor(private readonly maxRanges = 20) {
    this.at = new Float64Array(Math.max(1, maxRanges));
  }

  /** Adds the next time stamps. */
  push(t: Float64Array): void {
    let { n, prev, minStep, maxStep, bad, atCount } = this;
    for (let j = 0; j < t.length; j++, n++) {
      const v = t[j];
      if (n === 0) {
        this.first = v;
        prev = v;
        continue;
      }
      const step = v - prev;
      if (step < minStep) minStep = step;
      if (step > maxStep) maxStep = step;
      if (!(step > 0)) {
        bad++;
        if (atCount < this.maxRanges) this.at[atCount++] = n - 1;
      }
      prev = v;
    }
    this.n = n;
    this.prev = prev;
    this.minStep = minStep;
    this.maxStep = maxStep;
    this.bad = bad;
    this.atCount = atCount;
  }

  /** The statistics so far. */
  summary(): TimeAxisSummary {
    const steps = this.n - 1;
    const at: SampleRange[] = [];
    for (let k = 0; k < this.atCount; k++) at.push({ first: this.at[k], last: this.at[k] + 1 });
    return {
      samples: this.n,
      first: this.first,
      last: this.n > 0 ? this.prev : NaN,
      minStep: steps > 0 ? this.minStep : NaN,
      maxStep: steps > 0 ? this.maxStep : NaN,
      meanStep: steps > 0 ? (this.prev - this.first) / steps : NaN,
      nonIncreasingSteps: this.bad,
      nonIncreasingAt: at,
    };
  }
}
