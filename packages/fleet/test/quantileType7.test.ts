import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { checkProperty } from '../../../test/property';
import { quantile, quantileType7 } from '../src/quantileType7';

describe('quantileType7(sorted, p)', () => {
  test('quantileType7([1, 2, 3, 4], p) follows definition 7 of Hyndman and Fan (1996): 1.75 at 0.25, 2.5 at 0.5, 3.25 at 0.75', () => {
    // Hyndman & Fan, The American Statistician 50(4) 1996, definition 7: h = (n-1)p + 1 (1-based);
    // the same figures are NumPy's default percentile of [1, 2, 3, 4] (value from memory)
    expect(quantileType7([1, 2, 3, 4], 0.25)).toBe(1.75);
    expect(quantileType7([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantileType7([1, 2, 3, 4], 0.75)).toBe(3.25);
    expect(quantile).toBe(quantileType7);
  });

  test('quantileType7 of the ends, one value, no values and p outside [0, 1]', () => {
    expect(quantileType7([2, 5, 9], 0)).toBe(2);
    expect(quantileType7([2, 5, 9], 1)).toBe(9);
    expect(quantileType7([7], 0.95)).toBe(7);
    expect(quantileType7([], 0.5)).toBeNaN();
    expect(() => quantileType7([1, 2], 1.5)).toThrow(RangeError);
    expect(() => quantileType7([1, 2], NaN)).toThrow(/p must be in \[0, 1\]/);
  });

  test('quantileType7 is non-decreasing in p and stays within the values', () => {
    checkProperty(
      'quantile monotone',
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 40 }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (values, p, q) => {
        // Arrange
        const sorted = [...values].sort((a, b) => a - b);
        const [lo, hi] = p <= q ? [p, q] : [q, p];
        // Act
        const a = quantileType7(sorted, lo);
        const b = quantileType7(sorted, hi);
        // Assert
        return a <= b + 1e-9 * Math.max(1, Math.abs(b)) && a >= sorted[0] && b <= sorted[sorted.length - 1];
      }),
      { numRuns: 300 },
    );
  });
});
