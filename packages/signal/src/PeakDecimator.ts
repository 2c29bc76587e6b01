import { onlyKnownFields, positiveOption } from './checkOptions';
import type { DecimatePeaksOptions } from './decimatePeaks';
import { SignalError } from './SignalError';

/**
 * Streaming peak-preserving decimation ({@link decimatePeaks}, the same rule and the same kept
 * samples for any chunking): `push(chunk, values, indices, at)` writes the samples it can keep so
 * far into caller-owned arrays and returns how many; `finish(values, indices, at)` writes the
 * last pending extreme and the last sample (at most 2). Look-ahead: a reversal is written once
 * the signal has moved back from it by the gate, however many samples that takes. O(1) state,
 * nothing allocated per sample. A NaN or ±Infinity sample throws `non-finite-sample` naming its
 * sample index.
 *
 * @example
 * const d = new PeakDecimator({ gate: 1 });
 * const v = new Float64Array(10);
 * const i = new Float64Array(10);
 * let w = d.push([0, 1, 2, 3, 2], v, i, 0);
 * w += d.push([1, 1.5, 0, 4], v, i, w);
 * w += d.finish(v, i, w);
 * Array.from(v.subarray(0, w));
 * // returns [0, 3, 0, 4]
 */
export class PeakDecimator {
  /** The gate in effect. */
  readonly gate: number;
  private readonly threshold: number;
  private n = 0;
  private dir = 0;
  private ext = 0;
  private extIndex = 0;
  private hi = 0;
  private lo = 0;
  private hiIndex = 0;
  private loIndex = 0;
  private last = 0;
  private lastWritten = -1;
  private done = false;

  /** @param options `{ gate }` in the history's unit, default 0 */
  constructor(options: DecimatePeaksOptions = {}) {
    onlyKnownFields(options, ['gate'], 'options');
    this.gate = positiveOption(options.gate, 'gate', 0, true);
    // ext − v >= Number.MIN_VALUE holds exactly when v < ext, so one comparison serves both cases
    this.threshold = this.gate > 0 ? this.gate : Number.MIN_VALUE;
  }

  /** Samples pushed so far. */
  get length(): number {
    return this.n;
  }

  /** Pushes samples; writes the kept ones from position `at` (room for `chunk.length` + 1 needed); returns how many it wrote. */
  push(chunk: ArrayLike<number>, values: Float64Array, indices: Float64Array, at = 0): number {
    if (this.done) throw new SignalError('invalid-argument', 'push', this.n, 'the decimator has finished');
    const len = chunk.length;
    if (len === 0) return 0;
    let w = at;
    let j = 0;
    let n = this.n;
    if (n === 0) {
      const v = chunk[0];
      if (v - v !== 0) throw new SignalError('non-finite-sample', 'history', v, 'samples must be finite numbers', 0);
      this.hi = this.lo = this.ext = this.last = v;
      values[w] = v;
      indices[w++] = 0;
      this.lastWritten = 0;
      j = 1;
      n = 1;
    }
    const g = this.threshold;
    let { dir, ext, extIndex, hi, lo, hiIndex, loIndex } = this;
    let lastWritten = this.lastWritten;
    for (; j < len; j++, n++) {
      const v = chunk[j];
      if (v - v !== 0) throw new SignalError('non-finite-sample', 'history', v, 'samples must be finite numbers', n);
      if (dir > 0) {
        if (v > ext) {
          ext = v;
          extIndex = n;
        } else if (ext - v >= g) {
          values[w] = ext;
          indices[w++] = lastWritten = extIndex;
          dir = -1;
          ext = v;
          extIndex = n;
        }
      } else if (dir < 0) {
        if (v < ext) {
          ext = v;
          extIndex = n;
        } else if (v - ext >= g) {
          values[w] = ext;
          indices[w++] = lastWritten = extIndex;
          dir = 1;
          ext = v;
          extIndex = n;
        }
      } else if (v > hi) {
        if (v - lo >= g) {
          if (loIndex !== 0) {
            values[w] = lo;
            indices[w++] = lastWritten = loIndex;
          }
          dir = 1;
          ext = v;
          extIndex = n;
        }
        hi = v;
        hiIndex = n;
      } else if (v < lo) {
        if (hi - v >= g) {
          if (hiIndex !== 0) {
            values[w] = hi;
            indices[w++] = lastWritten = hiIndex;
          }
          dir = -1;
          ext = v;
          extIndex = n;
        }
        lo = v;
        loIndex = n;
      }
    }
    this.last = chunk[len - 1];
    Object.assign(this, { n, dir, ext, extIndex, hi, lo, hiIndex, loIndex, lastWritten });
    return w - at;
  }

  /** Ends the history: writes the pending extreme and the last sample (when not written yet) from `at`; returns how many (0 … 2). */
  finish(values: Float64Array, indices: Float64Array, at = 0): number {
    if (this.done) throw new SignalError('invalid-argument', 'finish', this.n, 'the decimator has finished');
    this.done = true;
    let w = at;
    if (this.dir !== 0 && this.extIndex > this.lastWritten) {
      values[w] = this.ext;
      indices[w++] = this.lastWritten = this.extIndex;
    }
    if (this.n > 1 && this.lastWritten !== this.n - 1) {
      values[w] = this.last;
      indices[w++] = this.n - 1;
    }
    return w - at;
  }
}
