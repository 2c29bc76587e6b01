import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ArgumentError, cyclicStrain, defineMaterial } from '@loopwise/material';
import { checkProperty } from '../../../test/property';
import { realisticMaterial } from './arbitraries';

// Invented values for tests only.
const m = defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 });

describe('cyclicStrain(material, stress)', () => {
  it('cyclicStrain(m, 500) returns sigma/E + (sigma/K)^(1/n)', () => {
    expect(cyclicStrain(m, 500)).toBeCloseTo(500 / 200000 + 0.5 ** 5, 15);
  });
  it('cyclicStrain(m, 0) is exactly 0 and cyclicStrain(m, -0) is -0', () => {
    expect(Object.is(cyclicStrain(m, 0), 0)).toBe(true);
    expect(Object.is(cyclicStrain(m, -0), -0)).toBe(true);
  });
  it('cyclicStrain(m, -s) === -cyclicStrain(m, s) and it is increasing', () => {
    checkProperty(
      'odd and increasing',
      fc.property(realisticMaterial, fc.double({ min: 1e-6, max: 5000, noNaN: true }), (mat, s) => {
        expect(cyclicStrain(mat, -s)).toBe(-cyclicStrain(mat, s));
        expect(cyclicStrain(mat, s * 1.001)).toBeGreaterThan(cyclicStrain(mat, s));
      }),
      { numRuns: 200 },
    );
  });
  it('cyclicStrain(m, huge finite) is ±Infinity, never NaN', () => {
    expect(cyclicStrain(m, 1e300)).toBe(Infinity);
    expect(cyclicStrain(m, -1e300)).toBe(-Infinity);
  });
  it.each([NaN, Infinity, -Infinity])('cyclicStrain(m, %s) throws ArgumentError', (s) => {
    expect(() => cyclicStrain(m, s)).toThrow(ArgumentError);
  });
});
