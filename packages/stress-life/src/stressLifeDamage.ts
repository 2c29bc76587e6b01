import { sumDamage } from '@loopwise/miner';
import { checkColumn } from './checks';
import { cycleLivesInto, type CycleLifeOptions } from './cycleLivesInto';
import type { SnCurve } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/** Cycle columns of the stress-life route: rainflow's `CycleTable.columns()` has this shape. */
export interface StressCycleColumns {
  /** Ranges Δσ (>= 0). */
  range: ArrayLike<number>;
  /** Means σm. */
  mean: ArrayLike<number>;
  /** Cycles each row stands for: 1, 0.5 for a half cycle, more for repeats (>= 0). */
  count: ArrayLike<number>;
}

/** Result of {@link stressLifeDamage}. */
export interface StressLifeDamage {
  /** Palmgren-Miner damage D = Σ count / Nf (Neumaier-compensated sum of miner's `sumDamage`). */
  readonly damage: number;
  /** Nf of every row, in cycles (Infinity below a cut-off). */
  readonly cyclesToFailure: Float64Array;
}

/**
 * Palmgren-Miner damage of rainflow cycles on an S-N curve: Nf of each row by
 * {@link cycleLivesInto}, then D = Σ countᵢ / Nfᵢ by `sumDamage` of `@loopwise/miner` (one
 * summation recipe for both routes). Life in repeats is then Dcrit / D (miner's
 * `lifeFromDamage`, with e.g. {@link IIW_DAMAGE_SUM} as `criticalDamage`).
 *
 * References: A. Palmgren, Z. VDI 68 (1924) 339-341; M. A. Miner, J. Appl. Mech. 12 (1945)
 * A159-A164.
 *
 * @throws {StressLifeError} as {@link cycleLivesInto}; `invalid-argument` for columns of
 *   different lengths; miner's `invalid-count` for a bad count.
 * @example
 * const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3 });
 * stressLifeDamage(c, { range: [100, 50], mean: [0, 0], count: [1, 8] }).damage;
 * // returns 0.000001
 */
export function stressLifeDamage(curve: SnCurve, cycles: StressCycleColumns, options: CycleLifeOptions = {}): StressLifeDamage {
  if (cycles === null || typeof cycles !== 'object') throw new StressLifeError('invalid-argument', 'cycles', cycles, 'must be { range, mean, count }');
  checkColumn(cycles.range, 'range');
  checkColumn(cycles.mean, 'mean', cycles.range.length);
  checkColumn(cycles.count, 'count', cycles.range.length);
  const nf = cycleLivesInto(curve, cycles.range, cycles.mean, new Float64Array(cycles.range.length), options);
  return { damage: sumDamage(cycles.count, nf), cyclesToFailure: nf };
}
