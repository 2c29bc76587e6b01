import { SignalError } from './SignalError';

// Option checking shared by every entry point of the package (one rule, one place): an options
// object may hold only the documented fields, and every number is checked against its bounds,
// naming the field and the value it got.

/** Throws `unknown-option` for a field of `options` that is not in `known`. */
export function onlyKnownFields(options: object | undefined, known: readonly string[], where: string): void {
  if (options === undefined) return;
  if (options === null || typeof options !== 'object') throw new SignalError('invalid-option', where, options, 'must be an options object');
  for (const key of Object.keys(options)) {
    if (!known.includes(key)) throw new SignalError('unknown-option', `${where}.${key}`, (options as Record<string, unknown>)[key], `not an option of ${where}; the options are ${known.join(', ')}`);
  }
}

/** A finite number > 0 (or >= 0 with `allowZero`), or the default when undefined. */
export function positiveOption(value: unknown, field: string, fallback: number, allowZero = false): number {
  if (value === undefined) return fallback;
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || (!allowZero && value === 0))
    throw new SignalError('invalid-option', field, value, allowZero ? 'must be a finite number >= 0' : 'must be a finite number > 0');
  return value;
}

/** An integer >= `min`, or the default when undefined. */
export function integerOption(value: unknown, field: string, fallback: number, min: number): number {
  if (value === undefined) return fallback;
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < min)
    throw new SignalError('invalid-option', field, value, `must be an integer >= ${min}`);
  return value;
}

/** A history: array-like of numbers, every sample finite (the first bad sample is named). */
export function checkHistory(history: unknown, field = 'history'): ArrayLike<number> {
  if (history === null || typeof history !== 'object' || typeof (history as ArrayLike<number>).length !== 'number')
    throw new SignalError('invalid-argument', field, history, 'must be an array or typed array of numbers');
  const x = history as ArrayLike<number>;
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    // v - v is 0 for finite numbers only (NaN and ±Infinity give NaN); a non-number fails too
    if (typeof v !== 'number' || v - v !== 0) throw new SignalError('non-finite-sample', field, v, 'samples must be finite numbers', i);
  }
  return x;
}
