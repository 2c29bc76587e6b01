import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ArgumentError, cyclicStrain, cyclicStress, defineMaterial, MaterialError, type Material } from '@loopwise/material';
import { checkProperty } from '../../../test/property';
import { realisticMaterial } from './arbitraries';

// Invented values for tests only.
const m = defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 });

describe('cyclicStress(material, strain)', () => {
  it('cyclicStress(m, 0.03375) returns 500', () => {
    expect(cyclicStress(m, 0.03375) / 500 - 1).toBeLessThan(1e-14);
  });
  it('cyclicStress(m, cyclicStrain(m, s)) returns s to 1e-12 over generated materials and stresses', () => {
    checkProperty(
      'stress round trip',
      fc.property(realisticMaterial, fc.double({ min: -6, max: 3.5, noNaN: true }), fc.boolean(), (mat, lg, negative) => {
        const s = (negative ? -1 : 1) * 10 ** lg;
        const back = cyclicStress(mat, cyclicStrain(mat, s));
        expect(Math.abs(back / s - 1)).toBeLessThan(1e-12);
      }),
      { numRuns: 500 },
    );
  });
  it('cyclicStress is exact at 0 (and -0), odd, and never NaN for tiny or huge strains', () => {
    expect(Object.is(cyclicStress(m, 0), 0)).toBe(true);
    expect(Object.is(cyclicStress(m, -0), -0)).toBe(true);
    expect(cyclicStress(m, -0.01)).toBe(-cyclicStress(m, 0.01));
    expect(cyclicStress(m, 5e-324)).toBeGreaterThan(0);
    expect(Number.isFinite(cyclicStress(m, 1e300))).toBe(true);
  });
  it.each([NaN, Infinity, -Infinity])('cyclicStress(m, %s) throws ArgumentError', (e) => {
    expect(() => cyclicStress(m, e)).toThrow(ArgumentError);
  });
  it('cyclicStress(invalid material, strain) throws MaterialError', () => {
    expect(() => cyclicStress({ ...m, n: 1.5 } as Material, 0.01)).toThrow(MaterialError);
  });
});
