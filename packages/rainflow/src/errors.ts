import { describeValue, LoopwiseError } from '@loopwise/base';

/**
 * Error classes of @loopwise/rainflow. Each is a {@link LoopwiseError} of `@loopwise/base`: a
 * stable kebab-case `code` for programs, and for people the `field` at fault, the `value` it
 * had and, where there is one, the sample `index`.
 */

/**
 * A sample is NaN or ±Infinity, or in a plain array not a number at all (a string, null, a
 * BigInt). Code `'non-finite-sample'`, field `'history'`, `value` the sample, `index` its index
 * in the whole history (counted from the count's `startIndex`).
 */
export class NonFiniteSampleError extends LoopwiseError {
  declare readonly index: number;

  constructor(index: number, value: unknown) {
    super('non-finite-sample', 'history', value, `sample ${index} is ${describeValue(value)}: histories must hold finite numbers only`, index);
    this.name = 'NonFiniteSampleError';
  }
}

/** An option has a value outside its documented domain. Code `'invalid-option'`; `field` names the option. */
export class InvalidOptionError extends LoopwiseError {
  constructor(field: string, value: unknown, rule: string) {
    super('invalid-option', field, value, `option ${field} = ${describeValue(value)} is invalid: ${rule}`);
    this.name = 'InvalidOptionError';
  }
}

/**
 * A cycle's range is not a finite number (|values| near the largest double). Code
 * `'range-overflow'`, field `'history'`, `index` and `startIndex` the sample index of the cycle's
 * first reversal and `value` the sample there; `turnIndex` the sample index of its second.
 */
export class RangeOverflowError extends LoopwiseError {
  declare readonly index: number;
  /** Sample index of the cycle's first reversal (`from`); the same as `index`. */
  readonly startIndex: number;
  /** Sample index of the cycle's second reversal (`to`). */
  readonly turnIndex: number;

  constructor(startIndex: number, turnIndex: number, from: number, to: number) {
    super(
      'range-overflow',
      'history',
      from,
      `the range from ${describeValue(from)} (sample ${startIndex}) to ${describeValue(to)} (sample ${turnIndex}) overflows a double: rescale the history (|values| must stay below about 8e307)`,
      startIndex,
    );
    this.name = 'RangeOverflowError';
    this.startIndex = startIndex;
    this.turnIndex = turnIndex;
  }
}

/**
 * A counter is used in a way its state does not allow (push after finish, a bad append, a saved
 * state that is not one). Code `'counter-state'`; `field` names what is wrong (`'counter'` for a
 * finished counter, `'startIndex'` or `'gate'` for an append, the field of a saved state).
 */
export class CounterStateError extends LoopwiseError {
  constructor(field: string, value: unknown, message: string) {
    super('counter-state', field, value, message);
    this.name = 'CounterStateError';
  }
}

/** Codes of {@link BinError}. */
export type BinErrorCode = 'invalid-bins' | 'outside-bins';

/**
 * Bins that are not a valid layout, or matrices whose bins or kinds cannot be combined. Code
 * `'invalid-bins'` (`'outside-bins'` for its subclass `OutsideBinsError`); `field` names the
 * bins or the matrix field at fault.
 */
export class BinError extends LoopwiseError {
  declare readonly code: BinErrorCode;

  /**
   * @param field the bins or matrix field at fault, e.g. `'range'`, `'rowEdges'`
   * @param value the value it had
   * @param rule what is wrong, written after `field: `
   * @param index the element (edge) index, if any
   * @param code `'invalid-bins'`, or `'outside-bins'` for a cycle outside the bins
   */
  constructor(field: string, value: unknown, rule: string, index?: number, code: BinErrorCode = 'invalid-bins') {
    super(code, field, value, `${field}: ${rule}`, index);
    this.name = 'BinError';
  }
}
