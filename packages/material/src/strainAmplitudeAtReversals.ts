import { ArgumentError } from './ArgumentError';
import { assertMaterial } from './assertMaterial';
import type { Material } from './Material';

/**
 * Strain amplitude on the strain-life curve at a life given in reversals 2Nf (Coffin-Manson-
 * Basquin, fully reversed):
 *
 *     εa = σf'/E·(2Nf)^b + εf'·(2Nf)^c
 *
 * `reversals` is 2Nf, twice the cycles. It must be at least 1 (one reversal, the first half
 * cycle); `Infinity` gives 0.
 *
 * Reference: O. H. Basquin, "The exponential law of endurance tests", Proceedings ASTM 10
 * (1910) 625-630; L. F. Coffin, "A study of the effects of cyclic thermal stresses on a ductile
 * metal", Transactions ASME 76 (1954) 931-950; S. S. Manson, "Behavior of materials under
 * conditions of thermal stress", NACA Technical Note 2933, 1953; the form with 2Nf as in
 * ASTM E606/E606M, appendix X1.
 *
 * @throws {ArgumentError} when `reversals` is NaN or below 1.
 * @example
 * strainAmplitudeAtReversals(defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 }), 1e4)
 * // returns 0.005 * 1e4 ** -0.1 + 1e4 ** -0.5 = 0.0131548...
 */
export function strainAmplitudeAtReversals(material: Material, reversals: number): number {
  assertMaterial(material);
  if (!(reversals >= 1)) throw new ArgumentError('reversals', reversals, 'must be a number >= 1 (reversals 2Nf)');
  return (material.sigmaF / material.E) * Math.pow(reversals, material.b) + material.epsilonF * Math.pow(reversals, material.c);
}
