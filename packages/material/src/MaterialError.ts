/** One broken rule in a material definition: the field, the value it got and the rule. */
export interface MaterialIssue {
  /** Name of the field, e.g. `"b"`. */
  readonly field: string;
  /** The value the field had (kept as given, so `NaN` and `undefined` show as such). */
  readonly value: unknown;
  /** The rule it broke, e.g. `"must be a finite number < 0"`. */
  readonly rule: string;
}

function show(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number' && Object.is(value, -0)) return '-0';
  return String(value);
}

/**
 * Thrown by {@link defineMaterial} (and by every function that receives an invalid material):
 * lists every bad field at once, never only the first.
 *
 * @example
 * try { defineMaterial({ E: -1, sigmaF: 900, b: 0.1, epsilonF: 0.5, c: -0.6, K: 1000, n: 0.15 }); }
 * catch (e) { (e as MaterialError).issues.map((i) => i.field); }
 * // returns ['E', 'b']
 */
export class MaterialError extends Error {
  /** Stable machine-readable code. */
  readonly code = 'invalid-material' as const;
  /** Every broken rule, in field order. */
  readonly issues: readonly MaterialIssue[];

  constructor(issues: readonly MaterialIssue[]) {
    super(
      `invalid material: ${issues.map((i) => `${i.field} = ${show(i.value)} (${i.rule})`).join('; ')}`,
    );
    this.name = 'MaterialError';
    this.issues = Object.freeze(issues.slice());
  }
}
