import { IngestOptionError } from './IngestError.js';

/** Kinds of {@link SignalWarning}. */
export type SignalWarningKind =
  | 'spike'
  | 'flat-line'
  | 'dropout'
  | 'clipped-maximum'
  | 'clipped-minimum'
  | 'large-offset'
  | 'time-not-increasing';

/** A run of samples, by 0-based sample index, both ends included. */
export interface SampleRange {
  readonly first: number;
  readonly last: number;
}

/** A signal check that found something worth a look. Warnings never stop ingestion. */
export interface SignalWarning {
  readonly kind: SignalWarningKind;
  /** The channel's name. */
  readonly channel: string;
  /** Number of samples concerned. */
  readonly samples: number;
  /** Where: at most `maxRanges` ranges (0-based sample indices, inclusive), in order. */
  readonly ranges: readonly SampleRange[];
  /** Ranges found beyond the ones listed. */
  readonly rangesOmitted: number;
  /** One line for people. */
  readonly message: string;
}

/**
 * Thresholds of the signal checks. Every default is `common practice, no source`: a rule of
 * thumb for strain-gauge and load records sampled well above their content, to be tuned per
 * acquisition system.
 */
export interface SignalCheckThresholds {
  /** A spike jumps out and back by more than this many times the running mean |Δx|. Default 10. */
  spikeFactor: number;
  /** Identical consecutive samples (at least this many) are a flat line (a dropout at 0). Default 100. */
  flatRunSamples: number;
  /** Clipping: at least this many samples sit exactly at the maximum (or minimum). Default 5. */
  clipMinSamples: number;
  /** …and at least this share of all samples. Default 0.001. */
  clipShare: number;
  /** Large offset: |mean| exceeds this share of the range (max − min). Default 0.5. */
  offsetShare: number;
  /** Ranges kept per warning (memory stays O(1)). Default 20. */
  maxRanges: number;
}

/** Defaults of {@link SignalCheckThresholds} (`common practice, no source`). */
export const DEFAULT_SIGNAL_CHECK_THRESHOLDS: Readonly<SignalCheckThresholds> = Object.freeze({
  spikeFactor: 10,
  flatRunSamples: 100,
  clipMinSamples: 5,
  clipShare: 0.001,
  offsetShare: 0.5,
  maxRanges: 20,
});

/** Differences averaged before spikes are looked for; also 1/α of the running mean |Δx|. */
const SPIKE_WARMUP = 32;

/** Fixed-capacity list of sample ranges that merges a range adjacent to the last one. */
class RangeList {
  private readonly bounds: Float64Array;
  count = 0;
  omitted = 0;
  samples = 0;
  constructor(private readonly capacity: number) {
    this.bounds = new Float64Array(2 * capacity);
  }
  add(first: number, last: number): void {
    this.samples += last - first + 1;
    const k = this.count;
    if (k > 0 && k <= this.capacity && this.bounds[2 * k - 1] === first - 1 && this.omitted === 0) {
      this.bounds[2 * k - 1] = last;
      return;
    }
    if (k < this.capacity) {
      this.bounds[2 * k] = first;
      this.bounds[2 * k + 1] = last;
      this.count++;
    } else this.omitted++;
  }
  ranges(): SampleRange[] {
    const out: SampleRange[] = [];
    for (let k = 0; k < this.count; k++) out.push({ first: this.bounds[2 * k], last: this.bounds[2 * k + 1] });
    return out;
  }
}

/**
 * Streaming signal checks of one channel: spikes, flat lines and dropouts, a clipped full
 * scale and a large offset. Push the channel's samples chunk by chunk, then `finish()`.
 * Memory is O(1) (a fixed number of scalars and `maxRanges` ranges per kind); nothing is
 * allocated per sample.
 *
 * Rules (thresholds in {@link SignalCheckThresholds}, all `common practice, no source`):
 * - Spike: sample i with d1 = x[i] − x[i−1] and d2 = x[i+1] − x[i] of opposite signs, both
 *   |d1|, |d2| > spikeFactor · m, and |x[i+1] − x[i−1]| <= min(|d1|, |d2|) / 2 (it comes back),
 *   where m is the running mean of |Δx| (exponential, weight 1/32, each |Δx| clipped at
 *   spikeFactor · m so spikes do not inflate it). Only isolated one-sample spikes are found,
 *   and none in the first 32 samples (warm-up).
 * - Flat line: at least flatRunSamples consecutive identical values; a dropout when the value is 0.
 * - Clipped maximum (minimum): at least max(clipMinSamples, clipShare · n) samples exactly at
 *   the largest (smallest) value, on a non-constant signal. The range reported runs from the
 *   first to the last such sample.
 * - Large offset: |mean| > offsetShare · (max − min); the range is the whole channel.
 *
 * @example
 * const checks = new SignalChecks('strain');
 * const x = new Float64Array(200).map((_, i) => Math.sin(i / 5));
 * x[100] = 50; // invented: one bad sample
 * checks.push(x);
 * checks.finish()[0].ranges;
 * // returns [{ first: 100, last: 100 }]
 */
export class SignalChecks {
  private readonly t: SignalCheckThresholds;
  private n = 0;
  // spike state
  private a = 0;
  private b = 0;
  private m = 0;
  private readonly spikes: RangeList;
  // flat-line state
  private runStart = 0;
  private runValue = 0;
  private readonly flats: RangeList;
  private readonly dropouts: RangeList;
  // extremes
  private max = -Infinity;
  private min = Infinity;
  private atMax = 0;
  private atMin = 0;
  private firstMax = 0;
  private lastMax = 0;
  private firstMin = 0;
  private lastMin = 0;
  // Neumaier sum for the mean
  private sum = 0;
  private comp = 0;

  constructor(
    readonly channel: string,
    thresholds: Partial<SignalCheckThresholds> = {},
  ) {
    this.t = { ...DEFAULT_SIGNAL_CHECK_THRESHOLDS, ...thresholds };
    for (const key of Object.keys(DEFAULT_SIGNAL_CHECK_THRESHOLDS) as (keyof SignalCheckThresholds)[]) {
      const v = this.t[key];
      if (typeof v !== 'number' || !(v >= 0) || !Number.isFinite(v)) throw new IngestOptionError(`checks.${key}`, v, 'must be a finite number >= 0');
    }
    const cap = Math.max(1, Math.floor(this.t.maxRanges));
    this.spikes = new RangeList(cap);
    this.flats = new RangeList(cap);
    this.dropouts = new RangeList(cap);
  }

  /** Adds the next samples; `firstIndex` is the 0-based sample index of `x[0]` (for checking order). */
  push(x: Float64Array, firstIndex = this.n): void {
    if (firstIndex !== this.n) throw new IngestOptionError('firstIndex', firstIndex, `chunks must follow each other: expected ${this.n}`);
    const k = this.t.spikeFactor;
    const flatMin = this.t.flatRunSamples;
    let { n, a, b, m, runStart, runValue, max, min, atMax, atMin, firstMax, lastMax, firstMin, lastMin, sum, comp } = this;
    for (let j = 0; j < x.length; j++, n++) {
      const c = x[j];
      // extremes and mean
      if (c > max) {
        max = c;
        atMax = 0;
        firstMax = n;
      }
      if (c === max) {
        atMax++;
        lastMax = n;
      }
      if (c < min) {
        min = c;
        atMin = 0;
        firstMin = n;
      }
      if (c === min) {
        atMin++;
        lastMin = n;
      }
      const s = sum + c;
      comp += Math.abs(sum) >= Math.abs(c) ? sum - s + c : c - s + sum;
      sum = s;
      if (n === 0) {
        runStart = 0;
        runValue = c;
        b = c;
        continue;
      }
      // flat runs
      if (c !== runValue) {
        if (n - runStart >= flatMin) (runValue === 0 ? this.dropouts : this.flats).add(runStart, n - 1);
        runStart = n;
        runValue = c;
      }
      // spikes: judge sample n-1 (b) between a and c
      const d2 = c - b;
      const ad2 = Math.abs(d2);
      if (n >= 2) {
        const d1 = b - a;
        const ad1 = Math.abs(d1);
        if (n > SPIKE_WARMUP && d1 * d2 < 0) {
          const small = ad1 < ad2 ? ad1 : ad2;
          if (small > k * m && Math.abs(c - a) <= small / 2) this.spikes.add(n - 1, n - 1);
        }
      }
      if (n <= SPIKE_WARMUP) m += (ad2 - m) / n;
      else m += ((ad2 < k * m ? ad2 : k * m) - m) / SPIKE_WARMUP;
      a = b;
      b = c;
    }
    Object.assign(this, { n, a, b, m, runStart, runValue, max, min, atMax, atMin, firstMax, lastMax, firstMin, lastMin, sum, comp });
  }

  /** Samples pushed so far. */
  get length(): number {
    return this.n;
  }

  /** The warnings found, in the order spike, flat line, dropout, clipped max, clipped min, offset. */
  finish(): SignalWarning[] {
    const out: SignalWarning[] = [];
    const ch = this.channel;
    const n = this.n;
    if (n === 0) return out;
    const flats = cloneRuns(this.flats, this.dropouts);
    if (n - this.runStart >= this.t.flatRunSamples) (this.runValue === 0 ? flats.dropouts : flats.flats).add(this.runStart, n - 1);
    const list = (kind: SignalWarningKind, r: RangeList, what: string) => {
      if (r.count === 0) return;
      out.push({
        kind,
        channel: ch,
        samples: r.samples,
        ranges: r.ranges(),
        rangesOmitted: r.omitted,
        message: `${ch}: ${r.count + r.omitted} ${what} (${r.samples} samples), first at sample ${r.ranges()[0].first}`,
      });
    };
    list('spike', this.spikes, `spike(s) beyond ${this.t.spikeFactor} × the local mean |Δx|`);
    list('flat-line', flats.flats, `flat line(s) of at least ${this.t.flatRunSamples} identical samples`);
    list('dropout', flats.dropouts, `dropout(s) of at least ${this.t.flatRunSamples} samples at exactly 0`);
    const clipNeed = Math.max(this.t.clipMinSamples, this.t.clipShare * n);
    if (this.max > this.min) {
      if (this.atMax >= clipNeed)
        out.push({
          kind: 'clipped-maximum',
          channel: ch,
          samples: this.atMax,
          ranges: [{ first: this.firstMax, last: this.lastMax }],
          rangesOmitted: 0,
          message: `${ch}: ${this.atMax} samples sit exactly at the maximum ${this.max}: clipped at full scale?`,
        });
      if (this.atMin >= clipNeed)
        out.push({
          kind: 'clipped-minimum',
          channel: ch,
          samples: this.atMin,
          ranges: [{ first: this.firstMin, last: this.lastMin }],
          rangesOmitted: 0,
          message: `${ch}: ${this.atMin} samples sit exactly at the minimum ${this.min}: clipped at full scale?`,
        });
    }
    const mean = (this.sum + this.comp) / n;
    const range = this.max - this.min;
    if (Math.abs(mean) > this.t.offsetShare * range)
      out.push({
        kind: 'large-offset',
        channel: ch,
        samples: n,
        ranges: [{ first: 0, last: n - 1 }],
        rangesOmitted: 0,
        message: `${ch}: mean ${mean} is more than ${this.t.offsetShare} × the range ${range}: an offset not zeroed?`,
      });
    return out;
  }
}

function cloneRuns(flats: RangeList, dropouts: RangeList): { flats: RangeList; dropouts: RangeList } {
  // finish() may be called more than once: the open run is added to copies
  const copy = (r: RangeList) => Object.assign(Object.create(Object.getPrototypeOf(r)) as RangeList, r, { bounds: (r as unknown as { bounds: Float64Array }).bounds.slice() });
  return { flats: copy(flats), dropouts: copy(dropouts) };
}
