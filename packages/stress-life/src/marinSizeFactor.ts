import type { LoadType } from './marinLoadFactor';
import { StressLifeError } from './StressLifeError';

/**
 * Marin size factor kb of a round bar in bending or torsion, d in mm (R. G. Budynas and J. K.
 * Nisbett, Shigley's Mechanical Engineering Design, 9th ed., 2011, eqs. (6-20), (6-21), p. 288):
 *
 *     kb = (d/7.62)^−0.107 = 1.24·d^−0.107    2.79 <= d <= 51 mm
 *     kb = 1.51·d^−0.157                       51 < d <= 254 mm
 *     kb = 1                                   axial loading (no size effect)
 *
 * For a non-rotating or non-round section pass the equivalent diameter de of the book's
 * Table 6-3 (e.g. de = 0.370·d for a non-rotating round bar). Outside 2.79-254 mm the fit is
 * not defined and this throws.
 *
 * @throws {StressLifeError} `invalid-option` for d outside the fit or a bad load type.
 * @example
 * marinSizeFactor(10, 'bending').toFixed(3);
 * // returns '0.969'
 */
export function marinSizeFactor(diameterMm: number, load: LoadType): number {
  if (load === 'axial') return 1;
  if (load !== 'bending' && load !== 'torsion') throw new StressLifeError('invalid-option', 'load', load, "must be 'bending', 'axial' or 'torsion'");
  if (!(diameterMm >= 2.79 && diameterMm <= 254)) throw new StressLifeError('invalid-option', 'diameterMm', diameterMm, 'must be in [2.79, 254] mm (the range of the fit)');
  return diameterMm <= 51 ? 1.24 * Math.pow(diameterMm, -0.107) : 1.51 * Math.pow(diameterMm, -0.157);
}
