import { onlyKnownFields, positiveOption } from './checkOptions';
import { FindingTable } from './FindingTable';
import { lowerMedian } from './lowerMedian';
import { SignalError } from './SignalError';

/** Options of {@link detectTimeGaps}. */
export interface TimeGapOptions {
  /** The nominal step (seconds). Default: the lower median of the steps. */
  step?: number;
  /** A step larger than `gapFactor` × the nominal step is a gap. Default 1.5 (`common practice, no source`). */
  gapFactor?: number;
}

/**
 * Gaps in a time column: each step t[i] − t[i−1] larger than `gapFactor` times the nominal
 * step is a `time-gap` finding at sample i (the first sample after the gap), with `length` the
 * samples missing, round(step / nominal) − 1 (at least 1), and `size` the step; `time` is t[i], where the
 * record resumes. A step that is zero or negative is not a gap (a time column that does
 * not increase is an error of the file, checked where it is read). Needs the whole column for
 * the median step; with `step` given the rule is local (look-ahead 0).
 *
 * @example
 * detectTimeGaps([0, 0.01, 0.02, 0.05, 0.06]).row(0);
 * // returns { code: 'time-gap', index: 3, length: 2, time: 0.05, size: 0.030000000000000002 }
 */
export function detectTimeGaps(time: ArrayLike<number>, options: TimeGapOptions = {}): FindingTable {
  onlyKnownFields(options, ['step', 'gapFactor'], 'options');
  const factor = positiveOption(options.gapFactor, 'gapFactor', 1.5);
  if (factor < 1) throw new SignalError('invalid-option', 'gapFactor', factor, 'must be a finite number >= 1');
  if (time === null || typeof time !== 'object' || typeof time.length !== 'number') throw new SignalError('invalid-argument', 'time', time, 'must be an array or typed array of numbers');
  const n = time.length;
  for (let i = 0; i < n; i++) if (time[i] - time[i] !== 0) throw new SignalError('non-finite-sample', 'time', time[i], 'time values must be finite numbers', i);
  const out = new FindingTable();
  if (n < 2) return out;
  let step = options.step;
  if (step === undefined) {
    const steps = new Float64Array(n - 1);
    for (let i = 1; i < n; i++) steps[i - 1] = time[i] - time[i - 1];
    step = lowerMedian(steps, n - 1);
    if (!(step > 0)) return out;
  } else step = positiveOption(step, 'step', 1);
  const limit = factor * step;
  for (let i = 1; i < n; i++) {
    const d = time[i] - time[i - 1];
    if (d > limit) {
      out.add('time-gap', i, Math.max(1, Math.round(d / step) - 1), d);
    }
  }
  return out.withTimes(time);
}
