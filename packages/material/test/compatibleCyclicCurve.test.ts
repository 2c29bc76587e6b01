import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ArgumentError, compatibleCyclicCurve, cyclicStress, defineMaterial, strainAmplitudeAtReversals } from '@loopwise/material';
import { checkProperty } from '../../../test/property';

describe('compatibleCyclicCurve({ sigmaF, b, epsilonF, c })', () => {
  it('compatibleCyclicCurve({ sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5 }) returns { K: 1000, n: 0.2 }', () => {
    const r = compatibleCyclicCurve({ sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5 });
    expect(r.K).toBe(1000);
    expect(r.n).toBeCloseTo(0.2, 15);
  });

  it('the compatible cyclic curve passes through sigmaF (2Nf)^b at every strain-life amplitude', () => {
    const r = (min: number, max: number) => fc.double({ min, max, noNaN: true });
    checkProperty(
      'compatible curve matches the strain-life stress amplitude',
      fc.property(r(300, 3000), r(-0.15, -0.04), r(0.05, 3), r(-0.9, -0.35), r(0, 9), (sigmaF, b, epsilonF, c, lg) => {
        const { K, n } = compatibleCyclicCurve({ sigmaF, b, epsilonF, c });
        const m = defineMaterial({ E: 200000, sigmaF, b, epsilonF, c, K, n });
        const reversals = 10 ** lg;
        const sigmaA = cyclicStress(m, strainAmplitudeAtReversals(m, reversals));
        expect(sigmaA / (sigmaF * reversals ** b) - 1).toBeLessThan(1e-11);
        expect(sigmaA / (sigmaF * reversals ** b) - 1).toBeGreaterThan(-1e-11);
      }),
      { numRuns: 300 },
    );
  });

  it('compatibleCyclicCurve(bad constants) throws ArgumentError', () => {
    expect(() => compatibleCyclicCurve({ sigmaF: NaN, b: -0.1, epsilonF: 1, c: -0.5 })).toThrow(ArgumentError);
    expect(() => compatibleCyclicCurve({ sigmaF: 1000, b: 0, epsilonF: 1, c: -0.5 })).toThrow(/b = 0/);
    expect(() => compatibleCyclicCurve({ sigmaF: 1000, b: -0.1, epsilonF: 1, c: 0 })).toThrow(/c = 0/);
  });
});
