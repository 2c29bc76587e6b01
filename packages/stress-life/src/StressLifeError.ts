import { brokenRule, LoopwiseError } from '@loopwise/base';

/** Stable codes of {@link StressLifeError}. */
export type StressLifeErrorCode =
  | 'invalid-curve'
  | 'invalid-stress'
  | 'invalid-mean'
  | 'invalid-count'
  | 'invalid-cycles'
  | 'unknown-detail'
  | 'invalid-option'
  | 'non-finite-sample'
  | 'invalid-argument';

/**
 * Thrown for bad input to the stress-life package: a {@link LoopwiseError} of `@loopwise/base`.
 * `code` is stable for programs; `field` names the argument, option or curve field at fault
 * (`slope`, `knees[1].cycles`, `ranges`, `gauges[2]`), `value` is what it got and `index` the
 * element or sample index for column input.
 *
 * Codes: `invalid-curve` (a slope ≤ 0 or not finite, knees out of order, a bad reference point
 * or cut-off), `invalid-stress` (a range or amplitude NaN, ±Infinity or negative),
 * `invalid-mean` (a mean NaN or ±Infinity, or at or beyond the strength a correction divides
 * by), `invalid-count` (a count NaN, ±Infinity or negative), `invalid-cycles` (a number of
 * cycles ≤ 0 or NaN), `unknown-detail` (a detail category or FAT class the standard does not
 * list), `invalid-option` (a bad option: partial factor, method name, thickness, reliability),
 * `non-finite-sample` (a gauge history sample NaN or ±Infinity), `invalid-argument` (columns of
 * different lengths, an output too short, anything else).
 *
 * @example
 * try { defineSnCurve({ stress: 100, cycles: 2e6, slope: -3 }); }
 * catch (e) { [(e as StressLifeError).code, (e as StressLifeError).field]; }
 * // returns ['invalid-curve', 'slope']
 */
export class StressLifeError extends LoopwiseError {
  /** Stable machine-readable code. */
  declare readonly code: StressLifeErrorCode;

  /**
   * @param code stable code
   * @param field the argument, option or field at fault
   * @param value the value it had
   * @param rule the rule it broke, e.g. `"must be a finite number > 0"`
   * @param index element or sample index, when there is one
   */
  constructor(code: StressLifeErrorCode, field: string, value: unknown, rule: string, index?: number) {
    super(code, field, value, `${code}: ${brokenRule(field, value, rule, index)}`, index);
    this.name = 'StressLifeError';
  }
}
