import { checkMean, checkStress } from './checks';
import { StressLifeError } from './StressLifeError';

/**
 * Walker's equivalent fully reversed amplitude:
 *
 *     σar = σmax^(1−γ)·σa^γ,   σmax = σm + σa > 0;    σar = 0 (no damage) for σmax <= 0
 *
 * γ = 0.5 is Smith-Watson-Topper, γ = 1 no correction. An estimate for steels from Su is
 * `estimateWalkerGamma` of `@loopwise/mean-stress` (Dowling 2009).
 *
 * References: K. Walker, "The effect of stress ratio during crack propagation and fatigue for
 * 2024-T3 and 7075-T6 aluminum", ASTM STP 462 (1970) 1-14; N. E. Dowling, C. A. Calhoun and
 * A. Arcari, "Mean stress effects in stress-life fatigue and the Walker equation", Fatigue
 * Fract. Eng. Mater. Struct. 32 (2009) 163-179, doi:10.1111/j.1460-2695.2008.01322.x.
 *
 * @param gamma γ in (0, 1]
 * @throws {StressLifeError} `invalid-stress`, `invalid-mean`, `invalid-option` (γ).
 * @example
 * walkerAmplitude(100, 300, 0.5);
 * // returns 200
 */
export function walkerAmplitude(amplitude: number, mean: number, gamma: number): number {
  checkStress(amplitude, 'amplitude');
  checkMean(mean, 'mean');
  checkGamma(gamma);
  return walkerCore(amplitude, mean, gamma);
}

/** Internal: γ in (0, 1]. */
export function checkGamma(gamma: number): void {
  if (!(gamma > 0 && gamma <= 1)) throw new StressLifeError('invalid-option', 'gamma', gamma, 'must be a number in (0, 1]');
}

/** Walker on checked values. Internal. */
export function walkerCore(sa: number, sm: number, gamma: number): number {
  const smax = sm + sa;
  if (!(smax > 0) || sa === 0) return 0;
  return Math.pow(smax, 1 - gamma) * Math.pow(sa, gamma);
}
