import { checkMean, checkPositive, checkStress } from './checks';
import type { CompressiveMean } from './AmplitudeCorrection';
import { StressLifeError } from './StressLifeError';

/**
 * Goodman's equivalent fully reversed amplitude:
 *
 *     σar = σa / (1 − σm/Su),   σm < Su
 *
 * With `compressiveMean: 'neutral'` (the default) a compressive mean gives σar = σa.
 *
 * References: J. Goodman, Mechanics Applied to Engineering, Longmans, 1899; R. G. Budynas and
 * J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th ed., McGraw-Hill 2011, eq. (6-46)
 * and p. 305 (compressive midrange stress); N. E. Dowling, Mechanical Behavior of Materials,
 * 4th ed., section 9.7 (σar form; section number value from memory).
 *
 * @param amplitude σa (≥ 0)
 * @param mean σm
 * @param ultimateStrength Su (> 0)
 * @throws {StressLifeError} `invalid-stress`, `invalid-mean` (also for σm ≥ Su),
 *   `invalid-option` for a bad Su or `compressiveMean`.
 * @example
 * goodmanAmplitude(23.18, 69.54, 188.1).toFixed(2);
 * // returns '36.78'
 */
export function goodmanAmplitude(amplitude: number, mean: number, ultimateStrength: number, compressiveMean: CompressiveMean = 'neutral'): number {
  checkStress(amplitude, 'amplitude');
  checkMean(mean, 'mean');
  checkPositive(ultimateStrength, 'ultimateStrength');
  checkCompressive(compressiveMean);
  if (!(mean < ultimateStrength)) throw new StressLifeError('invalid-mean', 'mean', mean, `must be < ultimateStrength ${ultimateStrength} for Goodman`);
  return goodmanCore(amplitude, mean, ultimateStrength, compressiveMean === 'neutral');
}

/** Goodman on checked values (mean < Su). Internal. */
export function goodmanCore(sa: number, sm: number, su: number, neutral: boolean): number {
  if (neutral && sm < 0) return sa;
  return sa / (1 - sm / su);
}

/** Internal: the compressiveMean option. */
export function checkCompressive(v: unknown): void {
  if (v !== 'neutral' && v !== 'equation') throw new StressLifeError('invalid-option', 'compressiveMean', v, "must be 'neutral' or 'equation'");
}
