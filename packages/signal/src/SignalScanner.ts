import { grownCapacity, NeumaierAdder, widenColumn } from '@loopwise/base';
import { integerOption, onlyKnownFields, positiveOption } from './checkOptions';
import { FindingTable } from './FindingTable';
import { lowerMedian } from './lowerMedian';
import { SignalError } from './SignalError';
import { timesOfSamples, type TimeBase } from './TimeBase';

/** Options of the spike check (see {@link SignalScanner}). */
export interface SpikeCheckOptions {
  /** The jump, out and back, must exceed `factor` × σ̂ (σ̂ = 1.4826 × median |Δx| of the previous block). Default 6 (`common practice, no source`). */
  factor?: number;
  /** …and this absolute jump, in the history's unit. Default 0. */
  minimumJump?: number;
  /** Samples per block of the robust scale. Default 4096; an integer >= 16. */
  blockLength?: number;
}

/** Options of the stuck-run check (frozen channel, or a dropout at zero). */
export interface StuckRunCheckOptions {
  /** At least this many identical consecutive samples. Default 100 (`common practice, no source`). */
  minimumSamples?: number;
}

/** Options of the clipping check. */
export interface ClippingCheckOptions {
  /** At least this many samples exactly at the largest (smallest) value. Default 5. */
  minimumSamples?: number;
  /** …and at least this share of all samples. Default 0.001 (`common practice, no source`). */
  minimumShare?: number;
  /**
   * Only runs of at least this many consecutive samples at the extreme count (default 3,
   * `common practice, no source`): a periodic signal written with rounded decimals meets its
   * extreme once or twice per cycle (two samples either side of a peak round alike), which is not
   * a clipped top; a clipped top is a plateau.
   */
  minimumRun?: number;
}

/** Options of the offset check. */
export interface OffsetCheckOptions {
  /** An offset when |mean| exceeds `share` × (max − min). Default 0.5 (`common practice, no source`). */
  share?: number;
}

/** Options of the drift check. */
export interface DriftCheckOptions {
  /** A drift when the linear trend over the record, |slope| × (n − 1), exceeds `share` × (max − min). Default 0.25 (`common practice, no source`). */
  share?: number;
}

/** Options of {@link SignalScanner} and {@link scanSignal}: each check on (its options, or `{}` for the defaults; the default) or off (`false`). */
export interface SignalScanOptions {
  spikes?: SpikeCheckOptions | false;
  stuckRuns?: StuckRunCheckOptions | false;
  clipping?: ClippingCheckOptions | false;
  offset?: OffsetCheckOptions | false;
  drift?: DriftCheckOptions | false;
  /** Gives every finding its time (seconds). Default none. */
  timeBase?: TimeBase;
}

/** What a scan found, and the statistics it used. */
export interface SignalScan {
  /** The findings in order of sample index. */
  readonly findings: FindingTable;
  /** Samples scanned. */
  readonly samples: number;
  /** Smallest and largest sample (NaN for no samples). */
  readonly minimum: number;
  readonly maximum: number;
  /** Mean (compensated sum; NaN for no samples, and when neither the offset nor the drift check runs: the sums are skipped then). */
  readonly mean: number;
  /** Least-squares slope per sample (0 for fewer than 2 samples, or when neither the offset nor the drift check runs). */
  readonly trendPerSample: number;
}

/** Robust standard deviation of a normal variable per unit of its median absolute value: 1 / Φ⁻¹(3/4). */
export const MAD_TO_SIGMA = 1.4826;
/** Every DIFFERENCE_STRIDE-th first difference enters the block's robust scale. */
export const DIFFERENCE_STRIDE = 16;

const SPIKE_KEYS = ['factor', 'minimumJump', 'blockLength'] as const;
const STUCK_KEYS = ['minimumSamples'] as const;
const CLIP_KEYS = ['minimumSamples', 'minimumShare', 'minimumRun'] as const;
const SHARE_KEYS = ['share'] as const;
const SCAN_KEYS = ['spikes', 'stuckRuns', 'clipping', 'offset', 'drift', 'timeBase'] as const;

function section<T extends object>(value: T | false | undefined, keys: readonly string[], field: string): T | null {
  if (value === false) return null;
  onlyKnownFields(value, keys, field);
  return (value ?? {}) as T;
}

/**
 * The scanner's hot loop: passes over chunk[j …) while the samples are ordinary (finite,
 * strictly between `min` and `max`, a step 0 < |Δx| < 2h from the one before) and returns the
 * index of the first sample that is not (or `end`), carrying the last two samples and their
 * step in `st` ([a, b, |b − a|]). One test per sample: |Δx − h| < h is false for a step of 0, of
 * 2h or more, and for NaN, and the three comparisons are combined as numbers (+(p < q) is 0 or 1
 * without a jump, where a ternary or && would be one), so the loop takes one well-predicted
 * branch per sample. A small function of its own: the loop holds only what its test needs, and
 * everything else about a sample happens in the caller, once per unusual sample.
 */
function ordinaryRun(chunk: ArrayLike<number>, j: number, end: number, st: Float64Array, h: number, max: number, min: number): number {
  let b = st[1];
  let ad1 = st[2];
  let a = st[0];
  for (; j < end; j++) {
    const c = chunk[j];
    const ad2 = Math.abs(c - b);
    if ((+(Math.abs(ad2 - h) < h) & +(c < max) & +(c > min)) === 0) break;
    a = b;
    b = c;
    ad1 = ad2;
  }
  st[0] = a;
  st[1] = b;
  st[2] = ad1;
  return j;
}

/**
 * Streaming checks of one measured channel in a single pass: spikes, stuck runs (and runs at
 * zero), clipping at full scale, offset and drift. Push the samples chunk by chunk (any
 * chunking gives the same findings as one push of the whole record), then `finish()`. Memory is
 * bounded by the block length and the findings; nothing is allocated per sample.
 *
 * Rules (defaults are `common practice, no source`, to be tuned per acquisition system):
 * - **Spike** (a rate-of-change rule with a robust scale): sample i with d1 = x[i] − x[i−1] and
 *   d2 = x[i+1] − x[i] of opposite signs, min(|d1|, |d2|) > T, and |x[i+1] − x[i−1]| ≤
 *   min(|d1|, |d2|)/2 (it comes back). T = max(factor · σ̂, minimumJump), σ̂ = 1.4826 · med|Δx|:
 *   the median absolute deviation (MAD) of the first differences about zero, scaled to a
 *   standard deviation for normal differences (Hampel's identifier: F. R. Hampel, "The influence
 *   curve and its role in robust estimation", J. Amer. Statist. Assoc. 69(346), 1974, 383–393,
 *   doi:10.1080/01621459.1974.10482962; the factor 1.4826 = 1/Φ⁻¹(3/4): P. J. Rousseeuw and
 *   C. Croux, "Alternatives to the median absolute deviation", J. Amer. Statist. Assoc. 88(424),
 *   1993, 1273–1283, doi:10.1080/01621459.1993.10476408; `value from memory`). The median is the
 *   lower median of every 16th difference of a block of `blockLength` differences (difference
 *   n = x[n] − x[n−1] belongs to the block ⌊n / blockLength⌋); a sample i is judged with the
 *   scale of the block before the one holding difference i+1, and samples of the first block with
 *   the first block's own scale. When the median is 0 (more than half the sampled differences are
 *   0: a stuck or quiet block), the block keeps the threshold before it (the first block uses
 *   the mean |Δx| of its sampled differences instead). Only one-sample spikes are found; the first and the
 *   last sample cannot be judged. **Look-ahead: 1 sample** (x[i+1]), except that the first block
 *   is judged once it is complete (or at `finish()`).
 * - **Stuck run**: at least `minimumSamples` identical consecutive samples; a `zero-run` when
 *   the value is 0, else a `stuck-run`. Look-ahead: none (a run is reported when it ends).
 * - **Clipping**: at least max(`minimumSamples`, `minimumShare` · n) samples exactly at the
 *   largest (smallest) value of a non-constant record, in runs of at least `minimumRun` (3)
 *   consecutive samples (plateaus); each such run is a finding. Needs the
 *   whole record (the extreme is known at the end); memory holds the runs at the running extreme.
 * - **Offset**: |mean| > `share` · (max − min), one finding over the record.
 * - **Drift**: the least-squares line through (i, x[i]) rises or falls by more than `share` ·
 *   (max − min) over the record, one finding over the record.
 *
 * A NaN or ±Infinity sample throws `non-finite-sample` naming its sample index; the scanner is
 * unusable after an error or after `finish()`.
 *
 * @example
 * const scanner = new SignalScanner();
 * const x = new Float64Array(400).map((_, i) => Math.sin(i / 5));
 * x[100] = 50; // invented: one bad sample
 * scanner.push(x.subarray(0, 150));
 * scanner.push(x.subarray(150));
 * scanner.finish().findings.row(0).index;
 * // returns 100
 */
export class SignalScanner {
  // options
  private readonly factor: number;
  private readonly minimumJump: number;
  private readonly block: number;
  private readonly spikesOn: boolean;
  private readonly stuckMin: number;
  private readonly clipping: ClippingCheckOptions | null;
  private readonly offsetShare: number;
  private readonly driftShare: number;
  private readonly timeBase: TimeBase | undefined;
  private readonly sums: boolean;
  // state
  private n = 0;
  private a = NaN;
  private b = NaN;
  private threshold = NaN;
  private nextBoundary: number;
  private readonly scale: Float64Array;
  /** a, b, |b − a| of the hot loop, while ordinaryRun() has them. */
  private readonly loop = new Float64Array(3);
  private readonly scaleScratch: Float64Array;
  private readonly scaleSpare: Float64Array;
  private scaleCount = 0;
  private readonly head: Float64Array;
  private runStart = 0;
  private runLength = 0;
  private ad1 = NaN;
  private max = -Infinity;
  private min = Infinity;
  private atMax = 0;
  private atMin = 0;
  private lastMax = -2;
  private lastMin = -2;
  private maxRuns: Float64Array = new Float64Array(32);
  private maxRunCount = 0;
  private minRuns: Float64Array = new Float64Array(32);
  private minRunCount = 0;
  private blockSum = 0;
  private blockWeighted = 0;
  private readonly sum = new NeumaierAdder();
  private readonly weighted = new NeumaierAdder();
  private readonly findings = new FindingTable();
  private done = false;

  /** @param options the checks and their parameters ({@link SignalScanOptions}); unknown fields throw `unknown-option`. */
  constructor(options: SignalScanOptions = {}) {
    onlyKnownFields(options, SCAN_KEYS, 'options');
    const spikes = section(options.spikes, SPIKE_KEYS, 'spikes');
    this.spikesOn = spikes !== null;
    this.factor = positiveOption(spikes?.factor, 'spikes.factor', 6);
    this.minimumJump = positiveOption(spikes?.minimumJump, 'spikes.minimumJump', 0, true);
    this.block = integerOption(spikes?.blockLength, 'spikes.blockLength', 4096, 16);
    const stuck = section(options.stuckRuns, STUCK_KEYS, 'stuckRuns');
    this.stuckMin = stuck === null ? Infinity : integerOption(stuck.minimumSamples, 'stuckRuns.minimumSamples', 100, 2);
    const clip = section(options.clipping, CLIP_KEYS, 'clipping');
    this.clipping =
      clip === null
        ? null
        : {
            minimumSamples: integerOption(clip.minimumSamples, 'clipping.minimumSamples', 5, 1),
            minimumShare: positiveOption(clip.minimumShare, 'clipping.minimumShare', 0.001, true),
            minimumRun: integerOption(clip.minimumRun, 'clipping.minimumRun', 3, 1),
          };
    if (this.clipping !== null && this.clipping.minimumShare! > 1) throw new SignalError('invalid-option', 'clipping.minimumShare', clip!.minimumShare, 'must be a share in [0, 1]');
    const offset = section(options.offset, SHARE_KEYS, 'offset');
    this.offsetShare = offset === null ? Infinity : positiveOption(offset.share, 'offset.share', 0.5, true);
    const drift = section(options.drift, SHARE_KEYS, 'drift');
    this.driftShare = drift === null ? Infinity : positiveOption(drift.share, 'drift.share', 0.25, true);
    if (options.timeBase !== undefined) {
      if (options.timeBase === null || typeof options.timeBase !== 'object') throw new SignalError('invalid-option', 'timeBase', options.timeBase, 'must be { sampleRate, startTime? } or a time column');
      timesOfSamples(new Float64Array(0), options.timeBase); // checks sampleRate and startTime now, not at finish()
    }
    this.timeBase = options.timeBase;
    this.sums = this.offsetShare !== Infinity || this.driftShare !== Infinity;
    this.nextBoundary = this.block;
    this.scale = new Float64Array(Math.ceil(this.block / DIFFERENCE_STRIDE) + 1);
    this.scaleScratch = new Float64Array(this.scale.length);
    this.scaleSpare = new Float64Array(this.scale.length);
    this.head = new Float64Array(this.block);
  }

  /** Samples pushed so far. */
  get length(): number {
    return this.n;
  }

  /** Adds the next samples (any array-like of finite numbers; nothing of it is kept). */
  push(chunk: ArrayLike<number>): void {
    if (this.done) throw new SignalError('invalid-argument', 'push', this.n, 'the scanner has finished');
    const len = chunk.length;
    let j = 0;
    if (len === 0) return;
    if (this.n === 0) {
      const c = chunk[0];
      if (c - c !== 0) throw new SignalError('non-finite-sample', 'history', c, 'samples must be finite numbers', 0);
      this.a = this.b = this.max = this.min = c;
      this.ad1 = NaN;
      this.runStart = 0;
      this.atMax = this.atMin = 1;
      this.lastMax = this.lastMin = 0;
      this.maxRuns[0] = this.minRuns[0] = 0;
      this.maxRuns[1] = this.minRuns[1] = 1;
      this.maxRunCount = this.minRunCount = 1;
      this.head[0] = c;
      this.blockSum = c;
      this.n = 1;
      j = 1;
    }
    const stuckMin = this.stuckMin;
    const scale = this.scale;
    const findings = this.findings;
    const st = this.loop;
    while (j < len) {
      if (this.n === this.nextBoundary) this.blockStep();
      let { n, runStart, runLength, max, min, scaleCount } = this;
      const T = this.spikesOn ? this.threshold : Infinity;
      const from = j;
      const end = Math.min(len, j + (this.nextBoundary - n));
      const segmentStart = n;
      const before = this.b;
      st[0] = this.a;
      st[1] = this.b;
      st[2] = this.ad1;
      // Nearly every sample is ordinary: finite, strictly inside the running extremes, and a
      // step 0 < |Δx| < T from the sample before. ordinaryRun() passes over those (one test per
      // sample, see there) and stops at the first other one, which is sorted out here: a
      // non-finite sample, a new or repeated extreme, a run of equal samples, a spike candidate.
      // Inside a run of equal samples the half-threshold is 0, so that every sample of the run,
      // and the one that ends it, stops the run. The sample index is n0 + j.
      const n0 = n - j;
      // finite half of the pre-test threshold (a NaN threshold, in the first block, or spikes off: no spike candidates in the loop)
      const half = T === T && T < Number.MAX_VALUE ? T / 2 : Number.MAX_VALUE / 2;
      let h = runLength === 0 ? half : 0;
      for (;;) {
        j = ordinaryRun(chunk, j, end, st, h, max, min);
        if (j === end) break;
        const c = chunk[j];
        const a = st[0];
        const b = st[1];
        const ad1 = st[2];
        const ad2 = Math.abs(c - b);
        const i = n0 + j;
        if (c - c !== 0) throw new SignalError('non-finite-sample', 'history', c, 'samples must be finite numbers', i);
        // a run of equal samples: only its end reports
        if (c === b) {
          if (runLength++ === 0) {
            runStart = i - 1;
            h = 0;
          }
        } else if (runLength !== 0) {
          if (runLength + 1 >= stuckMin) findings.add(b === 0 ? 'zero-run' : 'stuck-run', runStart, runLength + 1, b);
          runLength = 0;
          h = half;
        }
        if (ad1 > T && ad2 > T && (b - a) * (c - b) < 0 && Math.abs(c - a) <= (ad1 < ad2 ? ad1 : ad2) / 2) findings.add('spike', i - 1, 1, b - (a + c) / 2);
        if (c >= max) max = this.atMaximum(c, i, max);
        if (c <= min) min = this.atMinimum(c, i, min);
        st[0] = b;
        st[1] = c;
        st[2] = ad2;
        j++;
      }
      // partial sums of the block (flushed at its end, so the rounding never depends on
      // chunking), in sample order: a loop of their own keeps their chain of dependent additions
      // out of the one above
      if (this.sums) {
        let s = this.blockSum;
        let w = this.blockWeighted;
        const li0 = n - (this.nextBoundary - this.block) - from;
        for (let k = from; k < end; k++) {
          const c = chunk[k];
          s += c;
          w += (li0 + k) * c;
        }
        this.blockSum = s;
        this.blockWeighted = w;
      }
      n = n0 + j;
      // every DIFFERENCE_STRIDE-th difference enters the block's scale: a strided loop of its
      // own (a test and a store in the loop above cost more than this second read)
      if (this.spikesOn) {
        let m = segmentStart + ((DIFFERENCE_STRIDE - (segmentStart % DIFFERENCE_STRIDE)) % DIFFERENCE_STRIDE);
        if (m === 0) m = DIFFERENCE_STRIDE;
        for (; m < n; m += DIFFERENCE_STRIDE) {
          const k = from + (m - segmentStart);
          scale[scaleCount++] = Math.abs(chunk[k] - (m > segmentStart ? chunk[k - 1] : before));
        }
      }
      if (segmentStart < this.block) {
        const stop = Math.min(n, this.block);
        for (let i = segmentStart, k = from; i < stop; i++, k++) this.head[i] = chunk[k];
      }
      this.a = st[0];
      this.b = st[1];
      this.ad1 = st[2];
      Object.assign(this, { n, runStart, runLength, max, min, scaleCount });
    }
  }

  /** Ends the record and returns what was found. */
  finish(): SignalScan {
    if (this.done) throw new SignalError('invalid-argument', 'finish', this.n, 'the scanner has finished');
    this.done = true;
    const n = this.n;
    const findings = this.findings;
    if (n === 0) return { findings, samples: 0, minimum: NaN, maximum: NaN, mean: NaN, trendPerSample: 0 };
    this.flushSums();
    if (n <= this.block && this.spikesOn) {
      this.threshold = this.blockThreshold();
      this.judgeHead(n);
    }
    if (this.runLength !== 0 && this.runLength + 1 >= this.stuckMin) findings.add(this.b === 0 ? 'zero-run' : 'stuck-run', this.runStart, this.runLength + 1, this.b);
    const range = this.max - this.min;
    if (this.clipping !== null && range > 0) {
      const need = Math.max(this.clipping.minimumSamples!, this.clipping.minimumShare! * n);
      // only plateaus count: runs of at least minimumRun samples at the extreme
      const run = this.clipping.minimumRun!;
      const plateau = (runs: Float64Array, count: number) => {
        let at = 0;
        for (let k = 0; k < count; k++) if (runs[2 * k + 1] >= run) at += runs[2 * k + 1];
        return at;
      };
      if (plateau(this.maxRuns, this.maxRunCount) >= need) for (let k = 0; k < this.maxRunCount; k++) if (this.maxRuns[2 * k + 1] >= run) findings.add('clipped-maximum', this.maxRuns[2 * k], this.maxRuns[2 * k + 1], this.max);
      if (plateau(this.minRuns, this.minRunCount) >= need) for (let k = 0; k < this.minRunCount; k++) if (this.minRuns[2 * k + 1] >= run) findings.add('clipped-minimum', this.minRuns[2 * k], this.minRuns[2 * k + 1], this.min);
    }
    const mean = this.sums ? this.sum.valueOf() / n : NaN;
    if (Math.abs(mean) > this.offsetShare * range) findings.add('offset', 0, n, mean);
    let slope = 0;
    if (n >= 2 && this.sums) {
      // least squares through (i, x_i): slope = (Σ i·x − ī Σx) / Σ (i − ī)², Σ (i − ī)² = n(n² − 1)/12
      const meanIndex = (n - 1) / 2;
      slope = (this.weighted.valueOf() - meanIndex * this.sum.valueOf()) / ((n * (n * n - 1)) / 12);
      const trend = slope * (n - 1);
      if (n >= 3 && Math.abs(trend) > this.driftShare * range) findings.add('drift', 0, n, trend);
    }
    if (this.timeBase !== undefined) findings.withTimes(this.timeBase);
    return { findings, samples: n, minimum: this.min, maximum: this.max, mean, trendPerSample: slope };
  }

  /** At the first sample of a new block: the threshold from the block that ended. */
  private blockStep(): void {
    this.flushSums();
    const t = this.blockThreshold();
    const first = this.nextBoundary === this.block;
    this.threshold = t;
    this.scaleCount = 0;
    this.nextBoundary += this.block;
    if (first && this.spikesOn) this.judgeHead(this.block);
  }

  /** Adds the block's partial sums (local index from the block start) to the record's. */
  private flushSums(): void {
    if (!this.sums) return;
    const start = this.nextBoundary - this.block;
    this.sum.add(this.blockSum);
    this.weighted.add(this.blockWeighted + start * this.blockSum);
    this.blockSum = 0;
    this.blockWeighted = 0;
  }

  private blockThreshold(): number {
    const k = this.scaleCount;
    if (k === 0) return this.threshold;
    let m = lowerMedian(this.scale, k, this.scaleScratch, this.scaleSpare);
    // a mostly frozen block (a dropout) says nothing of the scale: keep the threshold before it
    if (m === 0 && this.threshold === this.threshold) return this.threshold;
    if (m === 0) {
      let s = 0;
      for (let i = 0; i < k; i++) s += this.scale[i];
      m = s / k;
    }
    const t = this.factor * MAD_TO_SIGMA * m;
    return t > this.minimumJump ? t : this.minimumJump;
  }

  /** The spike rule over the first block, once its scale is known (samples 1 … count − 2). */
  private judgeHead(count: number): void {
    const h = this.head;
    const T = this.threshold;
    for (let i = 1; i + 1 < count; i++) {
      const a = h[i - 1];
      const b = h[i];
      const c = h[i + 1];
      const ad1 = Math.abs(b - a);
      const ad2 = Math.abs(c - b);
      if (ad1 > T && ad2 > T && (b - a) * (c - b) < 0 && Math.abs(c - a) <= (ad1 < ad2 ? ad1 : ad2) / 2) this.findings.add('spike', i, 1, b - (a + c) / 2);
    }
  }

  private atMaximum(c: number, n: number, max: number): number {
    if (c > max) {
      this.atMax = 0;
      this.maxRunCount = 0;
    }
    this.atMax++;
    if (this.lastMax === n - 1 && this.maxRunCount > 0) this.maxRuns[2 * this.maxRunCount - 1]++;
    else {
      if (2 * this.maxRunCount + 2 > this.maxRuns.length) this.maxRuns = widenColumn(this.maxRuns, 2 * this.maxRunCount, grownCapacity(this.maxRuns.length, 2 * this.maxRunCount + 2));
      this.maxRuns[2 * this.maxRunCount] = n;
      this.maxRuns[2 * this.maxRunCount + 1] = 1;
      this.maxRunCount++;
    }
    this.lastMax = n;
    return c;
  }

  private atMinimum(c: number, n: number, min: number): number {
    if (c < min) {
      this.atMin = 0;
      this.minRunCount = 0;
    }
    this.atMin++;
    if (this.lastMin === n - 1 && this.minRunCount > 0) this.minRuns[2 * this.minRunCount - 1]++;
    else {
      if (2 * this.minRunCount + 2 > this.minRuns.length) this.minRuns = widenColumn(this.minRuns, 2 * this.minRunCount, grownCapacity(this.minRuns.length, 2 * this.minRunCount + 2));
      this.minRuns[2 * this.minRunCount] = n;
      this.minRuns[2 * this.minRunCount + 1] = 1;
      this.minRunCount++;
    }
    this.lastMin = n;
    return c;
  }
}
