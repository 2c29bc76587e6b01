import { checkPositive } from './checks';

/**
 * The rotating-beam endurance limit of a steel from its ultimate strength (MPa):
 *
 *     Se' = 0.5·Sut   for Sut <= 1400 MPa;   Se' = 700 MPa   for Sut > 1400 MPa
 *
 * Reference: R. G. Budynas and J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th
 * ed., 2011, eq. (6-8) (the kpsi form 0.5·Sut, 100 kpsi above 200 kpsi; the MPa limits as
 * the book gives them, value from memory).
 *
 * @throws {StressLifeError} `invalid-option` for a bad strength.
 * @example
 * rotatingBeamEnduranceLimit(620);
 * // returns 310
 */
export function rotatingBeamEnduranceLimit(ultimateStrengthMPa: number): number {
  checkPositive(ultimateStrengthMPa, 'ultimateStrengthMPa');
  return ultimateStrengthMPa <= 1400 ? 0.5 * ultimateStrengthMPa : 700;
}
