import { StressLifeError } from './StressLifeError';

/** Load types of the Marin load and size factors. */
export type LoadType = 'bending' | 'axial' | 'torsion';

/**
 * Marin load factor kc: bending 1, axial 0.85, torsion 0.59 (R. G. Budynas and J. K. Nisbett,
 * Shigley's Mechanical Engineering Design, 9th ed., 2011, eq. (6-26), p. 290).
 *
 * @throws {StressLifeError} `invalid-option` for an unknown load type.
 * @example
 * marinLoadFactor('axial');
 * // returns 0.85
 */
export function marinLoadFactor(load: LoadType): number {
  if (load === 'bending') return 1;
  if (load === 'axial') return 0.85;
  if (load === 'torsion') return 0.59;
  throw new StressLifeError('invalid-option', 'load', load, "must be 'bending', 'axial' or 'torsion'");
}
