import { checkMean, checkPositive, checkStress } from './checks';
import { StressLifeError } from './StressLifeError';

/**
 * Morrow's equivalent fully reversed amplitude in the stress-life form, with the fatigue
 * strength coefficient σf' in place of Su:
 *
 *     σar = σa / (1 − σm/σf'),   σm < σf'
 *
 * (a compressive mean raises the allowed amplitude, as the equation says).
 *
 * References: J. D. Morrow, Fatigue Design Handbook, SAE Advances in Engineering 4 (1968),
 * section 3.2; N. E. Dowling, Mechanical Behavior of Materials, 4th ed., section 9.7
 * (section number value from memory).
 *
 * @throws {StressLifeError} `invalid-stress`, `invalid-mean` (also σm ≥ σf'), `invalid-option`.
 * @example
 * morrowAmplitude(300, 100, 1000).toFixed(2);
 * // returns '333.33'
 */
export function morrowAmplitude(amplitude: number, mean: number, sigmaF: number): number {
  checkStress(amplitude, 'amplitude');
  checkMean(mean, 'mean');
  checkPositive(sigmaF, 'sigmaF');
  if (!(mean < sigmaF)) throw new StressLifeError('invalid-mean', 'mean', mean, `must be < sigmaF ${sigmaF} for Morrow`);
  return morrowCore(amplitude, mean, sigmaF);
}

/** Morrow on checked values (mean < σf'). Internal. */
export function morrowCore(sa: number, sm: number, sf: number): number {
  return sa / (1 - sm / sf);
}
