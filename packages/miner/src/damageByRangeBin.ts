import { binIndex, NeumaierAdder } from '@loopwise/base';
import { checkEdges, checkLength, checkRange } from './checks';
import { checkDamage } from './LoopDamageColumns';
import { MinerError } from './MinerError';
import { MinerSum } from './MinerSum';

/** Result of {@link damageByRangeBin}. */
export interface RangeBinDamage {
  /** The bin edges used (strictly increasing). */
  readonly edges: Float64Array;
  /** Damage per bin (length edges − 1). */
  readonly damage: Float64Array;
  /** damage / total per bin (0 when the total is 0). */
  readonly share: Float64Array;
  /** Damage of loops whose range lies outside the edges (nothing is dropped). */
  readonly outsideDamage: number;
  /** outsideDamage / total (0 when the total is 0). */
  readonly outsideShare: number;
  /** Total damage of the loops: Σ damage + outsideDamage up to rounding. */
  readonly total: number;
}

/**
 * Damage and its share by range bin: which sizes of loop do the damage. Bin j holds ranges
 * edges[j] ≤ Δ < edges[j+1], the last bin also its upper edge (the convention of the rainflow
 * matrices); loops outside the edges are summed in `outsideDamage`. One pass, O(log bins) per
 * loop.
 *
 *     share_j = Σ_{i: Δ_i ∈ bin j} d_i / Σ_i d_i
 *
 * Reference: the damage spectrum over range classes, e.g. E. Haibach, Betriebsfestigkeit,
 * 3rd ed., Springer, 2006 (chapter from memory); common practice.
 *
 * @param loops a MinerSum (every record needs a range) or `{ damage, range }` columns
 * @param edges bin edges in the unit of the ranges, at least two, finite, strictly increasing
 * @throws {MinerError} `missing-range` for a sum record added without a range; `invalid-range`,
 *   `invalid-bins`, `invalid-argument` for bad values, naming the index.
 * @example
 * damageByRangeBin({ damage: [0.1, 0.3, 0.1], range: [50, 150, 500] }, [0, 100, 200]);
 * // returns { damage: [0.1, 0.3], share: [0.2, 0.6], outsideDamage: 0.1, outsideShare: 0.2, total: 0.5, edges }
 */
export function damageByRangeBin(
  loops: MinerSum | { damage: ArrayLike<number>; range: ArrayLike<number> },
  edges: ArrayLike<number>,
): RangeBinDamage {
  let cols: { damage: ArrayLike<number>; range: ArrayLike<number> };
  if (loops instanceof MinerSum) {
    const missing = loops.firstMissingRange();
    if (missing >= 0) throw new MinerError('missing-range', 'range', undefined, 'the record was added without a range', missing);
    cols = loops.columns();
  } else {
    if (loops === null || typeof loops !== 'object') throw new MinerError('invalid-argument', 'loops', loops, 'must be a MinerSum or { damage, range }');
    cols = loops;
  }
  const n = cols.damage?.length;
  if (typeof n !== 'number') throw new MinerError('invalid-argument', 'damage', cols.damage, 'must be an array-like column of numbers');
  checkLength(cols.range, n, 'range');
  const e = checkEdges(edges, 'edges');
  const bins = e.length - 1;
  const damage = new Float64Array(bins);
  const outside = new NeumaierAdder();
  const total = new NeumaierAdder();
  for (let i = 0; i < n; i++) {
    const d = cols.damage[i];
    const r = cols.range[i];
    checkDamage(d, i);
    checkRange(r, 'range', i);
    total.add(d);
    const j = binIndex(e, r);
    if (j < 0) outside.add(d);
    else damage[j] += d;
  }
  const t = total.valueOf();
  const share = new Float64Array(bins);
  if (t > 0) for (let j = 0; j < bins; j++) share[j] = damage[j] / t;
  const o = outside.valueOf();
  return { edges: e, damage, share, outsideDamage: o, outsideShare: t > 0 ? o / t : 0, total: t };
}
