import { describe, expect, it } from 'vitest';
import { ArgumentError, cyclicStrain, defineMaterial, masingStrainRange } from '@loopwise/material';

// Invented values for tests only.
const m = defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 });

describe('masingStrainRange(material, stressRange)', () => {
  it('masingStrainRange(m, 1000) returns 1000/E + 2 (1000/2K)^(1/n) = 2 cyclicStrain(m, 500)', () => {
    expect(masingStrainRange(m, 1000)).toBeCloseTo(1000 / 200000 + 2 * 0.5 ** 5, 15);
    expect(masingStrainRange(m, 1000)).toBe(2 * cyclicStrain(m, 500));
  });
  it('masingStrainRange is sign-aware and exact at 0', () => {
    expect(masingStrainRange(m, -1000)).toBe(-masingStrainRange(m, 1000));
    expect(masingStrainRange(m, 0)).toBe(0);
  });
  it.each([NaN, Infinity])('masingStrainRange(m, %s) throws ArgumentError naming stressRange', (x) => {
    expect(() => masingStrainRange(m, x)).toThrow(/stressRange/);
    expect(() => masingStrainRange(m, x)).toThrow(ArgumentError);
  });
});
