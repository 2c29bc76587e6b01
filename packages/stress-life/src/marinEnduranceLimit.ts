import { checkPositive } from './checks';
import { marinLoadFactor, type LoadType } from './marinLoadFactor';
import { marinReliabilityFactor } from './marinReliabilityFactor';
import { marinSizeFactor } from './marinSizeFactor';
import { marinSurfaceFactor, type SurfaceFinish } from './marinSurfaceFactor';
import { rotatingBeamEnduranceLimit } from './rotatingBeamEnduranceLimit';
import { StressLifeError } from './StressLifeError';

/** Input of {@link marinEnduranceLimit}; MPa and mm. */
export interface MarinInput {
  /** Sut in MPa. */
  ultimateStrengthMPa: number;
  /** Se' in MPa, when tested. Default {@link rotatingBeamEnduranceLimit}(Sut). */
  rotatingBeamLimitMPa?: number;
  /** Surface finish for ka. Default none (ka = 1, a polished specimen). */
  finish?: SurfaceFinish;
  /** Load type for kb and kc. Default `'bending'`. */
  load?: LoadType;
  /** Diameter (or equivalent diameter) in mm for kb. Default none (kb = 1). */
  diameterMm?: number;
  /** Reliability for ke (a value of the table). Default 0.5 (ke = 1). */
  reliability?: number;
  /** Temperature factor kd (the book's Table 6-4 or eq. (6-27)). Default 1. */
  temperatureFactor?: number;
  /** Miscellaneous-effects factor kf of the book (not the notch factor Kf). Default 1. */
  miscellaneousFactor?: number;
}

/** Result of {@link marinEnduranceLimit}. */
export interface MarinEnduranceLimit {
  /** Se = ka·kb·kc·kd·ke·kf·Se', MPa. */
  readonly enduranceLimitMPa: number;
  /** Se', MPa. */
  readonly rotatingBeamLimitMPa: number;
  readonly factors: { readonly ka: number; readonly kb: number; readonly kc: number; readonly kd: number; readonly ke: number; readonly kf: number };
}

/**
 * The endurance limit of a part by the Marin equation (MPa):
 *
 *     Se = ka·kb·kc·kd·ke·kf·Se'
 *
 * with ka from {@link marinSurfaceFactor}, kb {@link marinSizeFactor}, kc
 * {@link marinLoadFactor}, ke {@link marinReliabilityFactor}, kd and kf as given.
 *
 * Reference: J. Marin, Mechanical Behavior of Engineering Materials, Prentice-Hall 1962;
 * R. G. Budynas and J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th ed., 2011,
 * eq. (6-18) and Example 6-8 (Se = 16.3 kpsi).
 *
 * @throws {StressLifeError} `invalid-option` naming the bad field.
 * @example
 * marinEnduranceLimit({ ultimateStrengthMPa: 520, finish: 'machined' }).enduranceLimitMPa.toFixed(1);
 * // returns '223.6'
 */
export function marinEnduranceLimit(input: MarinInput): MarinEnduranceLimit {
  if (input === null || typeof input !== 'object') throw new StressLifeError('invalid-option', 'input', input, 'must be { ultimateStrengthMPa, ... }');
  checkPositive(input.ultimateStrengthMPa, 'ultimateStrengthMPa');
  const se0 = input.rotatingBeamLimitMPa ?? rotatingBeamEnduranceLimit(input.ultimateStrengthMPa);
  checkPositive(se0, 'rotatingBeamLimitMPa');
  const load = input.load ?? 'bending';
  const kc = marinLoadFactor(load);
  const ka = input.finish === undefined ? 1 : marinSurfaceFactor(input.finish, input.ultimateStrengthMPa);
  const kb = input.diameterMm === undefined ? 1 : marinSizeFactor(input.diameterMm, load);
  const kd = input.temperatureFactor ?? 1;
  const ke = input.reliability === undefined ? 1 : marinReliabilityFactor(input.reliability);
  const kf = input.miscellaneousFactor ?? 1;
  checkPositive(kd, 'temperatureFactor');
  checkPositive(kf, 'miscellaneousFactor');
  return {
    enduranceLimitMPa: ka * kb * kc * kd * ke * kf * se0,
    rotatingBeamLimitMPa: se0,
    factors: Object.freeze({ ka, kb, kc, kd, ke, kf }),
  };
}
