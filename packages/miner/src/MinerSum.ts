import { NeumaierAdder } from '@loopwise/base';
import { checkCount, checkIndex, checkLength, checkLife, checkRange, recordDamage } from './checks';
import { cutoffLimit, type CutoffPolicy } from './CutoffPolicy';
import { CutoffTally, type CutoffReport } from './CutoffTally';
import { lifeFromDamage, type LifeEstimate, type LifeOptions } from './lifeFromDamage';
import { MinerError } from './MinerError';

/** Options of {@link MinerSum}. */
export interface MinerSumOptions {
  /** Cut-off policy, see {@link CutoffPolicy}. Default `'none'`: every cycle damages. */
  cutoff?: CutoffPolicy;
  /** Rows to reserve before the first growth. Default 1024. */
  initialCapacity?: number;
}

/**
 * The records of a {@link MinerSum} as typed-array views trimmed to its length (no copy; valid
 * until the next add). One row per added record, in the order added.
 */
export interface MinerColumns {
  /** Cycles of the record: 1 for a full cycle, 0.5 for a half cycle (times any repeats). */
  count: Float64Array;
  /** Cycles to failure Nf (not reversals); Infinity for no failure. */
  cyclesToFailure: Float64Array;
  /** Damage of the record after the cut-off: count / Nf, or 0. */
  damage: Float64Array;
  /** Sample index of the record's first reversal. */
  startIndex: Float64Array;
  /** Sample index of its second reversal point, where the loop turned. */
  turnIndex: Float64Array;
  /** The loop's range in the caller's quantity (load, stress, strain), NaN where none was given. */
  range: Float64Array;
}

/** Input columns of {@link MinerSum.addColumns}: equal lengths, `range` optional. */
export interface CycleRecordColumns {
  count: ArrayLike<number>;
  cyclesToFailure: ArrayLike<number>;
  startIndex: ArrayLike<number>;
  turnIndex: ArrayLike<number>;
  range?: ArrayLike<number>;
}

const COLS = 6; // count, cyclesToFailure, damage, startIndex, turnIndex, range

/**
 * A Palmgren-Miner damage sum over the loops of one repeat of a history:
 *
 *     D = Σ n_i / Nf_i,       life in repeats L = Dcrit / D
 *
 * with n_i the cycles of loop i (1 full, 0.5 half) and Nf_i its cycles to failure (not
 * reversals). Each record keeps its two reversal sample indices (for the damage timeline and
 * damage by event, which give half of a loop's damage to each reversal) and optionally its range
 * (for damage by range bin and the damage-equivalent range). Records live in growable
 * struct-of-arrays Float64Array columns: six doubles a record, no object per loop.
 *
 * References: A. Palmgren, "Die Lebensdauer von Kugellagern", Z. VDI 68 (1924) 339-341;
 * M. A. Miner, "Cumulative damage in fatigue", J. Appl. Mech. 12 (1945) A159-A164.
 *
 * Assumptions: linear damage accumulation, no sequence effect beyond what produced the loops
 * (the local stress-strain tracker's memory, mean stress in Nf). See {@link lifeFromDamage} on
 * Dcrit and scatter factors.
 *
 * @example
 * const sum = new MinerSum();
 * sum.addCycles(1, 1000, 10, 20);       // a full cycle of life 1000 cycles, reversals at samples 10 and 20
 * sum.addReversals(0.5, 2000, 20, 35);  // a half cycle of life 2000 reversals (1000 cycles)
 * sum.damage();                          // returns 0.0015
 * sum.life({ unit: { label: 'h', perRepeat: 2 } }).service; // returns 1333.33... (hours)
 */
export class MinerSum {
  /** The cut-off life in cycles; Infinity for the `'none'` policy. */
  readonly cutoffCycles: number;
  private cols: Float64Array[];
  private n = 0;
  private total = new NeumaierAdder();
  private missingRange = -1; // first row without a range, or -1

  constructor(options: MinerSumOptions = {}) {
    this.cutoffCycles = cutoffLimit(options.cutoff);
    const want = options.initialCapacity ?? 1024;
    if (!(want >= 0 && want < 2 ** 32)) {
      throw new MinerError('invalid-argument', 'initialCapacity', want, 'must be a number in [0, 2^32)');
    }
    const cap = Math.max(16, want | 0);
    this.cols = Array.from({ length: COLS }, () => new Float64Array(cap));
  }

  /** Number of records. */
  get length(): number {
    return this.n;
  }

  /**
   * Adds `count` cycles of life `cyclesToFailure` cycles Nf whose reversals are at samples
   * `startIndex` and `turnIndex`, with an optional `range` (any order of the indices; a half
   * cycle has count 0.5). Returns the damage added, count / Nf, or 0 beyond the cut-off.
   *
   * @throws {MinerError} `invalid-count` (NaN, ±Infinity, negative), `invalid-life` (NaN, ≤ 0,
   *   or damage that overflows), `invalid-index` (not a finite integer ≥ 0), `invalid-range`.
   * @example
   * new MinerSum({ cutoff: { cycles: 1e6 } }).addCycles(1, 2e6, 0, 7); // returns 0 (beyond the cut-off)
   */
  addCycles(count: number, cyclesToFailure: number, startIndex: number, turnIndex: number, range?: number): number {
    checkCount(count, 'count');
    checkLife(cyclesToFailure, 'cyclesToFailure');
    checkIndex(startIndex, 'startIndex');
    checkIndex(turnIndex, 'turnIndex');
    if (range !== undefined) checkRange(range, 'range');
    const d = recordDamage(count, cyclesToFailure, this.cutoffCycles);
    this.push(count, cyclesToFailure, d, startIndex, turnIndex, range);
    return d;
  }

  /**
   * As {@link MinerSum.addCycles} with the life given in reversals 2Nf (what strain-life solves
   * return): Nf = reversalsToFailure / 2. Returns the damage added.
   *
   * @example
   * new MinerSum().addReversals(1, 2000, 0, 1); // returns 0.001 (1 cycle of 1000 cycles)
   */
  addReversals(count: number, reversalsToFailure: number, startIndex: number, turnIndex: number, range?: number): number {
    checkLife(reversalsToFailure, 'reversalsToFailure');
    return this.addCycles(count, reversalsToFailure / 2, startIndex, turnIndex, range);
  }

  /**
   * Adds every row of typed-array (or plain array) columns in one pass: `count` (cycles),
   * `cyclesToFailure` (cycles Nf), `startIndex`, `turnIndex`, optional `range`. Validates each
   * row as {@link MinerSum.addCycles} does and names the row of a bad value; on an error no row
   * of the call is kept.
   *
   * @example
   * new MinerSum().addColumns({ count: [1, 1], cyclesToFailure: [1e3, 1e4], startIndex: [0, 2], turnIndex: [1, 3] }).damage();
   * // returns 0.0011
   */
  addColumns(columns: CycleRecordColumns): this {
    if (columns === null || typeof columns !== 'object') throw new MinerError('invalid-argument', 'columns', columns, 'must be an object of columns');
    const { count, cyclesToFailure, startIndex, turnIndex, range } = columns;
    const m = count?.length;
    if (typeof m !== 'number') throw new MinerError('invalid-argument', 'count', count, 'must be an array-like column of numbers');
    checkLength(cyclesToFailure, m, 'cyclesToFailure');
    checkLength(startIndex, m, 'startIndex');
    checkLength(turnIndex, m, 'turnIndex');
    if (range !== undefined) checkLength(range, m, 'range');
    for (let i = 0; i < m; i++) {
      checkCount(count[i], 'count', i);
      checkLife(cyclesToFailure[i], 'cyclesToFailure', i);
      checkIndex(startIndex[i], 'startIndex', i);
      checkIndex(turnIndex[i], 'turnIndex', i);
      if (range !== undefined) checkRange(range[i], 'range', i);
      if (cyclesToFailure[i] <= this.cutoffCycles) recordDamage(count[i], cyclesToFailure[i], this.cutoffCycles, i);
    }
    for (let i = 0; i < m; i++) {
      const d = recordDamage(count[i], cyclesToFailure[i], this.cutoffCycles, i);
      this.push(count[i], cyclesToFailure[i], d, startIndex[i], turnIndex[i], range === undefined ? undefined : range[i]);
    }
    return this;
  }

  /**
   * Appends every record of `other` with its count multiplied by `repeats` (e.g. an event's
   * repeat count in a duty cycle), its damage recomputed under this sum's cut-off. Indices are
   * kept as they are.
   *
   * @throws {MinerError} `invalid-repeats` when `repeats` is zero, negative or not finite.
   * @example
   * const event = new MinerSum(); event.addCycles(1, 1e4, 0, 1);
   * new MinerSum().addSum(event, 3).damage(); // returns 0.0003
   */
  addSum(other: MinerSum, repeats = 1): this {
    if (!(other instanceof MinerSum)) throw new MinerError('invalid-argument', 'other', other, 'must be a MinerSum');
    if (!(repeats > 0 && repeats < Infinity)) {
      throw new MinerError('invalid-repeats', 'repeats', repeats, 'must be a finite number > 0');
    }
    const o = other.cols;
    const m = other.n;
    for (let i = 0; i < m; i++) {
      const c = o[0][i] * repeats;
      checkCount(c, 'count × repeats', i);
      if (o[1][i] <= this.cutoffCycles) recordDamage(c, o[1][i], this.cutoffCycles, i);
    }
    for (let i = 0; i < m; i++) {
      const c = o[0][i] * repeats;
      const r = o[5][i];
      this.push(c, o[1][i], recordDamage(c, o[1][i], this.cutoffCycles, i), o[3][i], o[4][i], r === r ? r : undefined);
    }
    return this;
  }

  /** Total damage D of the records (per repeat of the history they came from). 0 when empty. */
  damage(): number {
    return this.total.valueOf();
  }

  /** The records as typed-array views, see {@link MinerColumns}. */
  columns(): MinerColumns {
    const v = (k: number) => this.cols[k].subarray(0, this.n);
    return { count: v(0), cyclesToFailure: v(1), damage: v(2), startIndex: v(3), turnIndex: v(4), range: v(5) };
  }

  /** Index of the first record added without a range, or -1 when every record has one. */
  firstMissingRange(): number {
    return this.missingRange;
  }

  /**
   * Life from this sum's damage per repeat: `lifeFromDamage(this.damage(), options)`, i.e.
   * repeats = Dcrit / D, design repeats = repeats / scatter factor, and both in the user's unit
   * when `unit` is given. See {@link lifeFromDamage}.
   *
   * @example
   * const sum = new MinerSum(); sum.addCycles(2, 1e4, 0, 1);
   * sum.life({ scatterFactor: 4 }).designRepeats; // returns 1250
   */
  life(options: LifeOptions = {}): LifeEstimate {
    return lifeFromDamage(this.damage(), options);
  }

  /**
   * What the cut-off removed and how much damage sits just below it: cycles with a finite life
   * above the cut-off (their count and the damage they would have done), and the damage of
   * cycles whose life lies in [cutoffCycles / nearFactor, cutoffCycles] with its share of the
   * total. A large share near the cut-off means the result depends strongly on where the cut-off
   * is put. For the `'none'` policy everything is 0. The same count as a {@link CutoffTally} over
   * this sum's records (the one definition; use the tally for loops that are not kept).
   *
   * @param nearFactor finite number > 1; default 2 (our choice, common practice, no source).
   * @example
   * const sum = new MinerSum({ cutoff: { cycles: 1e6 } });
   * sum.addCycles(1, 2e6, 0, 1); sum.addCycles(1, 8e5, 1, 2);
   * sum.cutoffReport().removedDamage; // returns 5e-7
   */
  cutoffReport(nearFactor = 2): CutoffReport {
    const policy: CutoffPolicy = this.cutoffCycles === Infinity ? 'none' : { cycles: this.cutoffCycles };
    return new CutoffTally(policy, { nearFactor }).addColumns(this.columns()).value();
  }

  /** Removes every record. */
  clear(): void {
    this.n = 0;
    this.total = new NeumaierAdder();
    this.missingRange = -1;
  }

  private push(count: number, life: number, damage: number, start: number, end: number, range: number | undefined): void {
    if (this.n === this.cols[0].length) this.grow();
    const i = this.n++;
    const c = this.cols;
    c[0][i] = count;
    c[1][i] = life;
    c[2][i] = damage;
    c[3][i] = start;
    c[4][i] = end;
    if (range === undefined) {
      c[5][i] = NaN;
      if (this.missingRange < 0) this.missingRange = i;
    } else c[5][i] = range;
    this.total.add(damage);
  }

  private grow(): void {
    this.cols = this.cols.map((a) => {
      const b = new Float64Array(a.length * 2);
      b.set(a);
      return b;
    });
  }
}
