import { unknownField } from '@loopwise/base';
import { InvalidOptionError, NonFiniteSampleError } from './errors';

/**
 * Checks that a history is an array or typed array of numbers before any counting (internal):
 * anything without a numeric `length` (null, a number, a string) and BigInt arrays throw
 * {@link InvalidOptionError} on `history`; in a plain array a sample that is not a number (a
 * string, null, a BigInt) throws {@link NonFiniteSampleError} with its index, as NaN does. Typed
 * arrays of numbers hold numbers only and are not read here (no cost on the fast path).
 *
 * @param first sample index of `history[0]` in the whole history (for the error's index)
 */
export function checkHistory(history: ArrayLike<number>, first = 0): void {
  if (history === null || typeof history !== 'object' || typeof (history as { length?: unknown }).length !== 'number') {
    throw new InvalidOptionError('history', history, 'must be an array or typed array of finite numbers');
  }
  if (ArrayBuffer.isView(history)) {
    if (history instanceof BigInt64Array || history instanceof BigUint64Array) {
      throw new InvalidOptionError('history', history, 'must hold numbers, not BigInt');
    }
    return;
  }
  for (let i = 0; i < history.length; i++) {
    const x = history[i];
    if (typeof x !== 'number') throw new NonFiniteSampleError(first + i, x);
  }
}

/**
 * Checks an options object (internal): undefined, or an object whose fields are all in `known`
 * (an unknown one throws {@link InvalidOptionError} suggesting the nearest known name).
 */
export function checkOptionFields(options: unknown, known: readonly string[], where: string): void {
  if (options === undefined) return;
  if (options === null || typeof options !== 'object' || Array.isArray(options)) {
    throw new InvalidOptionError('options', options, `${where} must be an object`);
  }
  const u = unknownField(options, known, where);
  if (u !== undefined) throw new InvalidOptionError(u.field, u.value, u.rule);
}
