import { describeValue, LoopwiseError } from './LoopwiseError';

/**
 * Exact JSON encoding of doubles. Plain JSON writes ±Infinity and NaN as null and -0 as 0; a
 * streaming state must resume bit for bit, so those four values are written as strings. Every
 * other double is written as itself (JSON's shortest round-trip form is exact).
 */
export type EncodedNumber = number | '-0' | 'Infinity' | '-Infinity' | 'NaN';

/**
 * Encodes one double so that `decodeNumber(JSON.parse(JSON.stringify(encodeNumber(x))))` is x,
 * bit for bit apart from NaN's payload: -0 as `'-0'`, ±Infinity as `'Infinity'` and
 * `'-Infinity'`, NaN as `'NaN'`, every other double as itself.
 *
 * @example
 * encodeNumber(-0)
 * // returns '-0'
 * encodeNumber(1.5)
 * // returns 1.5
 */
export function encodeNumber(x: number): EncodedNumber {
  if (x === 0) return Object.is(x, -0) ? '-0' : 0;
  if (x === Infinity) return 'Infinity';
  if (x === -Infinity) return '-Infinity';
  if (x !== x) return 'NaN';
  return x;
}

/**
 * Decodes a value written by {@link encodeNumber}. Anything else (null, another string, an
 * object) throws a {@link LoopwiseError} with code `'invalid-encoded-number'`, `field` = `where`
 * (the field of the state being read) and the value it got.
 *
 * @example
 * decodeNumber('-Infinity')
 * // returns -Infinity
 */
export function decodeNumber(v: unknown, where = 'value'): number {
  return decode(v, where, undefined);
}

/**
 * Encodes the first `length` entries (default all) of a numeric array as a plain array, each
 * with {@link encodeNumber}. `length` must be an integer from 0 to `a.length`.
 *
 * @example
 * encodeArray(Float64Array.of(1, -0, NaN, 4), 3)
 * // returns [1, '-0', 'NaN']
 */
export function encodeArray(a: ArrayLike<number>, length = a.length): EncodedNumber[] {
  if (!(Number.isInteger(length) && length >= 0 && length <= a.length)) {
    throw new LoopwiseError(
      'invalid-argument',
      'length',
      length,
      `length = ${describeValue(length)} is invalid: must be an integer from 0 to the array's length ${a.length}`,
    );
  }
  const out: EncodedNumber[] = new Array(length);
  for (let i = 0; i < length; i++) out[i] = encodeNumber(a[i]);
  return out;
}

/**
 * Decodes an array written by {@link encodeArray} into a new Float64Array. A value that is not
 * an array, or an element that is not an encoded number, throws a {@link LoopwiseError} with code
 * `'invalid-encoded-number'`, `field` = `where` and, for an element, its `index`.
 *
 * @example
 * decodeArray([1, '-0', 'Infinity'])
 * // returns Float64Array [1, -0, Infinity]
 */
export function decodeArray(v: unknown, where = 'value'): Float64Array {
  if (!Array.isArray(v)) {
    throw new LoopwiseError('invalid-encoded-number', where, v, `${where}: expected an array of encoded numbers, got ${describeValue(v)}`);
  }
  const out = new Float64Array(v.length);
  for (let i = 0; i < v.length; i++) out[i] = decode(v[i], where, i);
  return out;
}

function decode(x: unknown, where: string, index: number | undefined): number {
  if (typeof x === 'number') return x;
  switch (x) {
    case '-0':
      return -0;
    case 'Infinity':
      return Infinity;
    case '-Infinity':
      return -Infinity;
    case 'NaN':
      return NaN;
    default:
      throw new LoopwiseError(
        'invalid-encoded-number',
        where,
        x,
        `${index === undefined ? where : `${where}[${index}]`}: expected an encoded number (a number, '-0', 'Infinity', '-Infinity' or 'NaN'), got ${describeValue(x)}`,
        index,
      );
  }
}
