/**
 * Error classes of @loopwise/rainflow. Each has a stable `code` for programs and names the place
 * of the problem (a sample index, an option field) for people.
 */

/** A sample is NaN or ±Infinity. `index` is the sample's index in the whole history. */
export class NonFiniteSampleError extends Error {
  readonly code = 'LW_NON_FINITE_SAMPLE';
  constructor(
    readonly index: number,
    readonly value: number,
  ) {
    super(`sample ${index} is ${String(value)}: histories must hold finite numbers only`);
    this.name = 'NonFiniteSampleError';
  }
}

/** An option has a value outside its documented domain. `field` names the option. */
export class InvalidOptionError extends Error {
  readonly code = 'LW_INVALID_OPTION';
  constructor(
    readonly field: string,
    readonly value: unknown,
    rule: string,
  ) {
    super(`option ${field} = ${describe(value)} is invalid: ${rule}`);
    this.name = 'InvalidOptionError';
  }
}

/** A cycle's range is not a finite number (|values| near the largest double). */
export class RangeOverflowError extends Error {
  readonly code = 'LW_RANGE_OVERFLOW';
  constructor(
    readonly startIndex: number,
    readonly endIndex: number,
  ) {
    super(
      `the range between samples ${startIndex} and ${endIndex} overflows a double: rescale the history (|values| must stay below about 8e307)`,
    );
    this.name = 'RangeOverflowError';
  }
}

/** A counter is used in a way its state does not allow (push after finish, bad merge, bad JSON). */
export class CounterStateError extends Error {
  readonly code = 'LW_COUNTER_STATE';
  constructor(message: string) {
    super(message);
    this.name = 'CounterStateError';
  }
}

/** Matrices or bins that cannot be combined, or a bin layout that is not valid. */
export class BinError extends Error {
  readonly code = 'LW_BINS';
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(`${field}: ${message}`);
    this.name = 'BinError';
  }
}

function describe(value: unknown): string {
  if (typeof value === 'number') return Object.is(value, -0) ? '-0' : String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  try {
    return JSON.stringify(value) ?? String(value);
  } catch {
    return String(value);
  }
}
