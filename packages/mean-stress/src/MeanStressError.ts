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
 * `MaterialError`.
 *
 * @example
 * try { smithWatsonTopper.reversalsToFailure({ sigmaMax: 100, sigmaMin: 200, epsilonMax: 0.002, epsilonMin: 0 }, m); }
 * catch (e) { (e as MeanStressError).code; }
 * // returns 'invalid-loop'
 */
export class MeanStressError extends Error {
  /** Stable machine-readable code. */
  readonly code: MeanStressErrorCode;
  /** The field or argument at fault, e.g. `"sigmaMin"`, `"gamma"`. */
  readonly field: string;
  /** The value it had. */
  readonly value: unknown;
  /** Loop index for column input, otherwise `undefined`. */
  readonly index: number | undefined;

  constructor(code: MeanStressErrorCode, field: string, value: unknown, rule: string, index?: number) {
    const where = index === undefined ? field : `${field}[${index}]`;
    super(`${code}: ${where} = ${Object.is(value, -0) ? '-0' : String(value)} (${rule})`);
    this.name = 'MeanStressError';
    this.code = code;
    this.field = field;
    this.value = value;
    this.index = index;
  }
}
