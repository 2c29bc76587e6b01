// Expected strings are the documented format (common practice, no source).
import { describe, expect, it } from 'vitest';
import { formatInteger, formatNumber, formatPercent } from '../../src/report/formatNumber.js';

describe('formatNumber(x, digits = 4)', () => {
  it.each([
    [0, '0'],
    [-0, '0'],
    [0.5, '0.5'],
    [2, '2'],
    [123.456, '123.5'],
    [-7.25, '−7.25'],
    [999.96, '1000'],
    [1234.5, '1235'],
    [523139.4, '523139'],
    [999999.6, '1 × 10⁶'],
    [1234567, '1.235 × 10⁶'],
    [3.186e-8, '3.186 × 10⁻⁸'],
    [0.001, '0.001'],
    [0.00099996, '1 × 10⁻³'],
    [Infinity, '∞'],
    [-Infinity, '−∞'],
    [NaN, '—'],
  ])('formatNumber(%s) returns %s', (x, text) => {
    expect(formatNumber(x)).toBe(text);
  });

  it('formatPercent(share) and formatInteger(index)', () => {
    expect(formatPercent(0.4567)).toBe('45.7 %');
    expect(formatPercent(1)).toBe('100 %');
    expect(formatInteger(12000000)).toBe('12000000');
    expect(formatInteger(-1)).toBe('−1');
  });
});
