import { checkPositive } from './checks';
import { rotatingBeamEnduranceLimit } from './rotatingBeamEnduranceLimit';

/**
 * The fatigue strength fraction f of a steel (the strength at 10^3 cycles is f·Sut), Sut in MPa:
 *
 *     σF' = Sut + 345 MPa,   b = −log10(σF'/Se') / log10(2·10^6),   f = (σF'/Sut)·(2·10^3)^b
 *
 * with Se' = {@link rotatingBeamEnduranceLimit}(Sut); for Sut < 490 MPa (70 kpsi) the book's
 * rule f = 0.9 applies.
 *
 * Reference: R. G. Budynas and J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th
 * ed., 2011, 6-8 and Figure 6-18 (the curve this equation draws; the equation form value from
 * memory) and p. 346 step 5 (f = 0.9 below 70 kpsi). It gives 0.858 at 90 kpsi where Example
 * 6-2 reads 0.86 off the figure.
 *
 * @throws {StressLifeError} `invalid-option` for a bad strength.
 * @example
 * fatigueStrengthFraction(620.5).toFixed(2);
 * // returns '0.86'
 */
export function fatigueStrengthFraction(ultimateStrengthMPa: number): number {
  checkPositive(ultimateStrengthMPa, 'ultimateStrengthMPa');
  if (ultimateStrengthMPa < 490) return 0.9;
  const sigmaF = ultimateStrengthMPa + 345;
  const b = -Math.log10(sigmaF / rotatingBeamEnduranceLimit(ultimateStrengthMPa)) / Math.log10(2e6);
  return (sigmaF / ultimateStrengthMPa) * Math.pow(2e3, b);
}
