function show(value: unknown): string {
  if (typeof value === 'number' && Object.is(value, -0)) return '-0';
  if (typeof value === 'string') return JSON.stringify(value);
  return String(value);
}

/**
 * Thrown when an option or argument of a notch function is out of its domain (Kt < 1, a
 * missing Kt or Kf for nominal input, a negative tolerance, a bad input kind). Names the field,
 * the value it got and the rule it broke.
 *
 * @example
 * try { trackNotch([1], { material, Kt: 0.5 }); } catch (e) { (e as NotchOptionError).field; }
 * // returns 'Kt'
 */
export class NotchOptionError extends Error {
  /** Stable machine-readable code. */
  readonly code = 'invalid-option' as const;
  /** Name of the option or argument, e.g. `"Kt"`. */
  readonly field: string;
  /** The value it got. */
  readonly value: unknown;
  /** The rule it broke. */
  readonly rule: string;

  constructor(field: string, value: unknown, rule: string) {
    super(`invalid option: ${field} = ${show(value)} (${rule})`);
    this.name = 'NotchOptionError';
    this.field = field;
    this.value = value;
    this.rule = rule;
  }
}
