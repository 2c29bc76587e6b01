import { onlyKnownFields } from './checkOptions';
import type { ButterworthDesign } from './butterworthSections';
import type { CorrectionRecord } from './CorrectionRecord';
import { spikeIndices, spikeRecord, spikeRuns } from './removeSpikes';
import { scanSignal } from './scanSignal';
import { SignalError } from './SignalError';
import type { SignalScan, SignalScanOptions } from './SignalScanner';
import { checkLowPassOptions, lowPassOfCleanedInto, type ZeroPhaseLowPassOptions } from './zeroPhaseLowPass';

/** Options of {@link conditionSignal} and {@link conditionSignalInto}. */
export interface ConditionSignalOptions {
  /** The checks of the scan ({@link SignalScanOptions}). Default `{}`: every check at its defaults. */
  checks?: SignalScanOptions;
  /** The zero-phase low-pass ({@link ZeroPhaseLowPassOptions}); required (a cut-off has no default). */
  lowPass: ZeroPhaseLowPassOptions;
}

/** The result of {@link conditionSignalInto}. */
export interface SignalConditioning {
  /** The scan, as {@link scanSignal} returns it (every finding, not only the spikes). */
  readonly scan: SignalScan;
  /** The spike interpolation, as {@link removeSpikesInto} records it. */
  readonly spikes: CorrectionRecord;
  /** The low-pass design and record, as {@link zeroPhaseLowPassInto} returns them. */
  readonly design: ButterworthDesign;
  readonly lowPass: CorrectionRecord;
}

/** The result of {@link conditionSignal}: the conditioned copy and {@link SignalConditioning}. */
export interface ConditionedSignal extends SignalConditioning {
  readonly values: Float64Array;
}

/**
 * The usual conditioning of a measured channel in one call: the checks of {@link scanSignal},
 * the spikes it finds interpolated ({@link removeSpikes}), then the zero-phase Butterworth
 * low-pass ({@link zeroPhaseLowPass}) of the spike-free history. The same findings, records
 * and values as
 * `scan = scanSignal(history, checks); removeSpikesInto(history, scan.findings, out);
 * zeroPhaseLowPassInto(out, out, lowPass)`, to the last bit, in three passes over the record
 * instead of five: the scan; the first forward filter pass, which reads the history directly
 * and the interpolated samples from `out` (no copy of the record); the backward pass. The
 * record is needed whole (the backward pass starts at its end), so there is no streaming form;
 * stream the scan with {@link SignalScanner} and filter afterwards.
 *
 * `out` is a Float64Array of the history's length, or the history itself (for a correction in
 * place). A NaN or ±Infinity sample throws `non-finite-sample` naming the sample index, from
 * the scan, before `out` is written.
 *
 * Effect on a fatigue result: see the two corrections; both lower the ranges, so the life
 * usually grows. Compare the lives with and without them.
 *
 * @example
 * const x = Float64Array.from({ length: 2000 }, (_, i) => Math.sin(i / 40));
 * x[700] = 25; // invented: one bad sample
 * const c = conditionSignal(x, { lowPass: { cutoff: 20, sampleRate: 1000 } });
 * [c.scan.findings.row(0).code, c.spikes.samples, Math.abs(c.values[700] - Math.sin(700 / 40)) < 0.01];
 * // returns ['spike', 1, true]
 */
export function conditionSignalInto(history: ArrayLike<number>, out: Float64Array, options: ConditionSignalOptions): SignalConditioning {
  if (options === null || typeof options !== 'object') throw new SignalError('invalid-option', 'options', options, 'must be an options object with lowPass');
  onlyKnownFields(options, ['checks', 'lowPass'], 'options');
  if (options.lowPass === undefined) throw new SignalError('invalid-option', 'lowPass', undefined, 'is required: { cutoff, sampleRate }');
  if (history === null || typeof history !== 'object' || typeof history.length !== 'number') throw new SignalError('invalid-argument', 'history', history, 'must be an array or typed array of numbers');
  const n = history.length;
  if (!(out instanceof Float64Array) || out.length !== n) throw new SignalError('invalid-argument', 'out', out, `must be a Float64Array of length ${n}`);
  checkLowPassOptions(options.lowPass); // refused before the scan's work
  const scan = scanSignal(history, options.checks);
  const idx = spikeIndices(scan.findings, n);
  const runs = spikeRuns(idx);
  const { design, correction } = lowPassOfCleanedInto(history, out, options.lowPass, runs);
  return { scan, spikes: spikeRecord(idx, runs), design, lowPass: correction };
}

/** {@link conditionSignalInto} into a new Float64Array. */
export function conditionSignal(history: ArrayLike<number>, options: ConditionSignalOptions): ConditionedSignal {
  if (history === null || typeof history !== 'object' || typeof history.length !== 'number') throw new SignalError('invalid-argument', 'history', history, 'must be an array or typed array of numbers');
  const values = new Float64Array(history.length);
  return { values, ...conditionSignalInto(history, values, options) };
}
