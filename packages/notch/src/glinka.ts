import { assertMaterial, type Material } from '@loopwise/material';
import type { LocalRangeResponse, LocalResponse, NotchSolveOptions } from './LocalResponse';
import { energyRule, rangeOf } from './neuber';
import { checkFinite, resolveSolveOptions } from './resolveSolveOptions';

/**
 * Glinka's equivalent strain energy density rule on the first-loading (cyclic) curve: the strain
 * energy density at the notch root equals that of the linear-elastic solution,
 *
 *     σ²/(2E) + σ·εp/(1 + n') = (Kt·S)²/(2E),    εp = (|σ|/K')^(1/n')
 *
 * where the left side is ∫σ dε along ε = σ/E + (σ/K')^(1/n'). It gives less local strain than
 * Neuber's rule. Method as {@link neuber} (log-space Newton, bracketed, monotone, no NaN);
 * elastic limit exact; sign-aware, exact at 0.
 *
 * Reference: K. Molski and G. Glinka, "A method of elastic-plastic stress and strain calculation
 * at a notch root", Materials Science and Engineering 50(1), 1981, 93-100,
 * doi:10.1016/0025-5416(81)90089-6; G. Glinka, "Energy density approach to calculation of
 * inelastic strain-stress near notches and cracks", Engineering Fracture Mechanics 22(3), 1985,
 * 485-508, doi:10.1016/0013-7944(85)90148-1.
 *
 * @param material a valid material
 * @param pseudoStress pseudo-elastic local stress Kt·S (finite)
 * @example
 * const r = glinka(material, 600);
 * r.stress ** 2 / (2 * material.E) + r.stress * (r.strain - r.stress / material.E) / (1 + material.n)
 * // returns 600² / (2E) (to 1e-14 relative)
 */
export function glinka(material: Material, pseudoStress: number, options?: NotchSolveOptions): LocalResponse {
  assertMaterial(material);
  checkFinite('pseudoStress', pseudoStress);
  const { tolerance, maxIterations } = resolveSolveOptions(options);
  return energyRule(material, pseudoStress, 2 / (1 + material.n), tolerance, maxIterations, 'glinka');
}

/**
 * Glinka's rule on a Masing branch: the strain energy density of the range,
 *
 *     Δσ²/(2E) + Δσ·Δεp/(1 + n') = (Kt·ΔS)²/(2E),    Δεp = 2(|Δσ|/(2K'))^(1/n')
 *
 * (∫Δσ dΔε along the Masing curve Δε = Δσ/E + 2(Δσ/2K')^(1/n')), which is twice the first-loading
 * solution at half the range: Δσ = 2σ(Kt·ΔS/2), Δε = 2ε(Kt·ΔS/2). Signed like the input range.
 *
 * Reference: as {@link glinka}; range form as in Glinka (1985).
 *
 * @param material a valid material
 * @param pseudoRange pseudo-elastic local stress range Kt·ΔS (finite)
 * @example
 * glinkaRange(material, 1200).strainRange === 2 * glinka(material, 600).strain
 * // returns true
 */
export function glinkaRange(material: Material, pseudoRange: number, options?: NotchSolveOptions): LocalRangeResponse {
  assertMaterial(material);
  checkFinite('pseudoRange', pseudoRange);
  const { tolerance, maxIterations } = resolveSolveOptions(options);
  const r = energyRule(material, pseudoRange / 2, 2 / (1 + material.n), tolerance, maxIterations, 'glinkaRange', 'pseudoRange');
  return rangeOf(r, pseudoRange);
}
