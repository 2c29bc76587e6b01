import { decodeNumber, encodeNumber, type EncodedNumber } from '@loopwise/base';
import { CounterStateError, InvalidOptionError, NonFiniteSampleError } from './errors';

/** Options of {@link ReversalFilter}. */
export interface ReversalFilterOptions {
  /**
   * Gate range, in the history's unit: a reversal is kept only once the signal has moved back from
   * the running extreme by at least this much. Default 0: every change of direction is a
   * reversal and only plateaus collapse.
   */
  gate?: number;
  /** Sample index of the first sample pushed. Default 0. */
  startIndex?: number;
  /**
   * Also keep the extremes the gate would drop before the first reversal: the running maximum or
   * minimum that precedes the first reversal in time (and, for a history that never leaves one
   * gate range of its first sample, both). Without them the first excursion can end short of its
   * true extreme by up to the gate when something came before the first sample (a non-zero
   * initial state, an earlier event of a duty cycle); with them the points stay exact whatever
   * came before. The extra points are real samples, in time order. Default false.
   */
  keepLeadingExtremes?: boolean;
}

/** Serialisable state of a {@link ReversalFilter}; see {@link ReversalFilter.toJSON}. */
export interface ReversalFilterState {
  gate: EncodedNumber;
  next: number;
  started: boolean;
  firstValue: EncodedNumber;
  firstIndex: number;
  dir: number;
  ext: EncodedNumber;
  extIndex: number;
  hi: EncodedNumber;
  hiIndex: number;
  lo: EncodedNumber;
  loIndex: number;
  emitted: number;
  rawLast: EncodedNumber;
  rawFirstDir: number;
  rawLastDir: number;
  rawChanges: number;
  /** Absent in states written before the option existed (false). */
  keepLeadingExtremes?: boolean;
}

/**
 * Streaming turning-point extraction with an optional gate (hysteresis filter), in O(1) state.
 *
 * Method: the first sample is always a turning point. A later extreme becomes a turning point
 * (a reversal) once the signal has moved back from it by at least the gate range (by any amount
 * when the gate is 0). Plateaus collapse to their first sample. The extreme of the last
 * excursion is pending until the history ends; {@link pendingInto} writes it without changing
 * the state, so a counter can end a history and still resume or repeat it.
 *
 * Before the first reversal the filter keeps the running maximum and minimum since the first
 * sample; whichever of the two the signal first moves back from by the gate becomes the first
 * reversal, and the other is dropped (it lies within one gate range of the first sample).
 *
 * Every sample is checked: NaN or ±Infinity throws {@link NonFiniteSampleError} with its index.
 * References: ASTM E1049-85 (reapproved 2017), section 3.1 (peaks, valleys, reversals); the
 * gate is the usual "racetrack"-free hysteresis filter applied before counting.
 *
 * @example
 * const f = new ReversalFilter({ gate: 1 });
 * const v = new Float64Array(8), i = new Float64Array(8);
 * let n = f.push([0, 3, 2.5, 3.5, -1, 0], v, i, 0);   // 0 and 3.5 confirmed
 * n += f.pendingInto(v, i, n);                          // -1 pending
 * // v.subarray(0, n) is [0, 3.5, -1], i.subarray(0, n) is [0, 3, 4]
 */
export class ReversalFilter {
  /** Gate range in effect (0 when none). */
  readonly gate: number;
  private readonly threshold: number;
  private next: number;
  private started = false;
  private firstValue = 0;
  private firstIndex = 0;
  private dir = 0;
  private ext = 0;
  private extIndex = 0;
  private hi = 0;
  private hiIndex = 0;
  private lo = 0;
  private loIndex = 0;
  private emitted = 0;
  private rawLast = 0;
  private rawFirstDir = 0;
  private rawLastDir = 0;
  private rawChanges = 0;
  private readonly keepLeading: boolean = false;

  constructor(options: ReversalFilterOptions = {}) {
    const gate = options.gate ?? 0;
    if (typeof gate !== 'number' || !(gate >= 0) || gate === Infinity) {
      throw new InvalidOptionError('gate', gate, 'must be a finite number >= 0');
    }
    const startIndex = options.startIndex ?? 0;
    if (!Number.isSafeInteger(startIndex) || startIndex < 0) {
      throw new InvalidOptionError('startIndex', startIndex, 'must be a safe integer >= 0');
    }
    this.gate = gate;
    this.keepLeading = options.keepLeadingExtremes === true;
    // ext - x >= Number.MIN_VALUE holds exactly when x < ext (IEEE 754 subtraction of distinct
    // doubles never rounds to zero), so one comparison serves the gate and the plain case.
    this.threshold = gate > 0 ? gate : Number.MIN_VALUE;
    this.next = startIndex;
  }

  /** Index that the next pushed sample will get. */
  get nextIndex(): number {
    return this.next;
  }

  /** Number of turning points confirmed so far (pending one excluded). */
  get confirmedCount(): number {
    return this.emitted;
  }

  /** True once a sample has been pushed. */
  get hasSamples(): boolean {
    return this.started;
  }

  /**
   * Number of reversals the gate has removed so far: the turning points of the raw history
   * (first, last and every change of direction) minus those kept, counting the pending extreme
   * on both sides. 0 when the gate is 0.
   */
  get removedCount(): number {
    if (!this.started) return 0;
    const raw = 1 + this.rawChanges + (this.rawLastDir !== 0 ? 1 : 0);
    const leading = this.keepLeading ? (this.hiIndex !== this.firstIndex ? 1 : 0) + (this.loIndex !== this.firstIndex ? 1 : 0) : 0;
    const kept = this.emitted + (this.dir !== 0 ? 1 : leading);
    return this.gate > 0 ? raw - kept : 0;
  }

  /**
   * Pushes samples; writes each newly confirmed turning point (value and sample index) into
   * `outValues` / `outIndices` from position `at`, and returns how many it wrote. The output
   * needs room for `chunk.length` points (one more with `keepLeadingExtremes`, which can write two
   * at the first reversal). Allocates nothing.
   */
  push(chunk: ArrayLike<number>, outValues: Float64Array, outIndices: Float64Array, at = 0): number {
    return this.pushRange(chunk, 0, chunk.length, outValues, outIndices, at);
  }

  /** Like {@link push}, for the samples `chunk[from]` … `chunk[to - 1]`; output room `to - from` (+ 1 with `keepLeadingExtremes`). */
  pushRange(
    chunk: ArrayLike<number>,
    from: number,
    to: number,
    outValues: Float64Array,
    outIndices: Float64Array,
    at = 0,
  ): number {
    const n = to;
    if (n <= from) return 0;
    let w = at;
    let i0 = from;
    let idx = this.next;
    if (!this.started) {
      const x = chunk[from];
      if (x - x !== 0) throw new NonFiniteSampleError(idx, x);
      this.started = true;
      this.firstValue = x;
      this.firstIndex = idx;
      this.hi = x;
      this.lo = x;
      this.hiIndex = idx;
      this.loIndex = idx;
      this.rawLast = x;
      outValues[w] = x;
      outIndices[w] = idx;
      w++;
      i0 = from + 1;
      idx++;
    }
    const g = this.threshold;
    const counting = this.gate > 0;
    let dir = this.dir;
    let ext = this.ext;
    let extIndex = this.extIndex;
    let rawLast = this.rawLast;
    let rawLastDir = this.rawLastDir;
    let rawChanges = this.rawChanges;
    for (let i = i0; i < n; i++, idx++) {
      const x = chunk[i];
      // A filter that has thrown is not to be used further: its state is mid-chunk.
      if (x - x !== 0) throw new NonFiniteSampleError(idx, x);
      if (counting && x !== rawLast) {
        const d = x > rawLast ? 1 : -1;
        if (d !== rawLastDir) {
          if (rawLastDir !== 0) rawChanges++;
          else this.rawFirstDir = d;
          rawLastDir = d;
        }
        rawLast = x;
      }
      if (dir > 0) {
        if (x > ext) {
          ext = x;
          extIndex = idx;
        } else if (ext - x >= g) {
          outValues[w] = ext;
          outIndices[w] = extIndex;
          w++;
          dir = -1;
          ext = x;
          extIndex = idx;
        }
      } else if (dir < 0) {
        if (x < ext) {
          ext = x;
          extIndex = idx;
        } else if (x - ext >= g) {
          outValues[w] = ext;
          outIndices[w] = extIndex;
          w++;
          dir = 1;
          ext = x;
          extIndex = idx;
        }
      } else if (x > this.hi) {
        if (x - this.lo >= g) {
          // the minimum is the first reversal; the maximum before it is dropped unless kept
          if (this.keepLeading && this.hiIndex !== this.firstIndex && this.hiIndex < this.loIndex) {
            outValues[w] = this.hi;
            outIndices[w] = this.hiIndex;
            w++;
          }
          if (this.loIndex !== this.firstIndex) {
            outValues[w] = this.lo;
            outIndices[w] = this.loIndex;
            w++;
          }
          dir = 1;
          ext = x;
          extIndex = idx;
        }
        this.hi = x;
        this.hiIndex = idx;
      } else if (x < this.lo) {
        if (this.hi - x >= g) {
          if (this.keepLeading && this.loIndex !== this.firstIndex && this.loIndex < this.hiIndex) {
            outValues[w] = this.lo;
            outIndices[w] = this.loIndex;
            w++;
          }
          if (this.hiIndex !== this.firstIndex) {
            outValues[w] = this.hi;
            outIndices[w] = this.hiIndex;
            w++;
          }
          dir = -1;
          ext = x;
          extIndex = idx;
        }
        this.lo = x;
        this.loIndex = idx;
      }
    }
    this.next = idx;
    this.dir = dir;
    this.ext = ext;
    this.extIndex = extIndex;
    this.rawLast = rawLast;
    this.rawLastDir = rawLastDir;
    this.rawChanges = rawChanges;
    this.emitted += w - at;
    return w - at;
  }

  /**
   * Writes the pending extreme of the last excursion (if any) at position `at` and returns 1, or
   * returns 0 when there is none (no samples, or a history that never left one gate range of its
   * first sample). With `keepLeadingExtremes`, a history that never left one gate range writes
   * its running maximum and minimum instead (those that are not the first sample, in time
   * order): 0, 1 or 2 points, so the output needs room for 2. Does not change the state.
   */
  pendingInto(outValues: Float64Array, outIndices: Float64Array, at = 0): number {
    if (this.dir === 0) return this.keepLeading ? this.pendingSamplesInto(outValues, outIndices, at) : 0;
    outValues[at] = this.ext;
    outIndices[at] = this.extIndex;
    return 1;
  }

  /**
   * The samples that stand for what is still unconfirmed, in time order: the pending extreme, or
   * before the first reversal the running maximum and minimum. Pushing them into another filter
   * continues that filter exactly as the raw samples would (used to merge segments).
   */
  pendingSamplesInto(outValues: Float64Array, outIndices: Float64Array, at = 0): number {
    if (!this.started) return 0;
    if (this.dir !== 0) return this.pendingInto(outValues, outIndices, at);
    let w = at;
    const hiFirst = this.hiIndex <= this.loIndex;
    const a = hiFirst ? this.hi : this.lo;
    const ai = hiFirst ? this.hiIndex : this.loIndex;
    const b = hiFirst ? this.lo : this.hi;
    const bi = hiFirst ? this.loIndex : this.hiIndex;
    if (ai !== this.firstIndex) {
      outValues[w] = a;
      outIndices[w++] = ai;
    }
    if (bi !== this.firstIndex) {
      outValues[w] = b;
      outIndices[w++] = bi;
    }
    return w - at;
  }

  /**
   * Pushes turning points (value, index pairs) that carry their own sample indices, as when a
   * residue is fed again; `nextIndex` is left as it was. Writes confirmed points like `push`.
   */
  pushIndexed(
    values: Float64Array,
    indices: Float64Array,
    from: number,
    to: number,
    outValues: Float64Array,
    outIndices: Float64Array,
    at = 0,
  ): number {
    // These are not new raw samples: keep the next index and the raw-direction bookkeeping.
    const keep = this.next;
    const raw = [this.rawLast, this.rawFirstDir, this.rawLastDir, this.rawChanges] as const;
    let w = at;
    for (let k = from; k < to; k++) {
      this.next = indices[k];
      w += this.pushRange(values, k, k + 1, outValues, outIndices, w);
    }
    this.next = keep;
    [this.rawLast, this.rawFirstDir, this.rawLastDir, this.rawChanges] = raw;
    return w - at;
  }

  /**
   * Ends this filter where `later` ends, after the caller has pushed `later`'s summary samples
   * (see {@link pendingSamplesInto}): takes its next index, its raw-direction bookkeeping and the
   * turning points it confirmed that the summary no longer holds (`confirmedElsewhere`).
   */
  adoptEnd(later: ReversalFilter, confirmedElsewhere: number): void {
    if (this.gate > 0) this.absorbRawCounts(later); // without a gate the raw count is not kept
    this.next = later.next;
    this.emitted += confirmedElsewhere;
  }

  private absorbRawCounts(later: ReversalFilter): void {
    if (!later.started) return;
    if (!this.started) throw new CounterStateError('filter', 'empty', 'cannot absorb into a filter that has no samples');
    const dj = later.firstValue > this.rawLast ? 1 : later.firstValue < this.rawLast ? -1 : 0;
    let last = this.rawLastDir;
    let changes = this.rawChanges + later.rawChanges;
    for (const d of [dj, later.rawFirstDir]) {
      if (d === 0) continue;
      if (last !== 0 && d !== last) changes++;
      if (last === 0 && this.rawFirstDir === 0) this.rawFirstDir = d;
      last = d;
    }
    this.rawChanges = changes;
    this.rawLastDir = later.rawLastDir !== 0 ? later.rawLastDir : last;
    this.rawLast = later.rawLast;
  }

  /** The state as plain JSON-safe data; -0 and non-finite numbers are encoded exactly. */
  toJSON(): ReversalFilterState {
    return {
      gate: encodeNumber(this.gate),
      next: this.next,
      started: this.started,
      firstValue: encodeNumber(this.firstValue),
      firstIndex: this.firstIndex,
      dir: this.dir,
      ext: encodeNumber(this.ext),
      extIndex: this.extIndex,
      hi: encodeNumber(this.hi),
      hiIndex: this.hiIndex,
      lo: encodeNumber(this.lo),
      loIndex: this.loIndex,
      emitted: this.emitted,
      rawLast: encodeNumber(this.rawLast),
      rawFirstDir: this.rawFirstDir,
      rawLastDir: this.rawLastDir,
      rawChanges: this.rawChanges,
      keepLeadingExtremes: this.keepLeading,
    };
  }

  /** Rebuilds a filter from {@link toJSON} output. */
  static fromJSON(state: ReversalFilterState): ReversalFilter {
    if (state === null || typeof state !== 'object') {
      throw new CounterStateError('filter', state, 'filter state must be an object');
    }
    const f = new ReversalFilter({ gate: decodeNumber(state.gate, 'filter.gate'), keepLeadingExtremes: state.keepLeadingExtremes === true });
    f.next = state.next;
    f.started = state.started === true;
    f.firstValue = decodeNumber(state.firstValue, 'filter.firstValue');
    f.firstIndex = state.firstIndex;
    f.dir = state.dir;
    f.ext = decodeNumber(state.ext, 'filter.ext');
    f.extIndex = state.extIndex;
    f.hi = decodeNumber(state.hi, 'filter.hi');
    f.hiIndex = state.hiIndex;
    f.lo = decodeNumber(state.lo, 'filter.lo');
    f.loIndex = state.loIndex;
    f.emitted = state.emitted;
    f.rawLast = decodeNumber(state.rawLast, 'filter.rawLast');
    f.rawFirstDir = state.rawFirstDir;
    f.rawLastDir = state.rawLastDir;
    f.rawChanges = state.rawChanges;
    return f;
  }
}
