import type { HtmlHistory } from './HtmlReportInput.js';

/**
 * A display copy of a history for the report's history plot: the samples split into `buckets`
 * runs of consecutive indices (default 2000, about two per pixel column), and from each run its
 * smallest and largest sample in index order, with their sample indices. Short histories
 * (at most 2 × buckets samples) are copied whole. Turning points of large loops are extremes,
 * so they survive; the first and the last samples are always kept.
 */
export function displayHistory(values: ArrayLike<number>, buckets = 2000): HtmlHistory {
  return new DisplayHistory(Math.max(1, Math.floor(buckets))).push(values, 0).points();
}

/**
 * A display copy of a long history for plots: the minimum and maximum of each bucket of
 * samples, with their sample indices, and the first and last samples, in memory bounded by the
 * bucket limit. When the buckets exceed the limit, neighbours merge and the bucket size doubles,
 * so any length streams through; a history of fewer than 2 × limit samples is copied whole.
 */
export class DisplayHistory {
  private bucket = 1;
  private n = 0;
  private readonly idx: Float64Array;
  private readonly val: Float64Array;
  private curMinI = -1;
  private curMin = 0;
  private curMaxI = -1;
  private curMax = 0;
  private inBucket = 0;
  private firstIndex = -1;
  private firstValue = 0;
  private lastIndex = -1;
  private lastValue = 0;

  constructor(private readonly maxBuckets = 2048) {
    this.idx = new Float64Array(2 * maxBuckets + 4);
    this.val = new Float64Array(2 * maxBuckets + 4);
  }

  /** Adds the next samples (their first has sample index `first`). */
  push(values: ArrayLike<number>, first: number): this {
    if (values.length === 0) return this;
    if (this.firstIndex < 0) {
      this.firstIndex = first;
      this.firstValue = values[0];
    }
    this.lastIndex = first + values.length - 1;
    this.lastValue = values[values.length - 1];
    for (let k = 0; k < values.length; k++) {
      const v = values[k];
      const i = first + k;
      if (this.inBucket === 0 || v < this.curMin) {
        this.curMin = v;
        this.curMinI = i;
      }
      if (this.inBucket === 0 || v > this.curMax) {
        this.curMax = v;
        this.curMaxI = i;
      }
      if (++this.inBucket === this.bucket) this.close();
    }
    return this;
  }

  /** The points, in sample order: the first sample, the bucket extremes, the last sample. */
  points(): { index: Float64Array; value: Float64Array } {
    if (this.inBucket > 0) this.close();
    if (this.firstIndex < 0) return { index: new Float64Array(0), value: new Float64Array(0) };
    const lead = this.n > 0 && this.idx[0] === this.firstIndex ? 0 : 1;
    const tail = this.n > 0 && this.idx[this.n - 1] === this.lastIndex ? 0 : 1;
    const m = lead + this.n + tail;
    const index = new Float64Array(m);
    const value = new Float64Array(m);
    if (lead) {
      index[0] = this.firstIndex;
      value[0] = this.firstValue;
    }
    index.set(this.idx.subarray(0, this.n), lead);
    value.set(this.val.subarray(0, this.n), lead);
    if (tail) {
      index[m - 1] = this.lastIndex;
      value[m - 1] = this.lastValue;
    }
    return { index, value };
  }

  private close(): void {
    const a = this.curMinI <= this.curMaxI;
    this.add(a ? this.curMinI : this.curMaxI, a ? this.curMin : this.curMax);
    if (this.curMinI !== this.curMaxI) this.add(a ? this.curMaxI : this.curMinI, a ? this.curMax : this.curMin);
    this.inBucket = 0;
    if (this.n >= 2 * this.maxBuckets) this.halve();
  }

  private add(i: number, v: number): void {
    this.idx[this.n] = i;
    this.val[this.n] = v;
    this.n++;
  }

  /** Merges neighbouring buckets (keeps the extremes of each pair of points). */
  private halve(): void {
    let w = 0;
    for (let r = 0; r < this.n; r += 4) {
      const end = Math.min(this.n, r + 4);
      let lo = r;
      let hi = r;
      for (let k = r; k < end; k++) {
        if (this.val[k] < this.val[lo]) lo = k;
        if (this.val[k] > this.val[hi]) hi = k;
      }
      const first = Math.min(lo, hi);
      const second = Math.max(lo, hi);
      const fi = this.idx[first];
      const fv = this.val[first];
      const si = this.idx[second];
      const sv = this.val[second];
      this.idx[w] = fi;
      this.val[w] = fv;
      w++;
      if (second !== first) {
        this.idx[w] = si;
        this.val[w] = sv;
        w++;
      }
    }
    this.n = w;
    this.bucket *= 2;
  }
}
