import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkProperty } from '../../../test/property.js';
import { parseDecimal, parseDecimalText } from '../src/parseDecimal.js';

const parse = (text: string, comma = false) => {
  const b = Buffer.from(text, 'latin1');
  return parseDecimal(b, 0, b.length, comma);
};
const same = (a: number, b: number) => Object.is(a, b);

/** Decimal texts in the accepted grammar: sign, digits, point, exponent, long mantissas. */
const digits = (min: number, max: number) => fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: min, maxLength: max });
const decimalText = fc
  .record({
    sign: fc.constantFrom('', '-', '+'),
    int: digits(0, 25),
    point: fc.boolean(),
    frac: digits(0, 25),
    exp: fc.option(fc.tuple(fc.constantFrom('e', 'E'), fc.constantFrom('', '-', '+'), fc.integer({ min: 0, max: 400 })), { nil: undefined }),
  })
  .filter((r) => r.int.length + (r.point ? r.frac.length : 0) > 0)
  .map((r) => `${r.sign}${r.int}${r.point ? '.' + r.frac : ''}${r.exp ? r.exp[0] + r.exp[1] + r.exp[2] : ''}`);

describe('parseDecimal(bytes, start, end, decimalComma)', () => {
  it('parseDecimal is bit-exact with Number() on generated decimal texts', () => {
    // Arrange / Act / Assert: the value of every accepted text equals Number() of the same text
    checkProperty(
      'parseDecimal === Number',
      fc.property(decimalText, (t) => same(parse(t), Number(t))),
      { numRuns: 5000 },
    );
  });

  it('parseDecimal is bit-exact with Number() on shortest round-trip texts of random doubles', () => {
    checkProperty(
      'parseDecimal(String(x)) === x',
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        const t = String(x);
        return same(parse(t), Number(t)) && same(parse(x.toFixed(4)), Number(x.toFixed(4)));
      }),
      { numRuns: 3000 },
    );
  });

  it('parseDecimal(text, decimalComma = true) equals Number() with the comma read as a point', () => {
    checkProperty(
      'decimal comma',
      fc.property(decimalText, (t) => same(parse(t.replace('.', ','), true), Number(t))),
      { numRuns: 3000 },
    );
  });

  it('parseDecimal keeps -0, a leading +, integers and exponents exact', () => {
    expect(Object.is(parse('-0'), -0)).toBe(true);
    expect(Object.is(parse('-0.000'), -0)).toBe(true);
    expect(parse('+12.5')).toBe(12.5);
    expect(parse('9007199254740993')).toBe(Number('9007199254740993'));
    expect(parse('1.7976931348623157e308')).toBe(Number.MAX_VALUE);
    expect(parse('5e-324')).toBe(5e-324);
    expect(parse('0.1')).toBe(0.1);
    expect(parse('123456789012345678901234567890')).toBe(Number('123456789012345678901234567890'));
    expect(parse('1.')).toBe(1);
    expect(parse('.5')).toBe(0.5);
  });

  it('parseDecimal returns NaN for text Number() accepts but a data file must not hold', () => {
    for (const t of ['', ' 1', '1 ', '0x10', 'Infinity', '-Infinity', 'NaN', '1_000', '1,000', '.', '-', 'e5', '1e', '1e+', '1.2.3', '0b1'])
      expect(parse(t), t).toBeNaN();
    expect(parse('1.5', true)).toBeNaN(); // with decimal comma a point is not a separator
  });

  it('parseDecimal returns ±Infinity on overflow exactly like Number()', () => {
    expect(parse('1e400')).toBe(Infinity);
    expect(parse('-1e400')).toBe(-Infinity);
    expect(Object.is(parse('-1e-400'), -0)).toBe(true);
  });

  it('parseDecimalText(text, decimalComma) agrees with parseDecimal on generated texts', () => {
    checkProperty(
      'text form',
      fc.property(decimalText, fc.boolean(), (t, comma) => {
        const u = comma ? t.replace('.', ',') : t;
        return same(parseDecimalText(u, comma), parse(u, comma));
      }),
      { numRuns: 2000 },
    );
    expect(parseDecimalText(' 2.5\t', false)).toBe(2.5);
    expect(parseDecimalText('0x1A', false)).toBeNaN();
  });
});
