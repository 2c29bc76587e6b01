import { assertMaterial, cyclicStress, masingStressRange, type Material } from '@loopwise/material';
import type { LocalRangeResponse, LocalResponse } from './LocalResponse';
import { LOCAL_STRAIN_OVERFLOWS } from './neuber';
import { NotchOptionError } from './NotchOptionError';
import { checkFinite } from './resolveSolveOptions';

/**
 * The linear rule (strain concentration equals Kt): the local strain equals the pseudo-elastic
 * strain, ε = Kt·S/E, and the local stress is read off the cyclic curve,
 * σ = σ(ε) with ε = σ/E + (σ/K')^(1/n'). It gives the least local strain of the three rules
 * and suits notches with a large elastic constraint (plane strain, small plastic zones).
 *
 * Method: the cyclic-curve inverse of @loopwise/material (`cyclicStress`). Sign-aware, exact at 0.
 *
 * Reference: the strain-concentration (linear) rule as discussed in N. E. Dowling, Mechanical
 * Behavior of Materials, Pearson, section 14.5 (section number value from memory).
 *
 * @param material a valid material
 * @param pseudoStress pseudo-elastic local stress Kt·S (finite)
 * @throws {NotchOptionError} when `pseudoStress` is not finite or Kt·S/E overflows a double.
 * @example
 * linearRule(material, 600).strain
 * // returns 600 / material.E
 */
export function linearRule(material: Material, pseudoStress: number): LocalResponse {
  assertMaterial(material);
  checkFinite('pseudoStress', pseudoStress);
  const strain = pseudoStress / material.E;
  if (!(strain - strain === 0)) throw new NotchOptionError('pseudoStress', pseudoStress, LOCAL_STRAIN_OVERFLOWS);
  return { stress: cyclicStress(material, strain), strain };
}

/**
 * The linear rule on a Masing branch: Δε = Kt·ΔS/E and Δσ from the Masing curve
 * Δε = Δσ/E + 2(Δσ/2K')^(1/n') (`masingStressRange` of @loopwise/material). Signed like the input.
 *
 * @param material a valid material
 * @param pseudoRange pseudo-elastic local stress range Kt·ΔS (finite)
 * @example
 * linearRuleRange(material, 1200).strainRange
 * // returns 1200 / material.E
 */
export function linearRuleRange(material: Material, pseudoRange: number): LocalRangeResponse {
  assertMaterial(material);
  checkFinite('pseudoRange', pseudoRange);
  const strainRange = pseudoRange / material.E;
  if (!(strainRange - strainRange === 0)) throw new NotchOptionError('pseudoRange', pseudoRange, LOCAL_STRAIN_OVERFLOWS);
  return { stressRange: masingStressRange(material, strainRange), strainRange };
}
