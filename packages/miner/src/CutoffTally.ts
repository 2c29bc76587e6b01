import { NeumaierAdder } from '@loopwise/base';
import { checkCount, checkLength, checkLife, recordDamage } from './checks';
import { cutoffLimit, type CutoffPolicy } from './CutoffPolicy';
import { MinerError } from './MinerError';

/** What a cut-off did to a set of loops: the value of a {@link CutoffTally}. */
export interface CutoffReport {
  /** The cut-off life in cycles (Infinity for the `'none'` policy). */
  readonly cutoffCycles: number;
  /** Cycles whose finite life lies above the cut-off (they did no damage). */
  readonly removedCount: number;
  /** The damage those cycles would have done without the cut-off, Σ count / Nf. */
  readonly removedDamage: number;
  /** The factor that defines "near": lives in [cutoffCycles / nearFactor, cutoffCycles]. */
  readonly nearFactor: number;
  /** Damage of the cycles whose life is near the cut-off (they damage, but barely survive the cut). */
  readonly nearCutoffDamage: number;
  /** nearCutoffDamage / total damage under the cut-off (0 when the total is 0). */
  readonly nearCutoffShare: number;
}

/** Options of {@link CutoffTally}. */
export interface CutoffTallyOptions {
  /**
   * "Near the cut-off" means a life in [cutoffCycles / nearFactor, cutoffCycles]; a finite
   * number > 1. Default 2 (our choice: common practice, no source).
   */
  nearFactor?: number;
}

/** Loop columns a {@link CutoffTally} reads: cycles and cycles to failure, equal lengths. */
export interface CutoffColumns {
  /** Cycles of each loop (1 full, 0.5 half, times any repeats); finite, ≥ 0. */
  readonly count: ArrayLike<number>;
  /** Cycles to failure Nf (not reversals); > 0, Infinity for no failure. */
  readonly cyclesToFailure: ArrayLike<number>;
}

/**
 * What a cut-off removes from a Palmgren-Miner sum, and how much damage sits just below it,
 * counted loop by loop, over whole columns or piece by piece (`add`, `addColumns`, `merge`):
 *
 *     removed:  Σ n_i and Σ n_i / Nf_i   over the loops with  cutoff < Nf_i < ∞
 *     near:     Σ n_i / Nf_i             over the loops with  cutoff / f ≤ Nf_i ≤ cutoff
 *     share:    near / Σ n_i / Nf_i (Nf_i ≤ cutoff),   f = nearFactor (default 2)
 *
 * A large share near the cut-off means the result depends strongly on where the cut-off is put;
 * the removed damage is what the sum would gain without it. Loops of infinite life (zero range,
 * or a fully compressive loop under SWT) are not counted as removed: they do no damage under any
 * policy. Under the `'none'` policy nothing is removed and nothing is near (everything is 0).
 *
 * Policy: the cut-off itself is a stated policy of the damage sum ({@link CutoffPolicy}, after
 * Haibach's original Miner rule); "near" within a factor 2 is our choice (common practice, no
 * source). Sums use Neumaier's compensation (`NeumaierAdder` of `@loopwise/base`).
 *
 * Merging tallies of consecutive pieces gives the tally of the whole (up to rounding); the
 * pieces must share the cut-off and the near factor.
 *
 * @example
 * const tally = new CutoffTally({ cycles: 1e6 });
 * tally.add(1, 2e6).add(1, 8e5).add(1, 1e3);
 * tally.value().removedDamage;  // returns 5e-7
 * tally.value().nearCutoffDamage; // returns 1.25e-6
 */
export class CutoffTally {
  /** The cut-off life in cycles; Infinity for the `'none'` policy. */
  readonly cutoffCycles: number;
  /** "Near" means a life in [cutoffCycles / nearFactor, cutoffCycles]. */
  readonly nearFactor: number;
  private readonly low: number;
  private readonly removedCount = new NeumaierAdder();
  private readonly removedDamage = new NeumaierAdder();
  private readonly nearDamage = new NeumaierAdder();
  private readonly total = new NeumaierAdder();

  /**
   * @param cutoff the damage sum's cut-off policy, see {@link CutoffPolicy}
   * @throws {MinerError} `invalid-cutoff` for a bad policy; `invalid-argument` for a nearFactor
   *   that is not a finite number > 1.
   */
  constructor(cutoff: CutoffPolicy, options: CutoffTallyOptions = {}) {
    this.cutoffCycles = cutoffLimit(cutoff);
    const f = options.nearFactor ?? 2;
    if (!(f > 1 && f < Infinity)) throw new MinerError('invalid-argument', 'nearFactor', f, 'must be a finite number > 1');
    this.nearFactor = f;
    this.low = this.cutoffCycles / f;
  }

  /**
   * Counts one loop of `count` cycles and life `cyclesToFailure` cycles Nf. Returns this.
   *
   * @throws {MinerError} `invalid-count` (NaN, ±Infinity, negative), `invalid-life` (NaN, ≤ 0, or
   *   a damage that overflows).
   */
  add(count: number, cyclesToFailure: number): this {
    checkCount(count, 'count');
    checkLife(cyclesToFailure, 'cyclesToFailure');
    this.tally(count, cyclesToFailure, undefined);
    return this;
  }

  /**
   * Counts the loops `from` … `to − 1` of `columns` (default all of them). Every row is checked
   * first, naming the row of a bad value; on an error nothing of the call is counted.
   *
   * @throws {MinerError} as {@link CutoffTally.add}, and `invalid-argument` for columns of
   *   different lengths or a bad row range.
   */
  addColumns(columns: CutoffColumns, from = 0, to?: number): this {
    if (columns === null || typeof columns !== 'object') {
      throw new MinerError('invalid-argument', 'columns', columns, 'must be { count, cyclesToFailure }');
    }
    const { count, cyclesToFailure } = columns;
    const n = count?.length;
    if (typeof n !== 'number') throw new MinerError('invalid-argument', 'count', count, 'must be an array-like column of numbers');
    checkLength(cyclesToFailure, n, 'cyclesToFailure');
    const end = to ?? n;
    if (!(Number.isInteger(from) && from >= 0 && from <= n)) {
      throw new MinerError('invalid-argument', 'from', from, `must be an integer in [0, ${n}]`);
    }
    if (!(Number.isInteger(end) && end >= from && end <= n)) {
      throw new MinerError('invalid-argument', 'to', end, `must be an integer in [${from}, ${n}]`);
    }
    const limit = this.cutoffCycles;
    for (let i = from; i < end; i++) {
      checkCount(count[i], 'count', i);
      checkLife(cyclesToFailure[i], 'cyclesToFailure', i);
      if (cyclesToFailure[i] <= limit) recordDamage(count[i], cyclesToFailure[i], limit, i);
    }
    for (let i = from; i < end; i++) this.tally(count[i], cyclesToFailure[i], i);
    return this;
  }

  /**
   * Adds the counts of `other` (e.g. a later piece of the same history). Returns this.
   *
   * @throws {MinerError} `invalid-argument` when `other` is not a CutoffTally or has another
   *   cut-off or near factor.
   */
  merge(other: CutoffTally): this {
    if (!(other instanceof CutoffTally)) throw new MinerError('invalid-argument', 'other', other, 'must be a CutoffTally');
    if (other.cutoffCycles !== this.cutoffCycles) {
      throw new MinerError('invalid-argument', 'other.cutoffCycles', other.cutoffCycles, `must equal this tally's ${this.cutoffCycles}`);
    }
    if (other.nearFactor !== this.nearFactor) {
      throw new MinerError('invalid-argument', 'other.nearFactor', other.nearFactor, `must equal this tally's ${this.nearFactor}`);
    }
    this.removedCount.add(other.removedCount.valueOf());
    this.removedDamage.add(other.removedDamage.valueOf());
    this.nearDamage.add(other.nearDamage.valueOf());
    this.total.add(other.total.valueOf());
    return this;
  }

  /** The report of the loops counted so far (all zero for none). Does not change the tally. */
  value(): CutoffReport {
    const total = this.total.valueOf();
    const near = this.nearDamage.valueOf();
    return {
      cutoffCycles: this.cutoffCycles,
      removedCount: this.removedCount.valueOf(),
      removedDamage: this.removedDamage.valueOf(),
      nearFactor: this.nearFactor,
      nearCutoffDamage: near,
      nearCutoffShare: total > 0 ? near / total : 0,
    };
  }

  private tally(count: number, life: number, index: number | undefined): void {
    if (life > this.cutoffCycles) {
      if (life < Infinity) {
        this.removedCount.add(count);
        this.removedDamage.add(count / life + 0);
      }
      return;
    }
    const d = recordDamage(count, life, this.cutoffCycles, index);
    this.total.add(d);
    if (life >= this.low && life < Infinity) this.nearDamage.add(d);
  }
}
