import { cyclicStrain } from './cyclicStrain';
import { ArgumentError } from './ArgumentError';
import type { Material } from './Material';

/**
 * Strain range of a Masing branch for a stress range measured from the branch's origin
 * (the last reversal point):
 *
 *     Δε = Δσ/E + 2·sign(Δσ)·(|Δσ|/(2K'))^(1/n')
 *
 * i.e. the cyclic curve scaled by two (Masing's hypothesis). Sign-aware: a negative range is an
 * unloading branch and gives a negative strain range. Exact at 0; finite input never gives NaN.
 *
 * Reference: G. Masing, "Eigenspannungen und Verfestigung beim Messing", Proceedings of the 2nd
 * International Congress of Applied Mechanics, Zürich, 1926, pp. 332-335; cyclic form as in
 * N. E. Dowling, Mechanical Behavior of Materials, Pearson, section 12.4.
 *
 * @throws {ArgumentError} when `stressRange` is NaN or ±Infinity.
 * @example
 * masingStrainRange(defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 }), 1000)
 * // returns 2 * cyclicStrain(material, 500) = 0.0675
 */
export function masingStrainRange(material: Material, stressRange: number): number {
  if (!Number.isFinite(stressRange)) throw new ArgumentError('stressRange', stressRange, 'must be a finite number');
  return 2 * cyclicStrain(material, stressRange / 2);
}
