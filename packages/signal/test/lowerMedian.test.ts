// lowerMedian (internal: the robust scale of the spike check and the nominal step of
// detectTimeGaps) against its definition, the element of rank ⌊(n − 1)/2⌋ of the sorted values.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lowerMedian } from '../src/lowerMedian';
import { checkProperty } from '../../../test/property';

describe('lowerMedian(values, count, scratch?, spare?)', () => {
  it('is the element of rank ⌊(count − 1)/2⌋ and leaves the values as they were (property)', () => {
    checkProperty(
      'lower median = sorted[(n − 1) >> 1]',
      fc.property(
        fc.oneof(
          fc.array(fc.double({ noNaN: true }), { minLength: 1, maxLength: 700 }),
          fc.array(fc.integer({ min: -3, max: 3 }), { minLength: 1, maxLength: 700 }), // many ties
          fc.integer({ min: 1, max: 700 }).map((n) => Array.from({ length: n }, (_, i) => i)), // sorted
          fc.integer({ min: 1, max: 700 }).map((n) => Array.from({ length: n }, (_, i) => -i)), // reversed
        ),
        fc.nat({ max: 5 }),
        (list, extra) => {
          // Arrange
          const values = Float64Array.from(list);
          const before = values.slice();
          const rank = (xs: number[]) => Float64Array.from(xs).sort()[(xs.length - 1) >> 1];
          // Act: the whole array, and only its first count − 1 elements
          const all = lowerMedian(values, list.length, new Float64Array(list.length + extra), new Float64Array(list.length + extra));
          const head = list.length > 1 ? lowerMedian(values, list.length - 1) : NaN;
          // Assert (=== : −0 and +0 are the same median)
          expect(all === rank(list)).toBe(true);
          if (list.length > 1) expect(head === rank(list.slice(0, -1))).toBe(true);
          expect(values).toEqual(before);
        },
      ),
      { seed: 42, numRuns: 400 },
    );
  });

  it('is NaN for no values and the value for one', () => {
    expect(lowerMedian(new Float64Array(0), 0)).toBeNaN();
    expect(lowerMedian(Float64Array.of(-2.5), 1)).toBe(-2.5);
    expect(lowerMedian(Float64Array.of(5, 1, 4, 2), 4)).toBe(2);
  });
});
