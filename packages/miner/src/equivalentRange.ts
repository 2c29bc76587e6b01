import { NeumaierAdder } from '@loopwise/base';
import { checkCount, checkLength, checkRange } from './checks';
import { MinerError } from './MinerError';
import { MinerSum } from './MinerSum';

/** Options of {@link equivalentRange}. */
export interface EquivalentRangeOptions {
  /** Slope m of the S-N line N · ΔS^m = constant; finite, > 0 (e.g. 3 for welded steel, 5 or 10 for others). */
  slope: number;
  /** Reference number of cycles N_ref; finite, > 0 (e.g. 1e6, 2e6, or the cycles of the history). */
  referenceCount: number;
}

/**
 * The damage-equivalent range (or load): the constant range ΔS_eq that, applied N_ref times,
 * does the same Palmgren-Miner damage on an S-N line N · ΔS^m = C as the loops do,
 *
 *     ΔS_eq = (Σ n_i · ΔS_i^m / N_ref)^(1/m)
 *
 * in the unit of the ranges (C cancels). From a {@link MinerSum}'s own records (count and range;
 * every record needs a range) or from `{ count, range }` columns, such as the `columns()` of a
 * rainflow cycle table of `@loopwise/rainflow`. This is loopwise's one definition of the
 * damage-equivalent range. The records' cycles to failure
 * and the sum's cut-off are not used: the equivalence is on the single-slope line, over all
 * cycles. Computed relative to the largest range so that large m or ranges do not overflow, and
 * summed with Neumaier's compensation (`NeumaierAdder` of `@loopwise/base`).
 *
 * References: the equivalent constant-amplitude range of the Palmgren-Miner rule, e.g.
 * EN 1993-1-9:2005, annex A (ΔσE,2 at 2·10^6 cycles); M. A. Miner, J. Appl. Mech. 12 (1945)
 * A159-A164; O. H. Basquin, Proc. ASTM 10 (1910) 625-630 for the power-law S-N line.
 *
 * Special cases: no cycles, or only zero ranges or zero counts, give 0.
 *
 * @throws {MinerError} `invalid-argument` for a bad slope or reference count; `missing-range`
 *   for a sum record without a range; `invalid-count` / `invalid-range` naming the row.
 * @example
 * equivalentRange({ count: [1, 1], range: [100, 200] }, { slope: 3, referenceCount: 2 });
 * // returns (9e6 / 2)^(1/3) = 165.096...
 */
export function equivalentRange(
  loops: MinerSum | { count: ArrayLike<number>; range: ArrayLike<number> },
  options: EquivalentRangeOptions,
): number {
  const slope = options?.slope;
  const referenceCount = options?.referenceCount;
  if (!(slope > 0 && slope < Infinity)) throw new MinerError('invalid-argument', 'slope', slope, 'must be a finite number > 0');
  if (!(referenceCount > 0 && referenceCount < Infinity)) {
    throw new MinerError('invalid-argument', 'referenceCount', referenceCount, 'must be a finite number > 0');
  }
  let count: ArrayLike<number>;
  let range: ArrayLike<number>;
  if (loops instanceof MinerSum) {
    const missing = loops.firstMissingRange();
    if (missing >= 0) throw new MinerError('missing-range', 'range', undefined, 'the record was added without a range', missing);
    ({ count, range } = loops.columns());
  } else {
    if (loops === null || typeof loops !== 'object') throw new MinerError('invalid-argument', 'loops', loops, 'must be a MinerSum or { count, range }');
    ({ count, range } = loops);
    const n = count?.length;
    if (typeof n !== 'number') throw new MinerError('invalid-argument', 'count', count, 'must be an array-like column of numbers');
    checkLength(range, n, 'range');
  }
  let top = 0;
  for (let i = 0; i < count.length; i++) {
    checkCount(count[i], 'count', i);
    checkRange(range[i], 'range', i);
    if (count[i] > 0 && range[i] > top) top = range[i];
  }
  if (top === 0) return 0;
  const s = new NeumaierAdder();
  for (let i = 0; i < count.length; i++) if (count[i] > 0) s.add(count[i] * Math.pow(range[i] / top, slope));
  return top * Math.pow(s.valueOf() / referenceCount, 1 / slope);
}
