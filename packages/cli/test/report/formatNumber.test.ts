// Expected strings are the documented format (common practice, no source).
import { describe, expect, it, test } from 'vitest';
import { formatCount, formatInteger, formatNumber, formatPercent } from '../../src/report/formatNumber.js';

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

describe('formatCount', () => {
  test('counts are not rounded: halves in full, other fractions to 12 digits, minus as in formatNumber', () => {
    expect(formatCount(13397.5)).toBe('13397.5');
    expect(formatCount(380288.5)).toBe('380288.5');
    expect(formatCount(7)).toBe('7');
    expect(formatCount(2.37 * 3)).toBe('7.11');
    expect(formatCount(-0.5)).toBe('−0.5');
    expect(formatCount(Infinity)).toBe(formatNumber(Infinity));
  });
});
