/**
 * The base class of every loopwise error: a stable `code` for programs (kebab-case, the same
 * style in every package, e.g. `'non-finite-sample'`), and the place of the problem for people:
 * `field` (an option, a job field, a material field, a column: `'events[2].repeats'`), the
 * `value` it had, and `index` (a sample, row or element index) when there is one.
 *
 * Each package derives its own classes (so `instanceof` tells them apart) and this class is a
 * real runtime dependency, not bundled into each package: `err instanceof LoopwiseError` holds
 * for an error of any loopwise package.
 *
 * @example
 * try { rainflow([0, NaN]); }
 * catch (e) { [(e as LoopwiseError).code, (e as LoopwiseError).index]; }
 * // returns ['non-finite-sample', 1]
 */
export class LoopwiseError extends Error {
  /** Stable machine-readable code. */
  readonly code: string;
  /** The option, field, argument or column at fault. */
  readonly field: string;
  /** The value it had (kept as given). */
  readonly value: unknown;
  /** Sample, row or element index, when the problem has one; otherwise undefined. */
  readonly index: number | undefined;

  /**
   * @param code stable code (kebab-case)
   * @param field the option, field or column at fault
   * @param value the value it had
   * @param message the full sentence shown to people (say the rule that was broken)
   * @param index sample, row or element index, if any
   */
  constructor(code: string, field: string, value: unknown, message: string, index?: number) {
    super(message);
    this.name = new.target.name;
    this.code = code;
    this.field = field;
    this.value = value;
    this.index = index;
  }
}

/**
 * A value as it reads in an error message: -0 as `-0`, strings quoted, objects as JSON (or
 * their `String` when they do not serialise), undefined as `undefined`.
 */
export function describeValue(value: unknown): string {
  if (typeof value === 'number') return Object.is(value, -0) ? '-0' : String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (value === undefined) return 'undefined';
  if (typeof value === 'bigint' || typeof value === 'symbol' || typeof value === 'function') return String(value);
  try {
    return JSON.stringify(value) ?? String(value);
  } catch {
    return String(value);
  }
}
