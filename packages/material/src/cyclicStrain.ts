import { ArgumentError } from './ArgumentError';
import { assertMaterial } from './assertMaterial';
import type { Material } from './Material';

/**
 * Strain on the cyclic stress-strain curve (Ramberg-Osgood form) for a stress:
 *
 *     ε = σ/E + sign(σ)·(|σ|/K')^(1/n')
 *
 * Sign-aware (odd in σ), exact at 0 (and -0 gives -0). Units: stress in the material's unit,
 * strain dimensionless. Finite input never gives NaN; a stress so large that the plastic term
 * overflows gives ±Infinity.
 *
 * Reference: W. Ramberg and W. R. Osgood, "Description of stress-strain curves by three
 * parameters", NACA Technical Note 902, 1943; cyclic form with K', n' as in N. E. Dowling,
 * Mechanical Behavior of Materials, Pearson, section 12.3.
 *
 * @throws {ArgumentError} when `stress` is NaN or ±Infinity.
 * @example
 * cyclicStrain(defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 }), 500)
 * // returns 0.0025 + 0.5 ** 5 = 0.033750000000000002
 */
export function cyclicStrain(material: Material, stress: number): number {
  assertMaterial(material);
  if (!Number.isFinite(stress)) throw new ArgumentError('stress', stress, 'must be a finite number');
  if (stress === 0) return stress / material.E;
  const plastic = Math.pow(Math.abs(stress) / material.K, 1 / material.n);
  return stress / material.E + (stress > 0 ? plastic : -plastic);
}
