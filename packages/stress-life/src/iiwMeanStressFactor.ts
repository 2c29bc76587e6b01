import { checkMean, checkStress } from './checks';
import type { IiwResidualCategory } from './AmplitudeCorrection';
import { StressLifeError } from './StressLifeError';

/**
 * The IIW enhancement factor f(R) of the fatigue resistance for stress ratio R = σmin/σmax:
 *
 *     I   (unwelded base material and wrought products with negligible residual stress
 *          (< 0.2·fy); stress-relieved welded components whose constraint and secondary
 *          stresses are in the analysis):
 *          f = 1.6 for R < −1,  f = −0.4·R + 1.2 for −1 <= R <= 0.5,  f = 1 for R > 0.5
 *     II  (small thin-walled simple structural elements with short welds; parts with
 *          thermally cut edges):
 *          f = 1.3 for R < −1,  f = −0.4·R + 0.9 for −1 <= R <= −0.25,  f = 1 for R > −0.25
 *     III (complex two- or three-dimensional welded components, global residual stresses,
 *          thick-walled components; as-welded): f = 1
 *
 * The curves of the recommendations hold for high tensile residual stress (as-welded), so
 * category III is no enhancement. A cycle with σmax <= 0 (wholly compressive) is taken at the
 * R → −∞ end (the largest f), our convention (the recommendations define f over R; continuity
 * from σmax → 0⁺ gives it).
 *
 * Reference: A. Hobbacher, IIW Recommendations for Fatigue Design of Welded Joints and
 * Components, 2016, 3.5.2 (equations and category wording value from memory).
 *
 * @param ratio R = σmin/σmax (−Infinity allowed; NaN not)
 * @throws {StressLifeError} `invalid-option` for an unknown category or NaN ratio.
 * @example
 * [iiwMeanStressFactor(-1, 'I'), iiwMeanStressFactor(0, 'I'), iiwMeanStressFactor(-1, 'II'), iiwMeanStressFactor(0, 'III')];
 * // returns [1.6, 1.2, 1.3, 1]
 */
export function iiwMeanStressFactor(ratio: number, category: IiwResidualCategory): number {
  checkCategory(category);
  if (Number.isNaN(ratio)) throw new StressLifeError('invalid-option', 'ratio', ratio, 'must be a number (R = σmin/σmax)');
  return iiwFactorCore(ratio, category);
}

/** Internal: the category. */
export function checkCategory(category: unknown): void {
  if (category !== 'I' && category !== 'II' && category !== 'III') throw new StressLifeError('invalid-option', 'category', category, "must be 'I', 'II' or 'III'");
}

/** f(R) on a checked category. Internal. */
export function iiwFactorCore(r: number, category: IiwResidualCategory): number {
  if (category === 'I') return r < -1 ? 1.6 : r <= 0.5 ? -0.4 * r + 1.2 : 1;
  if (category === 'II') return r < -1 ? 1.3 : r <= -0.25 ? -0.4 * r + 0.9 : 1;
  return 1;
}

/** σa/f(R) on checked values. Internal. */
export function iiwAmplitudeCore(sa: number, sm: number, category: IiwResidualCategory): number {
  if (sa === 0 || category === 'III') return sa;
  const smax = sm + sa;
  const r = smax > 0 ? (sm - sa) / smax : -Infinity;
  return sa / iiwFactorCore(r, category);
}

/**
 * The amplitude (or, doubled, the range) equivalent to a cycle against the as-welded IIW
 * curve, with the enhancement f(R) of {@link iiwMeanStressFactor}: σeq = σa / f(R).
 *
 * @throws {StressLifeError} `invalid-stress`, `invalid-mean`, `invalid-option`.
 * @example
 * iiwEnhancedAmplitude(60, 0, 'I');
 * // returns 37.5
 */
export function iiwEnhancedAmplitude(amplitude: number, mean: number, category: IiwResidualCategory): number {
  checkStress(amplitude, 'amplitude');
  checkMean(mean, 'mean');
  checkCategory(category);
  return iiwAmplitudeCore(amplitude, mean, category);
}
