import { describeValue, LoopwiseError } from '@loopwise/base';

/**
 * Thrown when a history sample is NaN or ±Infinity. Names the sample index (the index the
 * tracker gives the sample, counting from 0 across streamed chunks) and the value.
 *
 * @example
 * try { trackNotch([0, NaN], { material, Kt: 2 }); } catch (e) { (e as NotchSampleError).index; }
 * // returns 1
 */
export class NotchSampleError extends LoopwiseError {
  declare readonly code: 'non-finite-sample';
  /** Always `"history"`. */
  declare readonly field: 'history';
  /** Sample index of the bad value. */
  declare readonly index: number;
  /** The value (NaN, Infinity or -Infinity; in a plain array also a value that is not a number). */
  declare readonly value: number;

  constructor(index: number, value: unknown) {
    super('non-finite-sample', 'history', value, `history[${index}] = ${describeValue(value)} (samples must be finite numbers)`, index);
  }
}
