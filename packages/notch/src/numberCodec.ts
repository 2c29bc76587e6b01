// Exact JSON encoding of doubles, the same format as @loopwise/rainflow's encodeNumber (notch may
// not depend on rainflow at runtime; a test checks that both agree). Not exported.
export type EncodedNumber = number | '-0' | 'Infinity' | '-Infinity' | 'NaN';

export function encodeNumber(x: number): EncodedNumber {
  if (x === 0) return Object.is(x, -0) ? '-0' : 0;
  if (x === Infinity) return 'Infinity';
  if (x === -Infinity) return '-Infinity';
  if (x !== x) return 'NaN';
  return x;
}

export function decodeNumber(v: unknown): number {
  if (typeof v === 'number') return v;
  if (v === '-0') return -0;
  if (v === 'Infinity') return Infinity;
  if (v === '-Infinity') return -Infinity;
  if (v === 'NaN') return NaN;
  throw new TypeError(`expected an encoded number, got ${JSON.stringify(v)}`);
}
