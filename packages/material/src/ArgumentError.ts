/**
 * Thrown when an argument other than the material is out of its domain: a NaN or infinite
 * stress, a negative strain amplitude, fewer than one reversal, a bad estimation input. Names
 * the argument, the value it got, the rule, and for array inputs the index of the element.
 *
 * @example
 * try { strainAmplitudeAtReversals(material, 0.5); }
 * catch (e) { (e as ArgumentError).argument; }
 * // returns 'reversals'
 */
export class ArgumentError extends Error {
  /** Stable machine-readable code. */
  readonly code = 'invalid-argument' as const;
  /** Name of the argument or option field, e.g. `"strainAmplitude"`. */
  readonly argument: string;
  /** The value it got. */
  readonly value: unknown;
  /** The rule it broke. */
  readonly rule: string;
  /** Index of the element for array inputs, otherwise `undefined`. */
  readonly index: number | undefined;

  constructor(argument: string, value: unknown, rule: string, index?: number) {
    const where = index === undefined ? argument : `${argument}[${index}]`;
    super(`invalid argument: ${where} = ${Object.is(value, -0) ? '-0' : String(value)} (${rule})`);
    this.name = 'ArgumentError';
    this.argument = argument;
    this.value = value;
    this.rule = rule;
    this.index = index;
  }
}
