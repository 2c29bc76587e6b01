import { ArgumentError } from './ArgumentError';
import { compatibleCyclicCurve } from './compatibleCyclicCurve';
import { defineMaterial } from './defineMaterial';
import type { Material } from './Material';

/** Input of {@link estimateModifiedUniversalSlopes}. Stresses in MPa. */
export interface ModifiedUniversalSlopesInput {
  /** Ultimate tensile strength Su in MPa. */
  SuMPa: number;
  /** Young's modulus E in MPa. */
  EMPa: number;
  /** Reduction of area at fracture in the tensile test, as a fraction: 0 < RA < 1 (0.5 for 50 %). */
  reductionOfArea: number;
  /** Name for the material; default `"Modified universal slopes estimate (Su = … MPa)"`. */
  name?: string;
}

/** Full citation of the modified universal slopes equation. */
export const MODIFIED_UNIVERSAL_SLOPES_SOURCE =
  'U. Muralidharan and S. S. Manson, "A modified universal slopes equation for estimation of fatigue characteristics of metals", Journal of Engineering Materials and Technology (ASME) 110 (1988) 55-58, doi:10.1115/1.3226010';

/**
 * Estimates a full strain-life material from tensile data by the modified universal slopes
 * equation of Muralidharan and Manson. Published in strain range and cycles:
 *
 *     Δε = 1.17·(Su/E)^0.832·Nf^−0.09 + 0.0266·D^0.155·(Su/E)^−0.53·Nf^−0.56
 *     D = ln(1 / (1 − RA))   (true fracture ductility)
 *
 * In amplitude and reversals (εa = Δε/2, Nf = 2Nf/2) this is the form used here, with the
 * coefficients rounded to three digits as they are usually quoted:
 *
 *     σf' = 0.623·E·(Su/E)^0.832,               b = −0.09
 *     εf' = 0.0196·D^0.155·(Su/E)^−0.53,        c = −0.56
 *
 * (exact conversion: 0.623 ≈ (1.17/2)·2^0.09 = 0.6227, 0.0196 ≈ (0.0266/2)·2^0.56 = 0.01961).
 *
 * The fit is in the ratio Su/E, but the API takes MPa like the other estimation methods. The
 * cyclic curve is the compatible one (n' = b/c, K' = σf'/εf'^n'); the method gives none.
 *
 * Reference: U. Muralidharan and S. S. Manson, J. Eng. Mater. Technol. 110 (1988) 55-58,
 * doi:10.1115/1.3226010. Constants value from memory; σf', b and c as reproduced at
 * Su = 500 MPa, E = 210000 MPa by the comparison table of Metals 15 (2025) 780,
 * doi:10.3390/met15070780.
 *
 * Scatter: the method was fitted to many metals; expect a factor of about 2 to 3 in life
 * against tests; the returned `note` says so.
 *
 * @throws {ArgumentError} for SuMPa or EMPa not finite and > 0, or reductionOfArea not in (0, 1).
 * @example
 * estimateModifiedUniversalSlopes({ SuMPa: 500, EMPa: 210000, reductionOfArea: 0.5 }).b
 * // returns -0.09
 */
export function estimateModifiedUniversalSlopes(input: ModifiedUniversalSlopesInput): Material {
  const { SuMPa, EMPa, reductionOfArea: ra } = input;
  if (!(SuMPa > 0 && SuMPa < Infinity)) throw new ArgumentError('SuMPa', SuMPa, 'must be a finite number > 0 (MPa)');
  if (!(EMPa > 0 && EMPa < Infinity)) throw new ArgumentError('EMPa', EMPa, 'must be a finite number > 0 (MPa)');
  if (!(ra > 0 && ra < 1)) throw new ArgumentError('reductionOfArea', ra, 'must be a fraction with 0 < RA < 1');
  const ratio = SuMPa / EMPa;
  const ductility = -Math.log(1 - ra);
  const fatigue = {
    sigmaF: 0.623 * EMPa * Math.pow(ratio, 0.832),
    b: -0.09,
    epsilonF: 0.0196 * Math.pow(ductility, 0.155) * Math.pow(ratio, -0.53),
    c: -0.56,
  };
  const curve = compatibleCyclicCurve(fatigue);
  return defineMaterial({
    name: input.name ?? `Modified universal slopes estimate (Su = ${SuMPa} MPa)`,
    E: EMPa,
    ...fatigue,
    K: curve.K,
    n: curve.n,
    Su: SuMPa,
    source: MODIFIED_UNIVERSAL_SLOPES_SOURCE,
    note:
      'Estimate from tensile data only: expect a factor of about 2 to 3 scatter in life against tests. ' +
      "Not design data; validate by test and apply scatter factors. Cyclic curve compatible (n' = b/c, K' = sigmaF/epsilonF^n'). Units: MPa.",
  });
}
