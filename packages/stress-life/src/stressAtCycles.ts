import { checkPositive } from './checks';
import { curveStress } from './defineSnCurve';
import type { SnCurve } from './SnCurve';

/**
 * The fatigue strength of an S-N curve at N cycles (not reversals): the stress, in the curve's
 * measure, whose life is N. The inverse of {@link cyclesToFailure} on the sloped part; at and
 * beyond the cut-off it is the cut-off stress (the curve is horizontal there).
 *
 * @throws {StressLifeError} `invalid-cycles` for N ≤ 0, NaN or Infinity.
 * @example
 * const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3 });
 * stressAtCycles(c, 16e6);
 * // returns 50
 */
export function stressAtCycles(curve: SnCurve, cycles: number): number {
  checkPositive(cycles, 'cycles', 'invalid-cycles');
  if (cycles >= curve.cutoffCycles) return curve.cutoffStress;
  return curveStress(curve, cycles);
}
