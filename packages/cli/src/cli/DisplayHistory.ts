/**
 * A display copy of a long history for plots: the minimum and maximum of each bucket of
 * samples, with their sample indices, in O(1) memory per bucket. When the buckets exceed the
 * limit, neighbours merge and the bucket size doubles, so any length streams through.
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
  private samples = 0;

  constructor(private readonly maxBuckets = 2048) {
    this.idx = new Float64Array(2 * maxBuckets + 4);
    this.val = new Float64Array(2 * maxBuckets + 4);
  }

  /** Adds the next samples (their first has sample index `first`). */
  push(values: Float64Array, first: number): void {
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
    this.samples = Math.max(this.samples, first + values.length);
  }

  /** The points, in sample order. */
  points(): { index: Float64Array; value: Float64Array } {
    if (this.inBucket > 0) this.close();
    return { index: this.idx.slice(0, this.n), value: this.val.slice(0, this.n) };
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
