import { brokenRule, LoopwiseError } from '@loopwise/base';

/**
 * Thrown when an option or argument of a notch function is out of its domain (Kt < 1, a
 * missing Kt or Kf for nominal input, a negative tolerance, a bad input kind). Names the field,
 * the value it got and the rule it broke.
 *
 * @example
 * try { trackNotch([1], { material, Kt: 0.5 }); } catch (e) { (e as NotchOptionError).field; }
 * // returns 'Kt'
 */
export class NotchOptionError extends LoopwiseError {
  declare readonly code: 'invalid-option';
  /** The rule it broke. */
  readonly rule: string;

  constructor(field: string, value: unknown, rule: string) {
    super('invalid-option', field, value, `invalid option: ${brokenRule(field, value, rule)}`);
    this.rule = rule;
  }
}
