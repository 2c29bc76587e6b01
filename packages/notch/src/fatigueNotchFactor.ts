import { NotchOptionError } from './NotchOptionError';

/**
 * Fatigue notch factor from the elastic stress concentration factor and a notch sensitivity:
 *
 *     Kf = 1 + q·(Kt − 1),   1 <= Kf <= Kt
 *
 * Kt is the theoretical (elastic) stress concentration factor, the ratio of the peak
 * linear-elastic stress at the notch root to the nominal stress; it depends on geometry only.
 * Kf is the ratio of the unnotched to the notched fatigue strength at long life; it is smaller
 * than Kt for small root radii and soft materials. Use Kt with a notch rule for the local
 * stress-strain response (the usual local strain approach) and Kf where a method calls for the
 * long-life fatigue effect of the notch.
 *
 * Reference: R. E. Peterson, Stress Concentration Factors, Wiley, 1974; N. E. Dowling,
 * Mechanical Behavior of Materials, Pearson, section 10.7.
 *
 * @param Kt elastic stress concentration factor (>= 1)
 * @param q notch sensitivity (0 <= q <= 1)
 * @example
 * fatigueNotchFactor(3, 0.8)
 * // returns 2.6
 */
export function fatigueNotchFactor(Kt: number, q: number): number {
  if (!(Kt >= 1 && Kt < Infinity)) throw new NotchOptionError('Kt', Kt, 'must be a finite number >= 1');
  if (!(q >= 0 && q <= 1)) throw new NotchOptionError('q', q, 'must be a number in [0, 1]');
  return 1 + q * (Kt - 1);
}
