import { checkMean, checkPositive, checkStress } from './checks';
import type { CompressiveMean } from './AmplitudeCorrection';
import { checkCompressive } from './goodmanAmplitude';
import { StressLifeError } from './StressLifeError';

/**
 * Gerber's equivalent fully reversed amplitude:
 *
 *     σar = σa / (1 − (σm/Su)²),   |σm| < Su
 *
 * The parabola is symmetric, so on the compressive side it would predict harm from a
 * compressive mean; with `compressiveMean: 'neutral'` (the default) σm < 0 gives σar = σa.
 *
 * References: W. Gerber, Z. Bayer. Archit. Ing. Ver. 6 (1874) 101-110; R. G. Budynas and
 * J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th ed., McGraw-Hill 2011, eq. (6-47),
 * p. 305, and Example 6-15 (Sf = 70.3 kpsi for σa = 70, σm = 10, Sut = 151 kpsi).
 *
 * @throws {StressLifeError} `invalid-stress`, `invalid-mean` (also for |σm| ≥ Su with the
 *   equation, σm ≥ Su when neutral), `invalid-option`.
 * @example
 * gerberAmplitude(70, 10, 151).toFixed(1);
 * // returns '70.3'
 */
export function gerberAmplitude(amplitude: number, mean: number, ultimateStrength: number, compressiveMean: CompressiveMean = 'neutral'): number {
  checkStress(amplitude, 'amplitude');
  checkMean(mean, 'mean');
  checkPositive(ultimateStrength, 'ultimateStrength');
  checkCompressive(compressiveMean);
  checkGerberMean(mean, ultimateStrength, compressiveMean === 'neutral');
  return gerberCore(amplitude, mean, ultimateStrength, compressiveMean === 'neutral');
}

/** Internal: the mean must lie inside the parabola. */
export function checkGerberMean(sm: number, su: number, neutral: boolean, index?: number): void {
  if (!(sm < su) || (!neutral && !(sm > -su))) {
    throw new StressLifeError('invalid-mean', index === undefined ? 'mean' : 'means', sm, `must lie within ±ultimateStrength ${su} for Gerber`, index);
  }
}

/** Gerber on checked values. Internal. */
export function gerberCore(sa: number, sm: number, su: number, neutral: boolean): number {
  if (neutral && sm < 0) return sa;
  const r = sm / su;
  return sa / (1 - r * r);
}
