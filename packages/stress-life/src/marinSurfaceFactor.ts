import { checkPositive } from './checks';
import { StressLifeError } from './StressLifeError';

/** Surface finishes of the Marin surface factor table. */
export type SurfaceFinish = 'ground' | 'machined' | 'hotRolled' | 'asForged';

/**
 * Parameters of the Marin surface factor ka = a·Sut^b with Sut in MPa: R. G. Budynas and J. K.
 * Nisbett, Shigley's Mechanical Engineering Design, 9th ed., McGraw-Hill 2011, Table 6-2
 * (p. 288; after C. J. Noll and C. Lipson, Proc. SESA 3(2) (1946) 29). `machined` is
 * "machined or cold-drawn".
 */
export const MARIN_SURFACE_FINISHES: Readonly<Record<SurfaceFinish, { readonly a: number; readonly b: number }>> = Object.freeze({
  ground: Object.freeze({ a: 1.58, b: -0.085 }),
  machined: Object.freeze({ a: 4.51, b: -0.265 }),
  hotRolled: Object.freeze({ a: 57.7, b: -0.718 }),
  asForged: Object.freeze({ a: 272, b: -0.995 }),
});

/**
 * Marin surface factor ka = a·Sut^b (Sut in MPa), Shigley 9th ed. eq. (6-19) and Table 6-2.
 * Not capped at 1 (the fit can exceed 1 for low strengths; the caller decides).
 *
 * @param finish see {@link MARIN_SURFACE_FINISHES}
 * @param ultimateStrengthMPa Sut in MPa (> 0)
 * @throws {StressLifeError} `invalid-option` for an unknown finish or a bad strength.
 * @example
 * // Shigley 9th ed., Example 6-3: machined, Sut = 520 MPa, ka = 0.860
 * marinSurfaceFactor('machined', 520).toFixed(3);
 * // returns '0.860'
 */
export function marinSurfaceFactor(finish: SurfaceFinish, ultimateStrengthMPa: number): number {
  if (typeof finish !== 'string' || !Object.prototype.hasOwnProperty.call(MARIN_SURFACE_FINISHES, finish)) {
    throw new StressLifeError('invalid-option', 'finish', finish, `must be one of ${Object.keys(MARIN_SURFACE_FINISHES).join(', ')}`);
  }
  checkPositive(ultimateStrengthMPa, 'ultimateStrengthMPa');
  const { a, b } = MARIN_SURFACE_FINISHES[finish];
  return a * Math.pow(ultimateStrengthMPa, b);
}
