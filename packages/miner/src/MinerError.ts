import { brokenRule, LoopwiseError } from '@loopwise/base';

/** Stable codes of {@link MinerError}. */
export type MinerErrorCode =
  | 'invalid-count'
  | 'invalid-life'
  | 'invalid-index'
  | 'invalid-range'
  | 'missing-range'
  | 'invalid-critical-damage'
  | 'invalid-scatter-factor'
  | 'invalid-amount'
  | 'invalid-repeats'
  | 'invalid-cutoff'
  | 'invalid-bins'
  | 'invalid-events'
  | 'invalid-residue'
  | 'invalid-argument';

/**
 * Thrown for bad input to the Palmgren-Miner sum and its attribution functions: a
 * {@link LoopwiseError} of `@loopwise/base`. `code` is stable for programs; `field` names the
 * argument, option or column at fault, `value` is what it got, and `index` is the row (loop,
 * bin or event) for column input, otherwise `undefined`.
 *
 * Codes: `invalid-count` (a count NaN, ±Infinity or negative), `invalid-life` (cycles or
 * reversals to failure NaN, ≤ 0, or so small that the damage overflows), `invalid-index` (a
 * sample index that is not a finite integer ≥ 0, or outside the bins or events),
 * `invalid-range` (a range NaN, ±Infinity or negative), `missing-range` (a function that needs
 * ranges met a loop added without one), `invalid-critical-damage` (Dcrit ≤ 0 or not finite),
 * `invalid-scatter-factor` (< 1 or not finite), `invalid-amount` (a negative, zero or
 * non-finite amount of the user's unit per repeat), `invalid-repeats` (zero, negative or
 * non-finite repeats), `invalid-cutoff` (a bad cut-off policy), `invalid-bins` (edges that are
 * not finite and strictly increasing, or a matrix whose counts do not fit its edges),
 * `invalid-events` (bad event starts or ids), `invalid-residue` (a residue point's stress or
 * strain NaN or ±Infinity), `invalid-argument` (anything else, e.g. columns of
 * different lengths or a bad `n`).
 *
 * @example
 * try { new MinerSum().addCycles(1, -5, 0, 1); }
 * catch (e) { (e as MinerError).code; }
 * // returns 'invalid-life'
 */
export class MinerError extends LoopwiseError {
  /** Stable machine-readable code. */
  declare readonly code: MinerErrorCode;

  /**
   * @param code stable code
   * @param field the argument, option or column at fault, e.g. `"cyclesToFailure"`, `"criticalDamage"`
   * @param value the value it had
   * @param rule the rule it broke, e.g. `"must be a finite number >= 0"`
   * @param index row index for column input (loop, bin, event)
   */
  constructor(code: MinerErrorCode, field: string, value: unknown, rule: string, index?: number) {
    super(code, field, value, `${code}: ${brokenRule(field, value, rule, index)}`, index);
    this.name = 'MinerError';
  }
}
