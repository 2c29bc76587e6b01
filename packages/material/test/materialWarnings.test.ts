import { describe, expect, it } from 'vitest';
import { COMPATIBILITY_TOLERANCE, materialWarnings } from '@loopwise/material';

// Invented values for tests only: K' = sigmaF/epsilonF^n' and n' = b/c hold exactly.
const compatible = { E: 2e5, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 };

describe('materialWarnings(material)', () => {
  it('materialWarnings(compatible) returns []', () => {
    expect(materialWarnings(compatible)).toEqual([]);
  });
  it('materialWarnings(n far from b/c) warns on n with the expected value', () => {
    const [w] = materialWarnings({ ...compatible, n: 0.3, K: 1000 });
    expect(w).toMatchObject({ code: 'incompatible-cyclic-curve', field: 'n', value: 0.3 });
    expect(w.expected).toBeCloseTo(0.2, 15);
    expect(w.message).toMatch(/SWT and Walker/);
  });
  it(`materialWarnings(K off by more than ${COMPATIBILITY_TOLERANCE * 100} %) warns on K only`, () => {
    expect(materialWarnings({ ...compatible, K: 1150 }).map((w) => w.field)).toEqual(['K']);
    expect(materialWarnings({ ...compatible, K: 1090 })).toEqual([]);
  });
});
