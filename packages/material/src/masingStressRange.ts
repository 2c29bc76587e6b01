import { cyclicStress } from './cyclicStress';
import { ArgumentError } from './ArgumentError';
import type { Material } from './Material';

/**
 * Stress range of a Masing branch for a strain range from the branch's origin: the inverse of
 * {@link masingStrainRange}, Δσ = 2·σ(Δε/2) with σ(ε) the cyclic curve inverse
 * ({@link cyclicStress}). Sign-aware, exact at 0, bracketed monotone Newton solve, no NaN.
 *
 * Reference: Masing's hypothesis as in {@link masingStrainRange}.
 *
 * @throws {ArgumentError} when `strainRange` is NaN or ±Infinity.
 * @example
 * masingStressRange(defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 }), 0.0675)
 * // returns 1000 (to 1e-14 relative)
 */
export function masingStressRange(material: Material, strainRange: number): number {
  if (!Number.isFinite(strainRange)) throw new ArgumentError('strainRange', strainRange, 'must be a finite number');
  return 2 * cyclicStress(material, strainRange / 2);
}
