import { brokenRule, LoopwiseError } from '@loopwise/base';

/** Stable codes of {@link MeanStressError}. */
export type MeanStressErrorCode =
  | 'invalid-loop'
  | 'invalid-gamma'
  | 'missing-tensile-strength'
  | 'unknown-damage-parameter'
  | 'invalid-argument';

/**
 * Thrown for bad input to a damage parameter: a loop with a NaN or infinite field or with
 * σmax < σmin or εmax < εmin (`invalid-loop`, naming the field, its value and, for columns, the
 * loop index), a Walker γ outside (0, 1] (`invalid-gamma`), a Walker estimate without Su
 * (`missing-tensile-strength`), an unknown name (`unknown-damage-parameter`), or a bad output
 * column or option (`invalid-argument`). Invalid materials throw the material package's
 * `MaterialError`. A {@link LoopwiseError} of `@loopwise/base`: `code`, `field`, `value` and
 * `index` (the loop index for column input, otherwise undefined).
 *
 * @example
 * try { smithWatsonTopper.reversalsToFailure(m, { stressMax: 100, stressMin: 200, strainMax: 0.002, strainMin: 0 }); }
 * catch (e) { (e as MeanStressError).code; }
 * // returns 'invalid-loop'
 */
export class MeanStressError extends LoopwiseError {
  /** Stable machine-readable code. */
  declare readonly code: MeanStressErrorCode;

  /**
   * @param code stable code
   * @param field the field or argument at fault, e.g. `"stressMin"`, `"gamma"`
   * @param value the value it had
   * @param rule the rule it broke, e.g. `"must be a finite number"`
   * @param index loop index for column input
   */
  constructor(code: MeanStressErrorCode, field: string, value: unknown, rule: string, index?: number) {
    super(code, field, value, `${code}: ${brokenRule(field, value, rule, index)}`, index);
    this.name = 'MeanStressError';
  }
}
