import fc from 'fast-check';
import { defineMaterial, type Material } from '@loopwise/material';

// Realistic ranges for metals (MPa, dimensionless), spanning aluminium, titanium and steels:
// common practice, no source (they bracket the rows of the handbook table and the estimates).
const range = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

/** Generated realistic strain-life materials; K', n' independent of the fatigue constants. */
export const realisticMaterial: fc.Arbitrary<Material> = fc
  .record({
    E: range(50_000, 220_000),
    sigmaF: range(300, 3000),
    b: range(-0.15, -0.04),
    epsilonF: range(0.05, 3),
    c: range(-0.9, -0.35),
    K: range(300, 3000),
    n: range(0.05, 0.3),
  })
  .map((m) => defineMaterial(m));

/** Log10 of a life in reversals, 10^0.1 to 10^12. */
export const log10Reversals = range(0.1, 12);
