import { MeanStressError } from './MeanStressError';

/** Input of {@link estimateWalkerGamma}. Su in MPa: the relation is an empirical fit. */
export interface WalkerGammaInput {
  /** Ultimate tensile strength Su in MPa (used for `metal: 'steel'`). */
  SuMPa?: number;
  /**
   * `'steel'` (default): γ = 0.8818 − 0.000200·Su. `'aluminium-2xxx-7xxx'` (precipitation-
   * hardened 2000 and 7000 series): γ = 0.5. `'other'`: γ = 0.5, the suggested default.
   */
  metal?: 'steel' | 'aluminium-2xxx-7xxx' | 'other';
}

/** Full citation of the γ estimates. */
export const WALKER_GAMMA_SOURCE =
  'N. E. Dowling, "Mean stress effects in strain-life fatigue", Fatigue and Fracture of Engineering Materials and Structures 32 (2009) 1004-1019, doi:10.1111/j.1460-2695.2009.01404.x; steel relation first given in N. E. Dowling, C. A. Calhoun and A. Arcari, "Mean stress effects in stress-life fatigue and the Walker equation", same journal 32 (2009) 163-179, doi:10.1111/j.1460-2695.2008.01322.x';

/**
 * Estimates the Walker exponent γ when no mean-stress test data are available to fit it.
 *
 * Steels (a linear fit of γ against the ultimate tensile strength in MPa):
 *
 *     γ = 0.8818 − 0.000200·Su        (Su in MPa)
 *
 * Precipitation-hardened aluminium alloys of the 2000 and 7000 series: γ = 0.5 (the Walker
 * parameter then equals SWT). Other metals: γ = 0.5 as the suggested default. A lower γ means a
 * greater sensitivity to mean stress; γ decreases with strength.
 *
 * Reference: {@link WALKER_GAMMA_SOURCE}. The γ = 0.5 recommendations are stated in the 2009
 * strain-life paper's abstract; the steel coefficients 0.8818 and 0.000200 are value from
 * memory. The fit carries scatter: fitted γ of individual steels lie visibly off the line.
 *
 * @throws {MeanStressError} `invalid-gamma` when Su is missing or not finite and > 0 for steel,
 *   or the steel line gives γ ≤ 0 (Su ≥ 4409 MPa, far outside the data).
 * @example
 * estimateWalkerGamma({ SuMPa: 1000, metal: 'steel' })
 * // returns 0.6818
 */
export function estimateWalkerGamma(input: WalkerGammaInput): number {
  const metal = input.metal ?? 'steel';
  if (metal === 'aluminium-2xxx-7xxx' || metal === 'other') return 0.5;
  if (metal !== 'steel') {
    throw new MeanStressError('invalid-gamma', 'metal', metal, "must be 'steel', 'aluminium-2xxx-7xxx' or 'other'");
  }
  const su = input.SuMPa;
  if (typeof su !== 'number' || !(su > 0 && su < Infinity)) {
    throw new MeanStressError('invalid-gamma', 'SuMPa', su, 'must be a finite number > 0 (MPa) to estimate gamma for steel');
  }
  const gamma = 0.8818 - 0.0002 * su;
  if (!(gamma > 0)) {
    throw new MeanStressError('invalid-gamma', 'SuMPa', su, 'gives gamma <= 0 on the steel line (far outside its data)');
  }
  return gamma;
}
