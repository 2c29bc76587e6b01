import { describe, expect, it } from 'vitest';
import { defineMaterial, handbookSteels, transitionReversals } from '@loopwise/material';

describe('transitionReversals(material)', () => {
  it('transitionReversals(m) returns (epsilonF E / sigmaF)^(1/(b - c)) where both terms are equal', () => {
    // Invented values for tests only.
    const m = defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 });
    const x = transitionReversals(m);
    expect(x / 200 ** 2.5 - 1).toBeLessThan(1e-14);
    expect((m.sigmaF / m.E) * x ** m.b).toBeCloseTo(m.epsilonF * x ** m.c, 15);
  });
  it('parallel terms (b = c) give Infinity or 1, never NaN', () => {
    expect(transitionReversals(defineMaterial({ E: 2e5, sigmaF: 1000, b: -0.3, epsilonF: 1, c: -0.3, K: 1000, n: 0.2 }))).toBe(Infinity);
    expect(transitionReversals(defineMaterial({ E: 2e5, sigmaF: 1000, b: -0.3, epsilonF: 0.001, c: -0.3, K: 1000, n: 0.2 }))).toBe(1);
  });
  it('is between 10^3 and 10^6 reversals for the six handbook steels', () => {
    // Range: common practice, no source (steels of medium strength have transition lives of
    // roughly 10^3 to 10^6 reversals).
    for (const s of handbookSteels) {
      expect(transitionReversals(s)).toBeGreaterThan(1e2);
      expect(transitionReversals(s)).toBeLessThan(1e6);
    }
  });
});
