import { StressLifeError } from './StressLifeError';

/**
 * Reliability factors ke for an 8 % standard deviation of the endurance limit, by reliability
 * (R. G. Budynas and J. K. Nisbett, Shigley's Mechanical Engineering Design, 9th ed., 2011,
 * Table 6-5, p. 293): ke = 1 − 0.08·za with the standard normal variate za.
 */
export const MARIN_RELIABILITY_FACTORS: readonly { readonly reliability: number; readonly za: number; readonly ke: number }[] = Object.freeze([
  { reliability: 0.5, za: 0, ke: 1.0 },
  { reliability: 0.9, za: 1.288, ke: 0.897 },
  { reliability: 0.95, za: 1.645, ke: 0.868 },
  { reliability: 0.99, za: 2.326, ke: 0.814 },
  { reliability: 0.999, za: 3.091, ke: 0.753 },
  { reliability: 0.9999, za: 3.719, ke: 0.702 },
  { reliability: 0.99999, za: 4.265, ke: 0.659 },
  { reliability: 0.999999, za: 4.753, ke: 0.62 },
].map((r) => Object.freeze(r)));

/**
 * Marin reliability factor ke for one of the reliabilities of the table
 * {@link MARIN_RELIABILITY_FACTORS} (0.5, 0.9, 0.95, 0.99, 0.999, 0.9999, 0.99999, 0.999999);
 * other reliabilities throw rather than interpolate.
 *
 * @throws {StressLifeError} `invalid-option` for a reliability the table does not list.
 * @example
 * marinReliabilityFactor(0.99);
 * // returns 0.814
 */
export function marinReliabilityFactor(reliability: number): number {
  const row = MARIN_RELIABILITY_FACTORS.find((r) => r.reliability === reliability);
  if (row === undefined) {
    throw new StressLifeError('invalid-option', 'reliability', reliability, `must be one of ${MARIN_RELIABILITY_FACTORS.map((r) => r.reliability).join(', ')}`);
  }
  return row.ke;
}
