import { assertMaterial } from './assertMaterial';
import type { Material } from './Material';

/**
 * Transition life in reversals 2Nt: where the elastic and plastic terms of the strain-life
 * curve are equal, σf'/E·(2Nt)^b = εf'·(2Nt)^c, so
 *
 *     2Nt = (εf'·E / σf')^(1/(b − c))
 *
 * Below it plastic strain dominates (low-cycle fatigue), above it elastic strain. The result is
 * reversals; cycles are half. It can be below 1 for very strong metals (the curve is then
 * elastic-dominated at every life). When b = c the terms are parallel and never cross: the
 * result is Infinity if the elastic term is the smaller, otherwise 1 (documented, not NaN).
 *
 * Reference: N. E. Dowling, Mechanical Behavior of Materials, Pearson, section 14.3 (transition
 * fatigue life).
 *
 * @example
 * transitionReversals(defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 }))
 * // returns 200 ** 2.5 = 565685.42...
 */
export function transitionReversals(material: Material): number {
  assertMaterial(material);
  const ratio = (material.epsilonF * material.E) / material.sigmaF;
  if (material.b === material.c) return ratio > 1 ? Infinity : 1;
  return Math.pow(ratio, 1 / (material.b - material.c));
}
