import { StressLifeError } from './StressLifeError';

/** Joint categories of the IIW thickness correction and their exponents n. */
export type IiwThicknessJoint = 'cruciformAsWelded' | 'cruciformToeGround' | 'transverseButtAsWelded' | 'groundFlushOrLongitudinal';

/**
 * Exponents n of the IIW thickness correction (IIW recommendations 2016, 3.5.3, Table 3.4;
 * values from memory):
 * - `cruciformAsWelded` 0.3: cruciform joints, transverse T-joints, plates with transverse
 *   attachments, ends of longitudinal stiffeners, as-welded;
 * - `cruciformToeGround` 0.2: the same joints, toe ground;
 * - `transverseButtAsWelded` 0.2: transverse butt welds, as-welded;
 * - `groundFlushOrLongitudinal` 0.1: butt welds ground flush, base material, longitudinal
 *   welds or attachments.
 */
export const IIW_THICKNESS_EXPONENTS = Object.freeze({
  cruciformAsWelded: 0.3,
  cruciformToeGround: 0.2,
  transverseButtAsWelded: 0.2,
  groundFlushOrLongitudinal: 0.1,
});

/**
 * IIW thickness correction of the fatigue resistance, mm:
 *
 *     f(t) = (t_ref / t_eff)^n   for t_eff > t_ref = 25 mm, else 1
 *     t_eff = max(0.5·L, t_ref)  when L/t <= 2 (L the toe distance),  else t_eff = t
 *
 * FAT·f(t) is the corrected class (`thicknessFactor` of {@link iiwFatCurve}).
 *
 * Reference: A. Hobbacher, IIW Recommendations, 2016, 3.5.3 (thickness effect, t_eff and
 * Table 3.4; values and the t_eff rule from memory).
 *
 * @param thicknessMm plate thickness t (mm, finite, > 0)
 * @param joint the joint category, see {@link IIW_THICKNESS_EXPONENTS}
 * @param toeDistanceMm L, the distance between the weld toes, when known (mm)
 * @throws {StressLifeError} `invalid-option` naming the bad field.
 * @example
 * iiwThicknessFactor(50, 'cruciformAsWelded').toFixed(4);
 * // returns '0.8123'
 */
export function iiwThicknessFactor(thicknessMm: number, joint: IiwThicknessJoint, toeDistanceMm?: number): number {
  if (!(thicknessMm > 0 && thicknessMm < Infinity)) throw new StressLifeError('invalid-option', 'thicknessMm', thicknessMm, 'must be a finite number > 0 (mm)');
  const n = (IIW_THICKNESS_EXPONENTS as Record<string, number>)[joint];
  if (n === undefined || !Object.prototype.hasOwnProperty.call(IIW_THICKNESS_EXPONENTS, joint)) {
    throw new StressLifeError('invalid-option', 'joint', joint, `must be one of ${Object.keys(IIW_THICKNESS_EXPONENTS).join(', ')}`);
  }
  let teff = thicknessMm;
  if (toeDistanceMm !== undefined) {
    if (!(toeDistanceMm > 0 && toeDistanceMm < Infinity)) throw new StressLifeError('invalid-option', 'toeDistanceMm', toeDistanceMm, 'must be a finite number > 0 (mm)');
    if (toeDistanceMm / thicknessMm <= 2) teff = Math.max(0.5 * toeDistanceMm, 25);
  }
  return teff > 25 ? Math.pow(25 / teff, n) : 1;
}
