import type { CycleColumns, CycleTable } from './CycleTable';
import { InvalidOptionError } from './errors';

/** Options of {@link damageEquivalentRange}. */
export interface DamageEquivalentOptions {
  /** Slope m of the S-N (Basquin) line N · ΔS^m = constant, m > 0. */
  slope: number;
  /** Reference number of cycles N_ref > 0 (e.g. 1e6 or 2e6). */
  referenceCount: number;
}

/**
 * The damage-equivalent range: the constant range that, applied N_ref times, does the same
 * Palmgren-Miner damage on an S-N line of slope m as the counted cycles:
 *
 *   ΔS_eq = (Σ n_i · ΔS_i^m / N_ref)^(1/m)
 *
 * in the unit of the ranges. Computed relative to the largest range so that large m or large
 * ranges do not overflow. No cycles (or only zero ranges) give 0.
 *
 * References: the equivalent constant-amplitude stress range of the Palmgren-Miner rule, e.g.
 * EN 1993-1-9:2005, 2 and annex A (as ΔσE,2 at N = 2·10^6); A. Palmgren (1924), M. A. Miner,
 * J. Appl. Mech. 12 (1945) A159-A164.
 *
 * @example
 * const { cycles } = rainflow([0, 2, 0, 2, 0]); // four half cycles of range 2
 * damageEquivalentRange(cycles, { slope: 3, referenceCount: 2 }); // returns 2
 */
export function damageEquivalentRange(
  cycles: CycleTable | Pick<CycleColumns, 'range' | 'count'>,
  options: DamageEquivalentOptions,
): number {
  const { slope, referenceCount } = options;
  if (!(slope > 0) || slope === Infinity) throw new InvalidOptionError('slope', slope, 'must be a finite number > 0');
  if (!(referenceCount > 0) || referenceCount === Infinity) {
    throw new InvalidOptionError('referenceCount', referenceCount, 'must be a finite number > 0');
  }
  const cols = 'columns' in cycles ? cycles.columns() : cycles;
  let top = 0;
  for (let i = 0; i < cols.range.length; i++) if (cols.count[i] > 0 && cols.range[i] > top) top = cols.range[i];
  if (top === 0) return 0;
  let s = 0;
  for (let i = 0; i < cols.range.length; i++) s += cols.count[i] * Math.pow(cols.range[i] / top, slope);
  return top * Math.pow(s / referenceCount, 1 / slope);
}
