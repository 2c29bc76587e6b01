import { decodeArray, encodeArray, grownCapacity, RowShare, widenColumn, type EncodedNumber } from '@loopwise/base';
import type { CycleSink } from './CycleSink';
import { CounterStateError, InvalidOptionError, RangeOverflowError } from './errors';

/** The columns of a {@link CycleTable}, each trimmed to `length`. */
export interface CycleColumns {
  /** |to − from|, in the history's unit. */
  range: Float64Array;
  /** (from + to) / 2. */
  mean: Float64Array;
  from: Float64Array;
  to: Float64Array;
  /** 1 for a full cycle, 0.5 for a half cycle. */
  count: Float64Array;
  /** Sample index of `from`, the cycle's first reversal point (b in the four-point rule). */
  startIndex: Float64Array;
  /**
   * Sample index of `to`, the cycle's second reversal point (c): where the loop turns back, the
   * sample notch's loops and miner's attribution also call `turnIndex`.
   */
  turnIndex: Float64Array;
  /** Sample index of the turning point that closed the cycle (`turnIndex` for a half cycle). */
  closeIndex: Float64Array;
}

/** Serialised {@link CycleTable}. */
export interface CycleTableState {
  from: EncodedNumber[];
  to: EncodedNumber[];
  count: EncodedNumber[];
  startIndex: number[];
  turnIndex: number[];
  closeIndex: number[];
}

const NAMES = ['range', 'mean', 'from', 'to', 'count', 'startIndex', 'turnIndex', 'closeIndex'] as const;

/**
 * Growable struct-of-arrays table of cycles: one Float64Array per column, doubled when full, so
 * millions of cycles cost eight doubles each and no objects. Implements {@link CycleSink}.
 * Sample indices are stored as doubles (exact up to 2^53).
 *
 * Honest views: a table's columns are its own. {@link snapshot} makes a table of the rows so far
 * without a copy; the two share storage (base's `RowShare`) until one of them hands out its
 * columns or writes a row where the other can see it, and that one first moves its rows to
 * storage of its own (the last one on the storage keeps it). Writing through one table's columns
 * therefore never changes another table.
 */
export class CycleTable implements CycleSink {
  // one field per column (not an array of columns) keeps every store monomorphic and direct
  private cRange: Float64Array;
  private cMean: Float64Array;
  private cFrom: Float64Array;
  private cTo: Float64Array;
  private cCount: Float64Array;
  private cStart: Float64Array;
  private cTurn: Float64Array;
  private cClose: Float64Array;
  private n = 0;
  // A snapshot's capacity is its row count, so its first add moves it off the shared storage;
  // the table it was taken from keeps its capacity: it only ever adds rows beyond every
  // snapshot's rows, which they do not see.
  private capacity: number;
  private share: RowShare | null = null;

  constructor(initialCapacity = 1024) {
    const cap = Math.max(16, initialCapacity | 0);
    this.capacity = cap;
    this.cRange = new Float64Array(cap);
    this.cMean = new Float64Array(cap);
    this.cFrom = new Float64Array(cap);
    this.cTo = new Float64Array(cap);
    this.cCount = new Float64Array(cap);
    this.cStart = new Float64Array(cap);
    this.cTurn = new Float64Array(cap);
    this.cClose = new Float64Array(cap);
  }

  /** Number of rows (full and half cycles). */
  get length(): number {
    return this.n;
  }

  /** Sum of the count column: full cycles + half cycles / 2. */
  totalCount(): number {
    const c = this.cCount;
    let s = 0;
    for (let i = 0; i < this.n; i++) s += c[i];
    return s;
  }

  addCycle(from: number, to: number, count: number, startIndex: number, turnIndex: number, closeIndex: number): void {
    const range = to > from ? to - from : from - to;
    if (range === Infinity) throw new RangeOverflowError(startIndex, turnIndex, from, to);
    if (this.n === this.capacity) this.grow(this.n + 1);
    const i = this.n++;
    const sum = from + to;
    this.cRange[i] = range;
    this.cMean[i] = sum - sum === 0 ? sum * 0.5 : from * 0.5 + to * 0.5; // no overflow, no subnormal loss
    this.cFrom[i] = from;
    this.cTo[i] = to;
    this.cCount[i] = count;
    this.cStart[i] = startIndex;
    this.cTurn[i] = turnIndex;
    this.cClose[i] = closeIndex;
  }

  /**
   * Multiplies the counts of rows `from` … end by `factor` (finite, > 0): the cycles of one
   * repeat of a block standing for `factor` repeats counted at once.
   */
  scaleCounts(from: number, factor: number): void {
    if (!(factor > 0 && factor < Infinity)) throw new InvalidOptionError('factor', factor, 'must be a finite number > 0');
    // a snapshot sharing the rows keeps its counts: this table moves to rows of its own first
    if (this.share !== null) this.own();
    const c = this.cCount;
    for (let i = Math.max(0, from); i < this.n; i++) c[i] *= factor;
  }

  /** Appends every row of another table (or of this one), in its order. */
  appendTable(other: CycleTable): void {
    const m = other.n;
    for (let i = 0; i < m; i++) this.copyRow(other, i);
  }

  /** Copies row `i` of `other` to the end of this table. */
  copyRow(other: CycleTable, i: number): void {
    if (this.n === this.capacity) this.grow(this.n + 1);
    const j = this.n++;
    this.cRange[j] = other.cRange[i];
    this.cMean[j] = other.cMean[i];
    this.cFrom[j] = other.cFrom[i];
    this.cTo[j] = other.cTo[i];
    this.cCount[j] = other.cCount[i];
    this.cStart[j] = other.cStart[i];
    this.cTurn[j] = other.cTurn[i];
    this.cClose[j] = other.cClose[i];
  }

  /** Removes every row (a snapshot taken before keeps them). */
  clear(): void {
    if (this.share !== null) {
      // rows added after a clear would overwrite rows a snapshot still shows
      if (this.share.leave()) this.capacity = 0;
      this.share = null;
    }
    this.n = 0;
  }

  /**
   * A table of the rows so far, in O(1): it shares this table's storage until one of the two
   * hands out its columns, clears or adds a row the other could see; that one then moves its
   * rows to storage of its own first. Rows added to this table later are not in the snapshot.
   *
   * @example
   * const t = new CycleTable();
   * t.addCycle(0, 2, 0.5, 0, 1, 1);
   * const s = t.snapshot();
   * t.columns().range.fill(-1);
   * s.row(0).range; // returns 2
   */
  snapshot(): CycleTable {
    const t = new CycleTable(0);
    t.cRange = this.cRange;
    t.cMean = this.cMean;
    t.cFrom = this.cFrom;
    t.cTo = this.cTo;
    t.cCount = this.cCount;
    t.cStart = this.cStart;
    t.cTurn = this.cTurn;
    t.cClose = this.cClose;
    t.n = this.n;
    t.capacity = this.n;
    if (this.share === null) this.share = new RowShare(1);
    this.share.join();
    t.share = this.share;
    return t;
  }

  /**
   * Views of the columns, trimmed to the row count (no copy; valid until the next add). They
   * are this table's alone: writing them changes this table and no other (a table that shares
   * its storage with a snapshot moves its rows to storage of its own first).
   */
  columns(): CycleColumns {
    if (this.share !== null) this.own();
    const n = this.n;
    return {
      range: this.cRange.subarray(0, n),
      mean: this.cMean.subarray(0, n),
      from: this.cFrom.subarray(0, n),
      to: this.cTo.subarray(0, n),
      count: this.cCount.subarray(0, n),
      startIndex: this.cStart.subarray(0, n),
      turnIndex: this.cTurn.subarray(0, n),
      closeIndex: this.cClose.subarray(0, n),
    };
  }

  /** Row `i` as an object (for tests and small reports; not for hot loops). */
  row(i: number): { [K in (typeof NAMES)[number]]: number } {
    if (!(i >= 0 && i < this.n)) throw new RangeError(`row ${i} is outside 0..${this.n - 1}`);
    return {
      range: this.cRange[i],
      mean: this.cMean[i],
      from: this.cFrom[i],
      to: this.cTo[i],
      count: this.cCount[i],
      startIndex: this.cStart[i],
      turnIndex: this.cTurn[i],
      closeIndex: this.cClose[i],
    };
  }

  /** Feeds every row, in order, to another sink. */
  replayInto(sink: CycleSink): void {
    for (let i = 0; i < this.n; i++) {
      sink.addCycle(this.cFrom[i], this.cTo[i], this.cCount[i], this.cStart[i], this.cTurn[i], this.cClose[i]);
    }
  }

  toJSON(): CycleTableState {
    const n = this.n;
    return {
      from: encodeArray(this.cFrom, n),
      to: encodeArray(this.cTo, n),
      count: encodeArray(this.cCount, n),
      startIndex: Array.from(this.cStart.subarray(0, n)),
      turnIndex: Array.from(this.cTurn.subarray(0, n)),
      closeIndex: Array.from(this.cClose.subarray(0, n)),
    };
  }

  static fromJSON(state: CycleTableState): CycleTable {
    if (state === null || typeof state !== 'object') throw new CounterStateError('cycles', state, 'cycle table state must be an object');
    const from = decodeArray(state.from, 'cycles.from');
    const to = decodeArray(state.to, 'cycles.to');
    const count = decodeArray(state.count, 'cycles.count');
    const s = decodeArray(state.startIndex, 'cycles.startIndex');
    const e = decodeArray(state.turnIndex, 'cycles.turnIndex');
    const k = decodeArray(state.closeIndex, 'cycles.closeIndex');
    const n = from.length;
    const others = { to, count, startIndex: s, turnIndex: e, closeIndex: k };
    for (const [name, column] of Object.entries(others)) {
      if (column.length !== n) {
        throw new CounterStateError(`cycles.${name}`, column.length, `cycle table state has columns of different lengths: cycles.from has ${n}, cycles.${name} ${column.length}`);
      }
    }
    const t = new CycleTable(n);
    for (let i = 0; i < n; i++) t.addCycle(from[i], to[i], count[i], s[i], e[i], k[i]);
    return t;
  }

  /** Leaves a shared storage, moving the rows to storage of its own when another table still uses it. */
  private own(): void {
    const share = this.share as RowShare;
    this.share = null;
    if (share.leave()) this.moveRows(Math.max(16, this.n));
  }

  /** Moves the rows to columns with room for at least `needed` rows (doubling). */
  private grow(needed: number): void {
    if (this.share !== null) {
      // the rows move to new storage anyway: this table leaves the shared one without a second copy
      this.share.leave();
      this.share = null;
    }
    this.moveRows(grownCapacity(this.capacity, needed));
  }

  private moveRows(cap: number): void {
    const n = this.n;
    this.cRange = widenColumn(this.cRange, n, cap);
    this.cMean = widenColumn(this.cMean, n, cap);
    this.cFrom = widenColumn(this.cFrom, n, cap);
    this.cTo = widenColumn(this.cTo, n, cap);
    this.cCount = widenColumn(this.cCount, n, cap);
    this.cStart = widenColumn(this.cStart, n, cap);
    this.cTurn = widenColumn(this.cTurn, n, cap);
    this.cClose = widenColumn(this.cClose, n, cap);
    this.capacity = cap;
  }
}
