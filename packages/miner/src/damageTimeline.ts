import { checkIndex } from './checks';
import { checkDamage, loopColumns, type LoopDamageColumns } from './LoopDamageColumns';
import { MinerError } from './MinerError';
import type { MinerSum } from './MinerSum';

/** Options of {@link damageTimeline}. */
export interface TimelineOptions {
  /** Samples per bin, an integer ≥ 1. Bin k holds sample indices [k·binSize, (k+1)·binSize). */
  binSize: number;
  /**
   * Samples in the history (integer ≥ 1); the timeline has ceil(sampleCount / binSize) bins and
   * every reversal index must be below it. Default: the largest reversal index + 1 (1 when there
   * are no loops).
   */
  sampleCount?: number;
  /** Caller-owned output with at least the number of bins; overwritten and returned (trimmed view). */
  out?: Float64Array;
}

/**
 * Damage timeline: the damage of each loop split half to the bin of its first reversal and half
 * to the bin of its second, by sample index,
 *
 *     T[k] = Σ_i d_i/2 · ([s_i ∈ bin k] + [t_i ∈ bin k])
 *
 * so that Σ_k T[k] = Σ_i d_i, the total damage (up to rounding). Where in the history the damage
 * is done, at the resolution of `binSize` samples. One pass over the loops, no allocation beyond
 * the output.
 *
 * Reference: the half-per-reversal rule is our convention (a loop is closed by two reversals and
 * the damage is not localised further by Palmgren (1924) or Miner (1945)); common practice, no
 * source.
 *
 * Special cases: no loops give a timeline of zeros; a loop with both reversals in one bin puts
 * all of its damage there.
 *
 * @throws {MinerError} `invalid-argument` for a bad `binSize`, `sampleCount`, `out` or damage value;
 *   `invalid-index` for a reversal index that is not a finite integer ≥ 0 or not below `sampleCount`.
 * @example
 * damageTimeline({ damage: [0.2, 0.1], startIndex: [0, 5], turnIndex: [9, 6] }, { binSize: 5 });
 * // returns Float64Array [0.1, 0.2]
 */
export function damageTimeline(loops: MinerSum | LoopDamageColumns, options: TimelineOptions): Float64Array {
  const { damage, startIndex, turnIndex } = loopColumns(loops);
  const binSize = options?.binSize;
  if (!(Number.isInteger(binSize) && binSize >= 1)) {
    throw new MinerError('invalid-argument', 'binSize', binSize, 'must be an integer >= 1 (samples per bin)');
  }
  const n = damage.length;
  let samples = options.sampleCount;
  if (samples === undefined) {
    samples = 1;
    for (let i = 0; i < n; i++) {
      checkIndex(startIndex[i], 'startIndex', i);
      checkIndex(turnIndex[i], 'turnIndex', i);
      samples = Math.max(samples, startIndex[i] + 1, turnIndex[i] + 1);
    }
  } else if (!(Number.isInteger(samples) && samples >= 1)) {
    throw new MinerError('invalid-argument', 'sampleCount', samples, 'must be an integer >= 1');
  }
  const bins = Math.ceil(samples / binSize);
  let out: Float64Array;
  if (options.out !== undefined) {
    if (!(options.out instanceof Float64Array) || options.out.length < bins) {
      throw new MinerError('invalid-argument', 'out', options.out?.length, `must be a Float64Array of length >= ${bins}`);
    }
    out = options.out.subarray(0, bins);
    out.fill(0);
  } else out = new Float64Array(bins);
  for (let i = 0; i < n; i++) {
    const d = damage[i];
    const s = startIndex[i];
    const e = turnIndex[i];
    checkDamage(d, i);
    checkIndex(s, 'startIndex', i);
    checkIndex(e, 'turnIndex', i);
    if (s >= samples) throw new MinerError('invalid-index', 'startIndex', s, `must be below sampleCount ${samples}`, i);
    if (e >= samples) throw new MinerError('invalid-index', 'turnIndex', e, `must be below sampleCount ${samples}`, i);
    const half = d * 0.5;
    out[Math.floor(s / binSize)] += half;
    out[Math.floor(e / binSize)] += half;
  }
  return out;
}
