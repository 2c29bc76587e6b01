import { NotchOptionError } from './NotchOptionError';

/**
 * Peterson's material constant a (mm) for steels from the ultimate tensile strength Su (MPa):
 *
 *     a = 0.0254·(2070 / Su)^1.8  mm,   Su >= 550 MPa
 *
 * (the SI form of a = 0.001·(300/Su[ksi])^1.8 in). Outside Su >= 550 MPa the fit is an
 * extrapolation; it is returned all the same (the docs say so).
 *
 * Reference: R. E. Peterson, Stress Concentration Factors, Wiley, 1974; fit as quoted in
 * N. E. Dowling, Mechanical Behavior of Materials, Pearson, section 10.7 (equation and section
 * number value from memory).
 *
 * @param ultimateStrengthMPa Su in MPa (> 0)
 * @example
 * petersonConstantMm(2070)
 * // returns 0.0254
 */
export function petersonConstantMm(ultimateStrengthMPa: number): number {
  if (!(ultimateStrengthMPa > 0 && ultimateStrengthMPa < Infinity)) {
    throw new NotchOptionError('ultimateStrengthMPa', ultimateStrengthMPa, 'must be a finite number > 0 (MPa)');
  }
  return 0.0254 * Math.pow(2070 / ultimateStrengthMPa, 1.8);
}

/**
 * Peterson's notch sensitivity q = 1 / (1 + a/r) for a notch root radius r and material
 * constant a, both in mm (a from {@link petersonConstantMm} for steels, or given). 0 < q <= 1;
 * q → 1 for large radii (Kf → Kt), q → 0 for sharp notches.
 *
 * Reference: R. E. Peterson, "Notch sensitivity", in G. Sines and J. L. Waisman (eds.), Metal
 * Fatigue, McGraw-Hill, 1959, 293-306.
 *
 * @param rootRadiusMm notch root radius r in mm (>= 0)
 * @param constantMm Peterson's a in mm (> 0)
 * @example
 * petersonSensitivity(1, 0.25)
 * // returns 0.8
 */
export function petersonSensitivity(rootRadiusMm: number, constantMm: number): number {
  if (!(rootRadiusMm >= 0 && rootRadiusMm < Infinity)) throw new NotchOptionError('rootRadiusMm', rootRadiusMm, 'must be a finite number >= 0 (mm)');
  if (!(constantMm > 0 && constantMm < Infinity)) throw new NotchOptionError('constantMm', constantMm, 'must be a finite number > 0 (mm)');
  return rootRadiusMm / (rootRadiusMm + constantMm);
}
