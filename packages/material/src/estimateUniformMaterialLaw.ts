import { ArgumentError } from './ArgumentError';
import { compatibleCyclicCurve } from './compatibleCyclicCurve';
import { defineMaterial } from './defineMaterial';
import type { Material } from './Material';

/** Input of {@link estimateUniformMaterialLaw}. Stresses in MPa: the fit is empirical. */
export interface UniformMaterialLawInput {
  /** Ultimate tensile strength Su in MPa. */
  SuMPa: number;
  /** Young's modulus E in MPa. */
  EMPa: number;
  /** Metal family of the law: `'steel'` (unalloyed and low-alloy steels) or `'aluminium-titanium'`. */
  metal: 'steel' | 'aluminium-titanium';
  /**
   * Which cyclic curve to return: `'published'` (default) the law's own K' and n';
   * `'compatible'` K', n' from the fatigue constants (n' = b/c, K' = σf'/εf'^n').
   */
  cyclicCurve?: 'published' | 'compatible';
  /** Name for the material; default `"UML estimate (<metal>, Su = … MPa)"`. */
  name?: string;
}

/** Full citation of the Uniform Material Law. */
export const UNIFORM_MATERIAL_LAW_SOURCE =
  'M. Bäumel Jr. and T. Seeger, Materials Data for Cyclic Loading, Supplement 1, Elsevier, Amsterdam, 1990 (Uniform Material Law)';

const SCATTER_NOTE =
  'Estimate from tensile strength only: expect a factor of about 2 to 3 scatter in life against tests. ' +
  'Not design data; validate by test and apply scatter factors.';

/**
 * Estimates a full strain-life material from the ultimate tensile strength by the Uniform
 * Material Law (Bäumel and Seeger). All stresses in MPa (an empirical fit).
 *
 * Steels (unalloyed and low-alloy):
 *
 *     σf' = 1.5·Su,  b = −0.087,  εf' = 0.59·ψ,  c = −0.58,  K' = 1.65·Su,  n' = 0.15
 *     ψ = 1 for Su/E ≤ 0.003, otherwise ψ = 1.375 − 125·Su/E
 *
 * Aluminium and titanium alloys:
 *
 *     σf' = 1.67·Su,  b = −0.095,  εf' = 0.35,  c = −0.69,  K' = 1.61·Su,  n' = 0.11
 *
 * The aluminium/titanium K', n' are not compatible with the fatigue constants (b/c = 0.138),
 * so that material carries an `incompatible-cyclic-curve` warning unless
 * `cyclicCurve: 'compatible'` is chosen.
 *
 * Reference: M. Bäumel Jr. and T. Seeger, Materials Data for Cyclic Loading, Supplement 1,
 * Elsevier, 1990. Constants as reproduced (steel σf', b, εf', c at Su = 500 MPa) in the
 * comparison table of Metals 15 (2025) 780, doi:10.3390/met15070780; the remaining constants
 * (ψ rule, K', n', aluminium-titanium row) value from memory.
 *
 * Scatter: life estimated from these constants typically lies within a factor of 2 to 3 of
 * tests, worse for unusual heat treatments; the returned `note` says so.
 *
 * @throws {ArgumentError} for SuMPa or EMPa not finite and > 0, or an unknown `metal`.
 * @example
 * estimateUniformMaterialLaw({ SuMPa: 500, EMPa: 210000, metal: 'steel' }).sigmaF
 * // returns 750
 */
export function estimateUniformMaterialLaw(input: UniformMaterialLawInput): Material {
  const { SuMPa, EMPa, metal, cyclicCurve = 'published' } = input;
  if (!(SuMPa > 0 && SuMPa < Infinity)) throw new ArgumentError('SuMPa', SuMPa, 'must be a finite number > 0 (MPa)');
  if (!(EMPa > 0 && EMPa < Infinity)) throw new ArgumentError('EMPa', EMPa, 'must be a finite number > 0 (MPa)');
  if (metal !== 'steel' && metal !== 'aluminium-titanium') {
    throw new ArgumentError('metal', metal, "must be 'steel' or 'aluminium-titanium'");
  }
  if (cyclicCurve !== 'published' && cyclicCurve !== 'compatible') {
    throw new ArgumentError('cyclicCurve', cyclicCurve, "must be 'published' or 'compatible'");
  }
  let fatigue: { sigmaF: number; b: number; epsilonF: number; c: number };
  let published: { K: number; n: number };
  if (metal === 'steel') {
    const ratio = SuMPa / EMPa;
    const psi = ratio <= 0.003 ? 1 : 1.375 - 125 * ratio;
    if (!(psi > 0)) throw new ArgumentError('SuMPa', SuMPa, 'Su/E too high for the steel law (ψ = 1.375 − 125·Su/E must be > 0)');
    fatigue = { sigmaF: 1.5 * SuMPa, b: -0.087, epsilonF: 0.59 * psi, c: -0.58 };
    published = { K: 1.65 * SuMPa, n: 0.15 };
  } else {
    fatigue = { sigmaF: 1.67 * SuMPa, b: -0.095, epsilonF: 0.35, c: -0.69 };
    published = { K: 1.61 * SuMPa, n: 0.11 };
  }
  const curve = cyclicCurve === 'published' ? published : compatibleCyclicCurve(fatigue);
  return defineMaterial({
    name: input.name ?? `UML estimate (${metal}, Su = ${SuMPa} MPa)`,
    E: EMPa,
    ...fatigue,
    K: curve.K,
    n: curve.n,
    Su: SuMPa,
    source: UNIFORM_MATERIAL_LAW_SOURCE,
    note: `${SCATTER_NOTE} Cyclic curve: ${cyclicCurve === 'published' ? "the law's own K', n'" : "compatible with the fatigue constants (n' = b/c, K' = sigmaF/epsilonF^n')"}. Units: MPa.`,
  });
}
