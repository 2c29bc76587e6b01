import { SignalError } from './SignalError';

/**
 * How sample indices map to time: a constant sample rate (`{ sampleRate, startTime? }`, in Hz
 * and seconds, `startTime` default 0) or a time column with one value per sample (seconds, any
 * array-like of finite numbers).
 */
export type TimeBase = { readonly sampleRate: number; readonly startTime?: number } | ArrayLike<number>;

/**
 * The time of each sample index in `indices` (seconds), as a new Float64Array. With a sample
 * rate, t = startTime + index / sampleRate; with a time column, t = time[index].
 *
 * @example
 * timesOfSamples(Float64Array.of(0, 50), { sampleRate: 100 });
 * // returns Float64Array [0, 0.5]
 */
export function timesOfSamples(indices: ArrayLike<number>, timeBase: TimeBase): Float64Array {
  const out = new Float64Array(indices.length);
  if (isSampleRate(timeBase)) {
    const rate = timeBase.sampleRate;
    if (typeof rate !== 'number' || !(rate > 0) || rate === Infinity) throw new SignalError('invalid-option', 'timeBase.sampleRate', rate, 'must be a finite number > 0');
    const t0 = timeBase.startTime ?? 0;
    if (typeof t0 !== 'number' || !Number.isFinite(t0)) throw new SignalError('invalid-option', 'timeBase.startTime', t0, 'must be a finite number');
    for (let k = 0; k < indices.length; k++) out[k] = t0 + indices[k] / rate;
    return out;
  }
  for (let k = 0; k < indices.length; k++) {
    const i = indices[k];
    if (!(i >= 0 && i < timeBase.length)) throw new SignalError('invalid-argument', 'timeBase', timeBase.length, `the time column has no sample ${i}`, k);
    out[k] = timeBase[i];
  }
  return out;
}

/** True for the `{ sampleRate }` form of a {@link TimeBase}. */
export function isSampleRate(timeBase: TimeBase): timeBase is { readonly sampleRate: number; readonly startTime?: number } {
  return typeof (timeBase as { sampleRate?: unknown }).sampleRate !== 'undefined' && typeof (timeBase as ArrayLike<number>).length !== 'number';
}
