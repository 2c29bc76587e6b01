import { neumaierSum } from '@loopwise/base';
import { checkHistory, onlyKnownFields } from './checkOptions';
import { correctionRecord, type CorrectionRecord } from './CorrectionRecord';
import { SignalError } from './SignalError';

/** Options of {@link removeOffset}. */
export interface RemoveOffsetOptions {
  /** The offset to subtract, in the history's unit, or `'mean'` (the compensated mean of the record). Default `'mean'`. */
  offset?: number | 'mean';
}

/** The result of {@link removeOffset}. */
export interface OffsetRemoval {
  readonly values: Float64Array;
  /** The offset subtracted. */
  readonly offset: number;
  readonly correction: CorrectionRecord;
}

/**
 * Subtracts a constant from every sample: the mean of the record (Neumaier-compensated sum,
 * from `@loopwise/base`) or a given offset, e.g. the zero reading of the unloaded gauge.
 *
 * Effect on a fatigue result: ranges do not change, means do, so the cycle counts are the same
 * but every mean-stress correction (Morrow, SWT, Walker) and the local stress-strain path at a
 * notch (which starts from zero) change. Removing the mean of a record that truly has a mean
 * load (a preload, dead weight) makes the estimate unconservative: subtract the measured zero
 * offset instead where it is known.
 *
 * @example
 * removeOffset([10, 12, 8, 10]).values;
 * // returns Float64Array [0, 2, -2, 0]
 * removeOffset([10, 12], { offset: 10 }).correction.summary;
 * // returns 'offset 10 subtracted from 2 samples'
 */
export function removeOffset(history: ArrayLike<number>, options: RemoveOffsetOptions = {}): OffsetRemoval {
  onlyKnownFields(options, ['offset'], 'options');
  const x = checkHistory(history);
  const n = x.length;
  const given = options.offset ?? 'mean';
  let offset: number;
  if (given === 'mean') offset = n === 0 ? 0 : neumaierSum(x) / n;
  else if (typeof given === 'number' && Number.isFinite(given)) offset = given;
  else throw new SignalError('invalid-option', 'offset', given, "must be a finite number or 'mean'");
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = x[i] - offset;
  const correction = correctionRecord('offset-removed', [0, n], n === 0 ? 0 : 1, n, { offset, method: given === 'mean' ? 'mean' : 'given' }, `offset ${offset} subtracted from ${n} samples`);
  return { values: out, offset, correction };
}
