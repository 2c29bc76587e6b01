import { NotchOptionError } from './NotchOptionError';
import { NotchSampleError } from './NotchSampleError';

/** Whether `v` is an array or typed array of numbers by its shape (BigInt arrays are not). */
function isNumberArray(v: unknown): boolean {
  if (v === null || typeof v !== 'object' || typeof (v as { length?: unknown }).length !== 'number') return false;
  return !(v instanceof BigInt64Array || v instanceof BigUint64Array);
}

/**
 * Checks what a tracker is given before it reads it (internal): `values` (and `indices` when
 * given) must be arrays or typed arrays of numbers, else {@link NotchOptionError} naming the
 * argument; in a plain array, a sample that is not a number (a string, null, a BigInt) throws
 * {@link NotchSampleError} with its sample index, as NaN does. Typed arrays hold numbers only
 * and are not read here, so the hot path pays nothing.
 *
 * @param base sample index of `values[from]` when there are no indices
 */
export function checkSamples(values: ArrayLike<number>, indices: ArrayLike<number> | null, from: number, to: number, base: number): void {
  if (!isNumberArray(values)) throw new NotchOptionError('history', values, 'must be an array or typed array of finite numbers');
  if (indices !== null && !isNumberArray(indices)) throw new NotchOptionError('indices', indices, 'must be an array or typed array of sample indices');
  if (ArrayBuffer.isView(values)) return;
  const end = Math.min(to, values.length);
  for (let i = from; i < end; i++) {
    const x = values[i];
    if (typeof x !== 'number') throw new NotchSampleError(indices !== null ? indices[i] : base + (i - from), x);
  }
}
