/**
 * Thrown when a load drives the local model outside the range where it gives finite numbers:
 * the pseudo-elastic stress (or strain) range or the local stress or strain overflows to
 * ±Infinity. Names the sample index and the quantity that overflowed. Loads that stay finite
 * but exceed the strain limit are flagged in the result instead (see `beyondStrainLimit`).
 */
export class NotchValidityError extends Error {
  /** Stable machine-readable code. */
  readonly code = 'outside-model' as const;
  /** Sample index where it happened (-1 for the initial value). */
  readonly index: number;
  /** Which quantity overflowed: `"pseudoElastic"`, `"stress"` or `"strain"`. */
  readonly field: string;
  /** The value it got. */
  readonly value: number;

  constructor(index: number, field: string, value: number) {
    super(`local model left its validity at sample ${index}: ${field} = ${String(value)}`);
    this.name = 'NotchValidityError';
    this.index = index;
    this.field = field;
    this.value = value;
  }
}
