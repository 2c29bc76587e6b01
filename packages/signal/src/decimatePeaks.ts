import { correctionRecord, type CorrectionRecord } from './CorrectionRecord';
import { PeakDecimator } from './PeakDecimator';
import { SignalError } from './SignalError';

/** Options of {@link decimatePeaks}. */
export interface DecimatePeaksOptions {
  /** Gate (hysteresis range) in the history's unit: reversals smaller than this go. Default 0 (keep every turning point). */
  gate?: number;
}

/** The result of {@link decimatePeaks}. */
export interface Decimation {
  /** The samples kept. */
  readonly values: Float64Array;
  /** Their sample indices in the input (increasing). */
  readonly indices: Float64Array;
  readonly correction: CorrectionRecord;
}

/**
 * Peak-preserving decimation: keeps the first sample, every reversal that the gate keeps, and
 * the last sample; drops everything between. A reversal is kept once the signal has moved back
 * from the running extreme by at least the gate (by any amount for gate 0); plateaus collapse
 * to their first sample; before the first reversal, whichever of the running maximum and
 * minimum the signal first moves back from by the gate is kept. This is the gate rule of the
 * design (DESIGN.md "Gate") and of rainflow's `ReversalFilter` without leading extremes, so
 * rainflow counting of the kept samples with the same gate gives the same cycles (ranges,
 * means, and, through `indices`, the same sample indices) as counting the whole history — a
 * property test checks it against `@loopwise/rainflow`. {@link PeakDecimator} streams it.
 *
 * Effect on a fatigue result: none above the gate (the cycles are the same); the time course
 * between reversals is lost (filters, plots and time-based checks need the full history), and
 * cycles below the gate are gone, as with the gate itself.
 *
 * @example
 * const d = decimatePeaks([0, 1, 2, 3, 2, 1, 1.5, 0, 4], { gate: 1 });
 * d.values;
 * // returns Float64Array [0, 3, 0, 4]
 * d.indices;
 * // returns Float64Array [0, 3, 7, 8]
 */
export function decimatePeaks(history: ArrayLike<number>, options: DecimatePeaksOptions = {}): Decimation {
  const decimator = new PeakDecimator(options);
  if (history === null || typeof history !== 'object' || typeof history.length !== 'number') throw new SignalError('invalid-argument', 'history', history, 'must be an array or typed array of numbers');
  const n = history.length;
  const values = new Float64Array(n + 2);
  const indices = new Float64Array(n + 2);
  let w = decimator.push(history, values, indices, 0);
  w += decimator.finish(values, indices, w);
  const gate = decimator.gate;
  const correction = correctionRecord(
    'decimated',
    [0, n],
    n === 0 ? 0 : 1,
    n - w,
    { gate, method: 'turning points above the gate' },
    `decimated to the turning points above the gate ${gate}: ${w} of ${n} samples kept`,
  );
  return { values: values.slice(0, w), indices: indices.slice(0, w), correction };
}
