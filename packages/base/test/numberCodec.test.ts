import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { decodeArray, decodeNumber, encodeArray, encodeNumber, LoopwiseError } from '@loopwise/base';
import { checkProperty } from '../../../test/property';

/** Through JSON text and back, as a saved state travels. */
const viaJson = (v: unknown): unknown => JSON.parse(JSON.stringify(v));

describe('encodeNumber(x) and decodeNumber(v, where)', () => {
  test('decodeNumber(JSON round trip of encodeNumber(x)) is x for -0, ±Infinity and NaN', () => {
    // plain JSON loses all four (common practice, no source: JSON has no literal for them)
    expect(viaJson([-0, Infinity, -Infinity, NaN])).toEqual([0, null, null, null]);
    for (const x of [-0, Infinity, -Infinity, NaN]) {
      expect(Object.is(decodeNumber(viaJson(encodeNumber(x))), x)).toBe(true);
    }
  });

  test('encodeNumber(x) writes the four special values as strings and every other double as itself', () => {
    expect([encodeNumber(-0), encodeNumber(Infinity), encodeNumber(-Infinity), encodeNumber(NaN)]).toEqual([
      '-0',
      'Infinity',
      '-Infinity',
      'NaN',
    ]);
    expect(Object.is(encodeNumber(0), 0)).toBe(true);
    expect(encodeNumber(Number.MIN_VALUE)).toBe(Number.MIN_VALUE);
    expect(encodeNumber(-Number.MAX_VALUE)).toBe(-Number.MAX_VALUE);
  });

  test('decodeNumber(viaJson(encodeNumber(x))) is x bit for bit for every double', () => {
    checkProperty(
      'number codec round trip',
      fc.property(fc.double(), (x) => {
        // Arrange / Act
        const back = decodeNumber(viaJson(encodeNumber(x)));
        // Assert: Object.is tells -0 from 0 and NaN equals NaN
        expect(Object.is(back, x)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  test('decodeNumber(bad, where) throws a LoopwiseError naming the field and the value', () => {
    for (const bad of [null, undefined, '', 'inf', '0', {}, [1], true]) {
      let err: unknown;
      try {
        decodeNumber(bad, 'filter.ext');
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(LoopwiseError);
      expect(err).toMatchObject({ code: 'invalid-encoded-number', field: 'filter.ext', value: bad, index: undefined });
      expect((err as Error).message).toMatch(/^filter\.ext: expected an encoded number/);
    }
    expect(() => decodeNumber(null)).toThrow(/^value: expected an encoded number .*got null$/);
  });
});

describe('encodeArray(a, length) and decodeArray(v, where)', () => {
  test('decodeArray(JSON round trip of encodeArray(a)) is a, element by element, as a Float64Array', () => {
    checkProperty(
      'array codec round trip',
      fc.property(fc.array(fc.double(), { maxLength: 40 }), (a) => {
        const back = decodeArray(viaJson(encodeArray(a)));
        expect(back).toBeInstanceOf(Float64Array);
        expect(back.length).toBe(a.length);
        for (let i = 0; i < a.length; i++) expect(Object.is(back[i], a[i])).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  test('encodeArray(a, length) encodes only the first length entries (a table\'s rows in use)', () => {
    const column = Float64Array.of(1, -0, NaN, 4, 0);
    expect(encodeArray(column, 3)).toEqual([1, '-0', 'NaN']);
    expect(encodeArray(column, 0)).toEqual([]);
    expect(encodeArray([])).toEqual([]);
  });

  test('encodeArray(a, length) refuses a length outside 0 … a.length', () => {
    for (const length of [-1, 6, 1.5, NaN]) {
      expect(() => encodeArray(Float64Array.of(1, 2, 3, 4, 5), length)).toThrow(
        expect.objectContaining({ code: 'invalid-argument', field: 'length', value: length }),
      );
    }
  });

  test('decodeArray(bad, where) names the field, and for a bad element its index', () => {
    expect(() => decodeArray('[1]', 'cycles.from')).toThrow(
      expect.objectContaining({ code: 'invalid-encoded-number', field: 'cycles.from', value: '[1]', index: undefined }),
    );
    expect(() => decodeArray([1, 2, null], 'cycles.from')).toThrow(
      expect.objectContaining({ code: 'invalid-encoded-number', field: 'cycles.from', value: null, index: 2 }),
    );
    expect(() => decodeArray([1, 'x'], 'cycles.to')).toThrow(/^cycles\.to\[1\]: expected an encoded number/);
    expect(decodeArray([]).length).toBe(0);
  });
});
