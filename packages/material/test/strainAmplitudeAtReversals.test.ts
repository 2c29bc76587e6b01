import { describe, expect, it } from 'vitest';
import { ArgumentError, defineMaterial, strainAmplitudeAtReversals } from '@loopwise/material';

// Invented values for tests only.
const m = defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 });

describe('strainAmplitudeAtReversals(material, reversals)', () => {
  it('strainAmplitudeAtReversals(m, 1e4) returns sigmaF/E (2Nf)^b + epsilonF (2Nf)^c', () => {
    expect(strainAmplitudeAtReversals(m, 1e4)).toBeCloseTo(0.005 * 1e4 ** -0.1 + 1e4 ** -0.5, 15);
  });
  it('strainAmplitudeAtReversals(m, 1) returns sigmaF/E + epsilonF, and Infinity gives 0', () => {
    expect(strainAmplitudeAtReversals(m, 1)).toBe(1.005);
    expect(strainAmplitudeAtReversals(m, Infinity)).toBe(0);
  });
  it.each([NaN, 0.999, 0, -5, -Infinity])('strainAmplitudeAtReversals(m, %s) throws ArgumentError', (r) => {
    expect(() => strainAmplitudeAtReversals(m, r)).toThrow(ArgumentError);
  });
});
