import { ArgumentError } from './ArgumentError';
import { compatibleCyclicCurve } from './compatibleCyclicCurve';
import { defineMaterial } from './defineMaterial';
import type { Material } from './Material';

/** Input of {@link estimateRoessleFatemi}. Modulus in MPa: the fit is empirical. */
export interface RoessleFatemiInput {
  /** Brinell hardness HB (the method's data span roughly 150 to 700 HB). */
  hardnessHB: number;
  /** Young's modulus E in MPa. */
  EMPa: number;
  /** Name for the material; default `"Roessle-Fatemi estimate (HB …)"`. */
  name?: string;
}

/** Full citation of the hardness method. */
export const ROESSLE_FATEMI_SOURCE =
  'M. L. Roessle and A. Fatemi, "Strain-controlled fatigue properties of steels and some simple approximations", International Journal of Fatigue 22 (2000) 495-511, doi:10.1016/S0142-1123(00)00026-8';

/**
 * Estimates a full strain-life material for a steel from its Brinell hardness by the hardness
 * method of Roessle and Fatemi. Stresses in MPa (an empirical fit):
 *
 *     σf' = 4.25·HB + 225,  b = −0.09,  εf' = (0.32·HB² − 487·HB + 191000) / E,  c = −0.56
 *
 * The cyclic curve is the compatible one, n' = b/c, K' = σf'/εf'^n' (this method gives no
 * separate fit for K', n'). Outside about 150 to 700 HB the note says the estimate is an
 * extrapolation.
 *
 * Reference: M. L. Roessle and A. Fatemi, International Journal of Fatigue 22 (2000) 495-511,
 * doi:10.1016/S0142-1123(00)00026-8. Constants value from memory, reproduced at HB 151,
 * E = 210000 MPa by the comparison table of Metals 15 (2025) 780, doi:10.3390/met15070780.
 *
 * Scatter: the paper's own data scatter around these lines by about a factor of 2 to 3 in
 * life; the returned `note` says so.
 *
 * @throws {ArgumentError} for hardnessHB or EMPa not finite and > 0, or a hardness for which
 *   the εf' polynomial is not positive.
 * @example
 * estimateRoessleFatemi({ hardnessHB: 151, EMPa: 210000 }).sigmaF
 * // returns 866.75
 */
export function estimateRoessleFatemi(input: RoessleFatemiInput): Material {
  const { hardnessHB: hb, EMPa } = input;
  if (!(hb > 0 && hb < Infinity)) throw new ArgumentError('hardnessHB', hb, 'must be a finite number > 0');
  if (!(EMPa > 0 && EMPa < Infinity)) throw new ArgumentError('EMPa', EMPa, 'must be a finite number > 0 (MPa)');
  const ductility = 0.32 * hb * hb - 487 * hb + 191000;
  if (!(ductility > 0)) throw new ArgumentError('hardnessHB', hb, 'gives a non-positive epsilonF polynomial');
  const fatigue = { sigmaF: 4.25 * hb + 225, b: -0.09, epsilonF: ductility / EMPa, c: -0.56 };
  const curve = compatibleCyclicCurve(fatigue);
  const range = hb >= 150 && hb <= 700 ? '' : ' Hardness outside about 150-700 HB: extrapolated beyond the data of the method.';
  return defineMaterial({
    name: input.name ?? `Roessle-Fatemi estimate (HB ${hb})`,
    E: EMPa,
    ...fatigue,
    K: curve.K,
    n: curve.n,
    hardnessHB: hb,
    source: ROESSLE_FATEMI_SOURCE,
    note:
      'Estimate from hardness only: expect a factor of about 2 to 3 scatter in life against tests. ' +
      "Not design data; validate by test and apply scatter factors. Cyclic curve compatible (n' = b/c, K' = sigmaF/epsilonF^n'). Units: MPa." +
      range,
  });
}
