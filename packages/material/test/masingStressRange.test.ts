import { describe, expect, it } from 'vitest';
import { ArgumentError, defineMaterial, masingStrainRange, masingStressRange } from '@loopwise/material';

// Invented values for tests only.
const m = defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 });

describe('masingStressRange(material, strainRange)', () => {
  it('masingStressRange(m, 0.0675) returns 1000', () => {
    expect(Math.abs(masingStressRange(m, 0.0675) / 1000 - 1)).toBeLessThan(1e-14);
  });
  it('masingStressRange(m, masingStrainRange(m, x)) returns x for ranges of both signs', () => {
    for (const x of [-2500, -300, -1, 1e-3, 10, 640, 1800]) {
      expect(Math.abs(masingStressRange(m, masingStrainRange(m, x)) / x - 1)).toBeLessThan(1e-13);
    }
    expect(masingStressRange(m, 0)).toBe(0);
  });
  it.each([NaN, -Infinity])('masingStressRange(m, %s) throws ArgumentError naming strainRange', (x) => {
    expect(() => masingStressRange(m, x)).toThrow(/strainRange/);
    expect(() => masingStressRange(m, x)).toThrow(ArgumentError);
  });
});
