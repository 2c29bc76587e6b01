import { checkMean, checkStress } from './checks';

/**
 * Smith-Watson-Topper equivalent fully reversed amplitude in the stress-life form:
 *
 *     σar = √(σmax·σa),   σmax = σm + σa > 0;    σar = 0 (no damage) for σmax <= 0
 *
 * References: K. N. Smith, P. Watson and T. H. Topper, "A stress-strain function for the
 * fatigue of metals", J. Materials 5(4) (1970) 767-778; N. E. Dowling, Mechanical Behavior of
 * Materials, 4th ed., section 9.7 (σmax <= 0: infinite life; value from memory).
 *
 * @throws {StressLifeError} `invalid-stress`, `invalid-mean`.
 * @example
 * smithWatsonTopperAmplitude(100, 300);
 * // returns 200
 */
export function smithWatsonTopperAmplitude(amplitude: number, mean: number): number {
  checkStress(amplitude, 'amplitude');
  checkMean(mean, 'mean');
  return swtCore(amplitude, mean);
}

/** SWT on checked values. Internal. */
export function swtCore(sa: number, sm: number): number {
  const smax = sm + sa;
  return smax > 0 ? Math.sqrt(smax * sa) : 0;
}
