/**
 * The base class of every loopwise error: a stable `code` for programs (kebab-case, the same
 * style in every package, e.g. `'non-finite-sample'`), and the place of the problem for people:
 * `field` (an option, a job field, a material field, a column: `'events[2].repeats'`), the
 * `value` it had, and `index` (a sample, row or element index) when there is one. `name` is the
 * class name of the error thrown.
 *
 * Each package derives its own classes (so `instanceof` tells them apart) and this class is a
 * real runtime dependency, not bundled into each package: `err instanceof LoopwiseError` holds
 * for an error of any loopwise package.
 *
 * @example
 * const e = new LoopwiseError('invalid-option', 'gate', -1, 'option gate = -1 is invalid: must be >= 0');
 * [e.name, e.code, e.field, e.value, e.index]
 * // returns ['LoopwiseError', 'invalid-option', 'gate', -1, undefined]
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
 * A value as it reads in an error message, exactly: numbers as JavaScript writes them (-0 as
 * `-0`, `NaN`, `Infinity`), strings quoted, undefined as `undefined`, arrays, typed arrays and
 * plain objects as JSON in which every number keeps that exact form (plain JSON would write NaN
 * and ±Infinity as `null` and -0 as `0`). Arrays show their first 20 elements and then how many
 * there are; a value JSON cannot write (a cycle, a bigint inside) falls back to its `String`.
 *
 * @example
 * describeValue(-0)
 * // returns '-0'
 * describeValue([1, NaN, -Infinity])
 * // returns '[1,NaN,-Infinity]'
 * describeValue(Float64Array.of(0.5, -0))
 * // returns '[0.5,-0]'
 */
export function describeValue(value: unknown): string {
  if (typeof value === 'number') return Object.is(value, -0) ? '-0' : String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (value === undefined) return 'undefined';
  if (typeof value === 'bigint' || typeof value === 'symbol' || typeof value === 'function') return String(value);
  try {
    const text = JSON.stringify(value, exactReplacer);
    return text === undefined ? String(value) : text.replace(MARKED, '$1');
  } catch {
    return String(value);
  }
}

const MAX_ELEMENTS = 20;
// A number JSON cannot write exactly travels as a marked string and is unquoted afterwards.
const MARK = '\u0001\u0002';
const MARKED = /"\\u0001\\u0002([^"]*)\\u0001\\u0002"/g;

function exactReplacer(_key: string, v: unknown): unknown {
  if (typeof v === 'number') return Number.isFinite(v) && !Object.is(v, -0) ? v : `${MARK}${describeValue(v)}${MARK}`;
  if (ArrayBuffer.isView(v) && !(v instanceof DataView)) v = Array.from(v as unknown as ArrayLike<number>);
  if (Array.isArray(v) && v.length > MAX_ELEMENTS) {
    return [...v.slice(0, MAX_ELEMENTS), `${MARK}… (${v.length} elements)${MARK}`];
  }
  return v;
}

/**
 * The place and the broken rule as an error message reads them: `field[index] = value (rule)`
 * (the index only when there is one; the value written by {@link describeValue}).
 *
 * @example
 * brokenRule('repeats', 0, 'must be an integer >= 1', 2)
 * // returns 'repeats[2] = 0 (must be an integer >= 1)'
 */
export function brokenRule(field: string, value: unknown, rule: string, index?: number): string {
  const where = index === undefined ? field : `${field}[${index}]`;
  return `${where} = ${describeValue(value)} (${rule})`;
}
