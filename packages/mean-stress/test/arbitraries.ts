import fc from 'fast-check';
import { compatibleCyclicCurve, defineMaterial, type Material } from '@loopwise/material';

// Realistic ranges for metals (MPa, dimensionless): common practice, no source.
export const range = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

const fatigueConstants = fc.record({
  E: range(50_000, 220_000),
  sigmaF: range(300, 3000),
  b: range(-0.15, -0.04),
  epsilonF: range(0.05, 3),
  c: range(-0.9, -0.35),
});

/** Generated realistic materials with K', n' independent of the fatigue constants. */
export const realisticMaterial: fc.Arbitrary<Material> = fc
  .tuple(fatigueConstants, range(300, 3000), range(0.05, 0.3))
  .map(([f, K, n]) => defineMaterial({ ...f, K, n }));

/** Generated realistic materials whose cyclic curve is compatible: n' = b/c, K' = σf'/εf'^n'. */
export const compatibleMaterial: fc.Arbitrary<Material> = fatigueConstants.map((f) =>
  defineMaterial({ ...f, ...compatibleCyclicCurve(f) }),
);

/** Log10 of a life in reversals. */
export const log10Reversals = range(0.5, 11);

/** A loop from amplitude, mean strain, σmax and a positive stress range. */
export function loopOf(ea: number, stressMax: number, stressRange: number, meanStrain = 0) {
  return { stressMax, stressMin: stressMax - stressRange, strainMax: meanStrain + ea, strainMin: meanStrain - ea };
}

/** Relative difference; 0 for equal values (including equal infinities). */
export const rel = (a: number, b: number) => (a === b ? 0 : Math.abs(a / b - 1));
