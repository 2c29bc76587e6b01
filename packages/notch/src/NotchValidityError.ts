import { describeValue, LoopwiseError } from '@loopwise/base';

/**
 * Thrown when a load drives the local model outside the range where it gives finite numbers:
 * the pseudo-elastic stress (or strain) range or the local stress or strain overflows to
 * ±Infinity. Names the sample index and the quantity that overflowed. Loads that stay finite
 * but exceed the strain limit are flagged in the result instead (see `beyondStrainLimit`).
 */
export class NotchValidityError extends LoopwiseError {
  declare readonly code: 'outside-model';
  /** Sample index where it happened (-1 for the initial value). */
  declare readonly index: number;
  /** The value it got. */
  declare readonly value: number;

  /** @param field which quantity overflowed: `"pseudoElastic"`, `"stress"` or `"strain"` */
  constructor(index: number, field: string, value: number) {
    super('outside-model', field, value, `local model left its validity at sample ${index}: ${field} = ${describeValue(value)}`, index);
  }
}
