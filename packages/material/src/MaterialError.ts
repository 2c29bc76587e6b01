import { describeValue, LoopwiseError } from '@loopwise/base';

/** One broken rule in a material definition: the field, the value it got and the rule. */
export interface MaterialIssue {
  /** Name of the field, e.g. `"b"`. */
  readonly field: string;
  /** The value the field had (kept as given, so `NaN` and `undefined` show as such). */
  readonly value: unknown;
  /** The rule it broke, e.g. `"must be a finite number < 0"`. */
  readonly rule: string;
}

/**
 * Thrown by {@link defineMaterial} (and by every function that receives an invalid material):
 * lists every bad field at once, never only the first. A {@link LoopwiseError} of
 * `@loopwise/base` with code `'invalid-material'`; `field` and `value` are the first issue's
 * (in field order), `issues` has them all.
 *
 * @example
 * try { defineMaterial({ E: -1, sigmaF: 900, b: 0.1, epsilonF: 0.5, c: -0.6, K: 1000, n: 0.15 }); }
 * catch (e) { (e as MaterialError).issues.map((i) => i.field); }
 * // returns ['E', 'b']
 */
export class MaterialError extends LoopwiseError {
  declare readonly code: 'invalid-material';
  /** Every broken rule, in field order (at least one). */
  readonly issues: readonly MaterialIssue[];

  /** @param issues every broken rule, in field order; an empty list stands for "not a material" */
  constructor(issues: readonly MaterialIssue[]) {
    const all: readonly MaterialIssue[] = issues.length > 0 ? issues : [{ field: '(material)', value: undefined, rule: 'must be a material' }];
    super(
      'invalid-material',
      all[0].field,
      all[0].value,
      `invalid material: ${all.map((i) => `${i.field} = ${describeValue(i.value)} (${i.rule})`).join('; ')}`,
    );
    this.name = 'MaterialError';
    this.issues = Object.freeze(all.map((i) => Object.freeze({ field: i.field, value: i.value, rule: i.rule })));
  }
}
