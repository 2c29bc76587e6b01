import { NeumaierAdder } from '@loopwise/base';
import { checkCount, checkLife, checkLength, recordDamage } from './checks';
import { cutoffLimit } from './CutoffPolicy';
import type { DamageOptions } from './damageInto';

/**
 * Column kernel of the Palmgren-Miner sum: the total damage of typed-array columns in one pass,
 *
 *     D = Σ n_i / Nf_i          (terms with Nf_i above the cut-off life are 0)
 *
 * with `counts` in cycles (1 full, 0.5 half) and `cyclesToFailure` in cycles Nf (not reversals).
 * Summed with Neumaier's compensation (`NeumaierAdder` of `@loopwise/base`, Neumaier 1974) so
 * that millions of small terms keep their accuracy.
 *
 * References: A. Palmgren, Z. VDI 68 (1924) 339-341; M. A. Miner, J. Appl. Mech. 12 (1945)
 * A159-A164.
 *
 * Special cases: empty columns give 0; Nf = Infinity contributes 0. Never NaN.
 *
 * @throws {MinerError} `invalid-count` / `invalid-life` naming the row, `invalid-argument` for
 *   columns of different lengths, `invalid-cutoff` for a bad policy.
 * @example
 * sumDamage(Float64Array.of(1, 1, 0.5), Float64Array.of(1e3, 1e6, 1e3)); // returns 0.001501
 * sumDamage([1, 1], [1e3, 1e7], { cutoff: { cycles: 1e6 } });             // returns 0.001
 */
export function sumDamage(counts: ArrayLike<number>, cyclesToFailure: ArrayLike<number>, options: DamageOptions = {}): number {
  const n = counts.length;
  checkLength(cyclesToFailure, n, 'cyclesToFailure');
  const limit = cutoffLimit(options.cutoff);
  const s = new NeumaierAdder();
  for (let i = 0; i < n; i++) {
    const c = counts[i];
    const f = cyclesToFailure[i];
    checkCount(c, 'counts', i);
    checkLife(f, 'cyclesToFailure', i);
    s.add(recordDamage(c, f, limit, i));
  }
  return s.valueOf();
}
