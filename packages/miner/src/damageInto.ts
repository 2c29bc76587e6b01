import { checkCount, checkLife, checkLength, recordDamage } from './checks';
import { cutoffLimit, type CutoffPolicy } from './CutoffPolicy';
import { MinerError } from './MinerError';

/** Options of {@link damageInto} and {@link sumDamage}. */
export interface DamageOptions {
  /** Cut-off policy, see {@link CutoffPolicy}. Default `'none'`: every cycle damages. */
  cutoff?: CutoffPolicy;
}

/**
 * Typed-array kernel: the Palmgren-Miner damage of every row,
 *
 *     d_i = n_i / Nf_i          (0 when Nf_i exceeds the cut-off life)
 *
 * written into the caller-owned `out` and returned. `counts` are cycles (1 for a full cycle, 0.5
 * for a half cycle), `cyclesToFailure` are cycles Nf, not reversals (see
 * {@link cyclesFromReversalsInto}). One pass, no allocation.
 *
 * References: A. Palmgren, "Die Lebensdauer von Kugellagern", Z. VDI 68 (1924) 339-341;
 * M. A. Miner, "Cumulative damage in fatigue", J. Appl. Mech. 12 (1945) A159-A164.
 *
 * Special cases: Nf = Infinity gives 0; an empty input leaves `out` untouched.
 *
 * @throws {MinerError} `invalid-count` / `invalid-life` naming the row; `invalid-argument` for
 *   columns of different lengths or a short `out`; `invalid-cutoff` for a bad policy.
 * @example
 * damageInto(Float64Array.of(1, 0.5, 1), Float64Array.of(1000, 1000, Infinity), new Float64Array(3));
 * // returns Float64Array [0.001, 0.0005, 0]
 */
export function damageInto(
  counts: ArrayLike<number>,
  cyclesToFailure: ArrayLike<number>,
  out: Float64Array,
  options: DamageOptions = {},
): Float64Array {
  const n = counts.length;
  checkLength(cyclesToFailure, n, 'cyclesToFailure');
  if (!(out.length >= n)) throw new MinerError('invalid-argument', 'out.length', out.length, `must be >= ${n}`);
  const limit = cutoffLimit(options.cutoff);
  for (let i = 0; i < n; i++) {
    const c = counts[i];
    const f = cyclesToFailure[i];
    checkCount(c, 'counts', i);
    checkLife(f, 'cyclesToFailure', i);
    out[i] = recordDamage(c, f, limit, i);
  }
  return out;
}
