/**
 * Exact JSON encoding of doubles. Plain JSON writes ±Infinity and NaN as null and -0 as 0; a
 * streaming state must resume bit for bit, so those four values are written as strings.
 */
export type EncodedNumber = number | '-0' | 'Infinity' | '-Infinity' | 'NaN';

/**
 * Encodes one double so that `decodeNumber(JSON.parse(JSON.stringify(encodeNumber(x))))` is x.
 *
 * @example
 * encodeNumber(-0)
 * // returns '-0'
 */
export function encodeNumber(x: number): EncodedNumber {
  if (x === 0) return Object.is(x, -0) ? '-0' : 0;
  if (x === Infinity) return 'Infinity';
  if (x === -Infinity) return '-Infinity';
  if (x !== x) return 'NaN';
  return x;
}

/**
 * Decodes a value written by {@link encodeNumber}; anything else throws a TypeError naming
 * `where` (the field of the state being read).
 */
export function decodeNumber(v: unknown, where = 'value'): number {
  if (typeof v === 'number') return v;
  switch (v) {
    case '-0':
      return -0;
    case 'Infinity':
      return Infinity;
    case '-Infinity':
      return -Infinity;
    case 'NaN':
      return NaN;
    default:
      throw new TypeError(`${where}: expected an encoded number, got ${JSON.stringify(v)}`);
  }
}

/** Encodes the first `length` entries of a numeric array. */
export function encodeArray(a: ArrayLike<number>, length = a.length): EncodedNumber[] {
  const out: EncodedNumber[] = new Array(length);
  for (let i = 0; i < length; i++) out[i] = encodeNumber(a[i]);
  return out;
}

/** Decodes an array written by {@link encodeArray} into a new Float64Array. */
export function decodeArray(v: unknown, where = 'value'): Float64Array {
  if (!Array.isArray(v)) throw new TypeError(`${where}: expected an array`);
  const out = new Float64Array(v.length);
  for (let i = 0; i < v.length; i++) out[i] = decodeNumber(v[i], `${where}[${i}]`);
  return out;
}
