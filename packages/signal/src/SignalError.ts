import { brokenRule, LoopwiseError } from '@loopwise/base';

/** Stable codes of {@link SignalError}. */
export type SignalErrorCode = 'non-finite-sample' | 'invalid-option' | 'unknown-option' | 'invalid-range' | 'invalid-argument';

/**
 * Thrown for bad input to the signal checks and corrections: a {@link LoopwiseError} of
 * `@loopwise/base`. `code` is stable for programs; `field` names the argument or option at fault
 * (`'history'`, `'cutoff'`, `'ranges[1].last'`), `value` is what it got, and `index` is the
 * sample (or range) index when there is one.
 *
 * Codes: `non-finite-sample` (a sample or time value NaN or ±Infinity; `index` is the sample),
 * `invalid-option` (an option of the wrong type or out of its documented bounds, e.g. a cut-off
 * at or above the Nyquist frequency, an order below 1), `unknown-option` (a field the options
 * object does not have, usually a misspelling), `invalid-range` (a range whose ends are out of
 * order, outside the history, or overlapping the one before), `invalid-argument` (anything else:
 * a history that is not array-like, chunks out of order, a time column of another length).
 *
 * @example
 * try { zeroPhaseLowPass([1, 2, 3], { cutoff: 60, sampleRate: 100 }); }
 * catch (e) { [(e as SignalError).code, (e as SignalError).field]; }
 * // returns ['invalid-option', 'cutoff']
 */
export class SignalError extends LoopwiseError {
  /** Stable machine-readable code. */
  declare readonly code: SignalErrorCode;

  /**
   * @param code stable code
   * @param field the argument or option at fault
   * @param value the value it had
   * @param rule the rule it broke, e.g. `"must be a finite number > 0"`
   * @param index sample or element index, if any
   */
  constructor(code: SignalErrorCode, field: string, value: unknown, rule: string, index?: number) {
    super(code, field, value, `${code}: ${brokenRule(field, value, rule, index)}`, index);
    this.name = 'SignalError';
  }
}

