import { assertMaterial, type Material } from '@loopwise/material';
import type { LocalRangeResponse, LocalResponse, NotchSolveOptions } from './LocalResponse';
import { NotchOptionError } from './NotchOptionError';
import { checkFinite, resolveSolveOptions } from './resolveSolveOptions';
import { solveEnergyEquation } from './solveEnergyEquation';

/**
 * Neuber's rule on the first-loading (cyclic) curve: the local stress σ and strain ε at a notch
 * root whose pseudo-elastic (linear-elastic) local stress is `pseudoStress` = Kt·S satisfy
 *
 *     σ·ε = (Kt·S)²/E,    ε = σ/E + sign(σ)·(|σ|/K')^(1/n')
 *
 * Method: with s = ln|σ| the equation is ln(σ²/E + σ^(1+1/n')·K'^(−1/n')) = ln((Kt·S)²/E), a
 * convex increasing function of s; Newton from the smaller single-term solution converges
 * monotonically (bracketed, no NaN) and stops on an error bound below `tolerance`. When the
 * plastic strain at σ = Kt·S is below half an ulp of the elastic strain, the result is exactly
 * σ = Kt·S, ε = Kt·S/E. Sign-aware (odd), exact at 0 (-0 gives -0).
 *
 * Units: stress in the material's unit, strain dimensionless.
 *
 * Reference: H. Neuber, "Theory of stress concentration for shear-strained prismatical bodies
 * with arbitrary nonlinear stress-strain law", Journal of Applied Mechanics 28(4), 1961,
 * 544-550, doi:10.1115/1.3641780; cyclic form after T. H. Topper, R. M. Wetzel and J. Morrow,
 * "Neuber's rule applied to fatigue of notched specimens", Journal of Materials 4(1), 1969,
 * 200-209.
 *
 * @param material a valid material (see `defineMaterial`)
 * @param pseudoStress pseudo-elastic local stress Kt·S (finite)
 * @throws {NotchOptionError} when `pseudoStress` is not finite, so large that the local strain
 * overflows a double, or an option is bad.
 * @throws {ConvergenceError} when `maxIterations` is reached (only with a cap set far too low).
 * @example
 * const r = neuber(material, 600);
 * r.stress * r.strain * material.E
 * // returns 360000 (= 600², to 1e-14 relative)
 */
export function neuber(material: Material, pseudoStress: number, options?: NotchSolveOptions): LocalResponse {
  assertMaterial(material);
  checkFinite('pseudoStress', pseudoStress);
  const { tolerance, maxIterations } = resolveSolveOptions(options);
  return energyRule(material, pseudoStress, 1, tolerance, maxIterations, 'neuber');
}

/**
 * Neuber's rule on a Masing branch: the local ranges from the branch origin satisfy
 *
 *     Δσ·Δε = (Kt·ΔS)²/E,    Δε = Δσ/E + 2·sign(Δσ)·(|Δσ|/(2K'))^(1/n')
 *
 * which by Masing's hypothesis is twice the first-loading solution at half the range:
 * Δσ = 2σ(Kt·ΔS/2), Δε = 2ε(Kt·ΔS/2). Signed like the input range.
 *
 * Reference: as {@link neuber}; range form after Topper, Wetzel and Morrow (1969).
 *
 * @param material a valid material
 * @param pseudoRange pseudo-elastic local stress range Kt·ΔS from the branch origin (finite)
 * @example
 * neuberRange(material, 1200).stressRange === 2 * neuber(material, 600).stress
 * // returns true
 */
export function neuberRange(material: Material, pseudoRange: number, options?: NotchSolveOptions): LocalRangeResponse {
  assertMaterial(material);
  checkFinite('pseudoRange', pseudoRange);
  const { tolerance, maxIterations } = resolveSolveOptions(options);
  const r = energyRule(material, pseudoRange / 2, 1, tolerance, maxIterations, 'neuberRange', 'pseudoRange');
  return rangeOf(r, pseudoRange);
}

/**
 * Shared solve of the energy-type rules (internal): weight w = 1 is Neuber
 * (σ² /E + σεp = a²/E), w = 2/(1 + n') is Glinka (σ²/E + 2σεp/(1 + n') = a²/E).
 */
export function energyRule(
  material: Material,
  pseudo: number,
  weight: number,
  tolerance: number,
  maxIterations: number,
  solver: string,
  field = 'pseudoStress',
): LocalResponse {
  const E = material.E;
  if (pseudo === 0) return { stress: pseudo, strain: pseudo / E };
  const a = Math.abs(pseudo);
  const m = 1 / material.n;
  const lnK = Math.log(material.K);
  const lnA = Math.log(a);
  const lnE = Math.log(E);
  // Elastic limit: the plastic term at σ = a below half an ulp of the elastic one.
  const ratio = Math.exp(Math.log(weight) + lnE + m * (lnA - lnK) - lnA);
  let stress: number;
  let strain: number;
  if (ratio < 1.1e-16) {
    stress = a;
    strain = a / E;
  } else {
    const s = solveEnergyEquation(2, -lnE, 1 + m, Math.log(weight) - m * lnK, 2 * lnA - lnE, tolerance, maxIterations, solver);
    stress = Math.exp(s);
    strain = stress / E + Math.exp(m * (s - lnK));
  }
  if (!(strain < Infinity)) throw new NotchOptionError(field, pseudo, LOCAL_STRAIN_OVERFLOWS);
  return pseudo > 0 ? { stress, strain } : { stress: -stress, strain: -strain };
}

/** The rule a pseudo-elastic input breaks when its local strain overflows a double. */
export const LOCAL_STRAIN_OVERFLOWS = 'must be small enough that the local strain stays finite (it overflows a double here)';

/** Twice a first-loading response (a Masing range); a strain range that overflows is an input error. */
export function rangeOf(r: LocalResponse, pseudoRange: number): LocalRangeResponse {
  const strainRange = 2 * r.strain;
  if (!(strainRange - strainRange === 0)) throw new NotchOptionError('pseudoRange', pseudoRange, LOCAL_STRAIN_OVERFLOWS);
  return { stressRange: 2 * r.stress, strainRange };
}
