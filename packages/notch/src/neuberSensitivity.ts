import { NotchOptionError } from './NotchOptionError';

/**
 * Neuber's material constant ρ' (mm) for steels from the ultimate tensile strength Su (MPa), by
 * the cubic fit of √ρ' (Kuhn and Hardrath) in SI units:
 *
 *     √ρ' = 1.24 − 2.25e-3·Su + 1.60e-6·Su² − 4.11e-10·Su³   (√mm, Su in MPa, 340..1700 MPa)
 *
 * It is the SI form of √ρ' = 0.246 − 3.08e-3·Su + 1.51e-5·Su² − 2.67e-8·Su³ (√in, Su in ksi).
 * Outside 340..1700 MPa the fit is an extrapolation (for Su above about 2000 MPa it turns
 * negative): a value of √ρ' <= 0 throws.
 *
 * Reference: P. Kuhn and H. F. Hardrath, "An engineering method for estimating notch-size
 * effect in fatigue tests on steel", NACA Technical Note 2805, 1952; the SI polynomial as quoted
 * in R. G. Budynas and J. K. Nisbett, Shigley's Mechanical Engineering Design, McGraw-Hill,
 * equation 6-35 (coefficients and equation number value from memory).
 *
 * @param ultimateStrengthMPa Su in MPa (> 0)
 * @example
 * neuberConstantMm(689.5)   // 100 ksi
 * // returns about 0.0989 (√ρ' ≈ 0.3145 √mm)
 */
export function neuberConstantMm(ultimateStrengthMPa: number): number {
  const su = ultimateStrengthMPa;
  if (!(su > 0 && su < Infinity)) throw new NotchOptionError('ultimateStrengthMPa', su, 'must be a finite number > 0 (MPa)');
  const root = 1.24 - 2.25e-3 * su + 1.6e-6 * su * su - 4.11e-10 * su * su * su;
  if (!(root > 0)) throw new NotchOptionError('ultimateStrengthMPa', su, 'is outside the fit (√ρ\' <= 0); give ρ\' directly');
  return root * root;
}

/**
 * Neuber's notch sensitivity q = 1 / (1 + √(ρ'/r)) for a notch root radius r and material
 * constant ρ', both in mm (ρ' from {@link neuberConstantMm} for steels, or given).
 *
 * Reference: H. Neuber, Kerbspannungslehre, 2nd ed., Springer, 1958 (Theory of Notch Stresses);
 * as quoted in N. E. Dowling, Mechanical Behavior of Materials, Pearson, section 10.7.
 *
 * @param rootRadiusMm notch root radius r in mm (>= 0)
 * @param constantMm Neuber's ρ' in mm (> 0)
 * @example
 * neuberSensitivity(1, 0.25)
 * // returns 1 / 1.5
 */
export function neuberSensitivity(rootRadiusMm: number, constantMm: number): number {
  if (!(rootRadiusMm >= 0 && rootRadiusMm < Infinity)) throw new NotchOptionError('rootRadiusMm', rootRadiusMm, 'must be a finite number >= 0 (mm)');
  if (!(constantMm > 0 && constantMm < Infinity)) throw new NotchOptionError('constantMm', constantMm, 'must be a finite number > 0 (mm)');
  return 1 / (1 + Math.sqrt(constantMm / rootRadiusMm));
}
