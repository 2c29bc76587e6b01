import { brokenRule, LoopwiseError } from '@loopwise/base';

/**
 * Thrown when an argument other than the material is out of its domain: a NaN or infinite
 * stress, a negative strain amplitude, fewer than one reversal, a bad estimation input. A
 * {@link LoopwiseError} of `@loopwise/base` with code `'invalid-argument'`: `field` names the
 * argument or option field, `value` is what it got, `rule` the rule it broke, and for array
 * inputs `index` is the element.
 *
 * @example
 * try { strainAmplitudeAtReversals(material, 0.5); }
 * catch (e) { [(e as ArgumentError).code, (e as ArgumentError).field]; }
 * // returns ['invalid-argument', 'reversals']
 */
export class ArgumentError extends LoopwiseError {
  declare readonly code: 'invalid-argument';
  /** The rule it broke, e.g. `"must be a finite number >= 0"`. */
  readonly rule: string;

  /**
   * @param field the argument or option field, e.g. `"strainAmplitude"`
   * @param value the value it got
   * @param rule the rule it broke
   * @param index the element, for array inputs
   */
  constructor(field: string, value: unknown, rule: string, index?: number) {
    super('invalid-argument', field, value, `invalid argument: ${brokenRule(field, value, rule, index)}`, index);
    this.name = 'ArgumentError';
    this.rule = rule;
  }
}
