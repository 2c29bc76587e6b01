import { checkPositive } from './checks';
import { defineSnCurve } from './defineSnCurve';
import { fatigueStrengthFraction } from './fatigueStrengthFraction';
import { rotatingBeamEnduranceLimit } from './rotatingBeamEnduranceLimit';
import type { SnCurve } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/** Input of {@link estimateSteelSnCurve}; stresses in MPa (or any one unit when `fraction` is given). */
export interface SteelCurveInput {
  /** Sut. */
  ultimateStrengthMPa: number;
  /** Se, the (Marin-modified) endurance limit at 10^6 cycles. Default Se' = {@link rotatingBeamEnduranceLimit}(Sut). */
  enduranceLimitMPa?: number;
  /** f, the fraction of Sut at 10^3 cycles. Default {@link fatigueStrengthFraction}(Sut). */
  fraction?: number;
}

/**
 * An estimated stress-amplitude curve of a steel from its ultimate strength, in cycles, for
 * fully reversed stress (R = −1):
 *
 *     Sf = a·N^b,   a = (f·Sut)²/Se,   b = −(1/3)·log10(f·Sut/Se)      10^3 <= N <= 10^6
 *
 * i.e. a Basquin curve of slope m = −1/b through (10^6, Se) and (10^3, f·Sut), with no damage
 * below Se (a cut-off at 10^6 cycles, the endurance limit; {@link belowKneeCurve} turns it into
 * Haibach's or another variant). Below 10^3 cycles the line is extrapolated (the book uses
 * another rule there).
 *
 * Reference: R. G. Budynas and J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th
 * ed., 2011, eqs. (6-13)-(6-16) and Example 6-2 (a = 133.1 kpsi, b = −0.0785, N = 77 500 at
 * 55 kpsi for Sut = 90 kpsi, f = 0.86).
 *
 * @throws {StressLifeError} `invalid-option` naming the bad field (also Se >= f·Sut).
 * @example
 * const c = estimateSteelSnCurve({ ultimateStrengthMPa: 90, enduranceLimitMPa: 45, fraction: 0.86 });
 * stressAtCycles(c, 1e4).toFixed(1);
 * // returns '64.6'
 */
export function estimateSteelSnCurve(input: SteelCurveInput): SnCurve {
  if (input === null || typeof input !== 'object') throw new StressLifeError('invalid-option', 'input', input, 'must be { ultimateStrengthMPa, ... }');
  const su = input.ultimateStrengthMPa;
  checkPositive(su, 'ultimateStrengthMPa');
  const se = input.enduranceLimitMPa ?? rotatingBeamEnduranceLimit(su);
  checkPositive(se, 'enduranceLimitMPa');
  const f = input.fraction ?? fatigueStrengthFraction(su);
  if (!(f > 0 && f <= 1)) throw new StressLifeError('invalid-option', 'fraction', f, 'must be a number in (0, 1]');
  if (!(f * su > se)) throw new StressLifeError('invalid-option', 'enduranceLimitMPa', se, `must be below f·Sut = ${f * su}`);
  const b = -Math.log10((f * su) / se) / 3;
  return defineSnCurve({ measure: 'amplitude', stress: se, cycles: 1e6, slope: -1 / b, cutoffCycles: 1e6 });
}
