import { grownCapacity, RowShare, widenColumn } from '@loopwise/base';

/** The columns of a {@link LoopTable}, each trimmed to its length. */
export interface LoopColumns {
  /** Largest local stress of the loop. */
  stressMax: Float64Array;
  /** Smallest local stress of the loop. */
  stressMin: Float64Array;
  /** Largest local strain of the loop. */
  strainMax: Float64Array;
  /** Smallest local strain of the loop. */
  strainMin: Float64Array;
  /** Sample index of the reversal where the loop started (the memory point it closes on). */
  startIndex: Float64Array;
  /** Sample index of the reversal where it turned. */
  turnIndex: Float64Array;
  /** Sample index of the point at which the path reached the memory point again. */
  closeIndex: Float64Array;
  /** Loops the row stands for: 1 for a closed loop, more for a loop of an event's repeats. */
  count: Float64Array;
}

/** One row of a {@link LoopTable}. */
export interface LoopRow {
  stressMax: number;
  stressMin: number;
  strainMax: number;
  strainMin: number;
  startIndex: number;
  turnIndex: number;
  closeIndex: number;
  count: number;
}

/**
 * Growable struct-of-arrays table of closed hysteresis loops: eight Float64Array columns,
 * doubled when full; no objects per loop. Indices are stored as doubles (exact up to 2^53).
 *
 * Honest: the columns a table hands out belong to it alone. Tables made by {@link LoopTable.split}
 * start on one storage; each moves its rows to storage of its own before it hands out columns
 * or adds a row while another table still uses that storage.
 */
export class LoopTable {
  // One field per column (not an array of columns): every store in `add` is then a direct,
  // monomorphic typed-array store instead of a load of the column array first.
  private cStressMax: Float64Array;
  private cStressMin: Float64Array;
  private cStrainMax: Float64Array;
  private cStrainMin: Float64Array;
  private cStart: Float64Array;
  private cTurn: Float64Array;
  private cClose: Float64Array;
  private cCount: Float64Array;
  private n = 0;
  private capacity = 0;
  private share: RowShare | null = null;

  constructor(initialCapacity = 256) {
    const cap = Math.max(16, initialCapacity | 0);
    this.capacity = cap;
    this.cStressMax = new Float64Array(cap);
    this.cStressMin = new Float64Array(cap);
    this.cStrainMax = new Float64Array(cap);
    this.cStrainMin = new Float64Array(cap);
    this.cStart = new Float64Array(cap);
    this.cTurn = new Float64Array(cap);
    this.cClose = new Float64Array(cap);
    this.cCount = new Float64Array(cap);
  }

  /** Number of rows. */
  get length(): number {
    return this.n;
  }

  /** Sum of the count column. */
  totalCount(): number {
    const c = this.cCount;
    let s = 0;
    for (let i = 0; i < this.n; i++) s += c[i];
    return s;
  }

  /** Appends a loop from its two reversal points. */
  add(
    stressA: number,
    strainA: number,
    stressB: number,
    strainB: number,
    startIndex: number,
    turnIndex: number,
    closeIndex: number,
    count: number,
  ): void {
    if (this.n === this.capacity) this.grow(Math.max(16, 2 * this.capacity));
    const i = this.n++;
    if (stressA >= stressB) {
      this.cStressMax[i] = stressA;
      this.cStressMin[i] = stressB;
    } else {
      this.cStressMax[i] = stressB;
      this.cStressMin[i] = stressA;
    }
    if (strainA >= strainB) {
      this.cStrainMax[i] = strainA;
      this.cStrainMin[i] = strainB;
    } else {
      this.cStrainMax[i] = strainB;
      this.cStrainMin[i] = strainA;
    }
    this.cStart[i] = startIndex;
    this.cTurn[i] = turnIndex;
    this.cClose[i] = closeIndex;
    this.cCount[i] = count;
  }

  /** Appends rows `from` … `to − 1` of another table (a copy). */
  appendRange(other: LoopTable, from: number, to: number): void {
    if (to <= from) return;
    const n = this.n;
    if (this.share !== null || this.capacity < n + (to - from)) this.grow(grownCapacity(this.capacity, n + (to - from)));
    this.cStressMax.set(other.cStressMax.subarray(from, to), n);
    this.cStressMin.set(other.cStressMin.subarray(from, to), n);
    this.cStrainMax.set(other.cStrainMax.subarray(from, to), n);
    this.cStrainMin.set(other.cStrainMin.subarray(from, to), n);
    this.cStart.set(other.cStart.subarray(from, to), n);
    this.cTurn.set(other.cTurn.subarray(from, to), n);
    this.cClose.set(other.cClose.subarray(from, to), n);
    this.cCount.set(other.cCount.subarray(from, to), n);
    this.n = n + (to - from);
  }

  /**
   * Multiplies the count of rows `from` … `to − 1` by `factor`: each row then stands for that
   * many identical loops (the loops of an event's repeats once the memory repeats).
   */
  scaleCounts(from: number, to: number, factor: number): void {
    if (this.share !== null) this.own();
    const c = this.cCount;
    for (let i = from; i < to; i++) c[i] *= factor;
  }

  /**
   * Views of the columns, trimmed to `length` (no copy; valid until the next `add`). They belong
   * to this table alone: a table that shared its storage moves its rows first.
   */
  columns(): LoopColumns {
    if (this.share !== null) this.own();
    const n = this.n;
    return {
      stressMax: this.cStressMax.subarray(0, n),
      stressMin: this.cStressMin.subarray(0, n),
      strainMax: this.cStrainMax.subarray(0, n),
      strainMin: this.cStrainMin.subarray(0, n),
      startIndex: this.cStart.subarray(0, n),
      turnIndex: this.cTurn.subarray(0, n),
      closeIndex: this.cClose.subarray(0, n),
      count: this.cCount.subarray(0, n),
    };
  }

  /** Row `i` as an object. */
  row(i: number): LoopRow {
    return {
      stressMax: this.cStressMax[i],
      stressMin: this.cStressMin[i],
      strainMax: this.cStrainMax[i],
      strainMin: this.cStrainMin[i],
      startIndex: this.cStart[i],
      turnIndex: this.cTurn[i],
      closeIndex: this.cClose[i],
      count: this.cCount[i],
    };
  }

  /** Every row as objects (for small results, printing and tests). */
  toRows(): LoopRow[] {
    const out: LoopRow[] = [];
    for (let i = 0; i < this.n; i++) out.push(this.row(i));
    return out;
  }

  /**
   * Splits a table into tables of the given row ranges `[from, to)` (they may overlap), without
   * a copy up front: the new tables start on the source's storage, and each moves its rows to
   * storage of its own the first time it hands out columns or adds a row while another of them
   * still uses the storage (the last one keeps it). The source hands its storage over and is
   * empty afterwards. Writing through one table's columns therefore never changes another.
   *
   * @example
   * const [a, b] = LoopTable.split(table, [[0, 10], [5, 20]]);
   * a.columns().count.fill(0); // b's rows 0…4 (the source's 5…9) keep their counts
   */
  static split(source: LoopTable, ranges: readonly (readonly [number, number])[]): LoopTable[] {
    const share = ranges.length > 1 ? new RowShare(ranges.length) : null;
    const out = ranges.map(([from, to]) => {
      const t = new LoopTable(16);
      t.cStressMax = source.cStressMax.subarray(from, to);
      t.cStressMin = source.cStressMin.subarray(from, to);
      t.cStrainMax = source.cStrainMax.subarray(from, to);
      t.cStrainMin = source.cStrainMin.subarray(from, to);
      t.cStart = source.cStart.subarray(from, to);
      t.cTurn = source.cTurn.subarray(from, to);
      t.cClose = source.cClose.subarray(from, to);
      t.cCount = source.cCount.subarray(from, to);
      t.n = to - from;
      t.capacity = to - from;
      t.share = share;
      return t;
    });
    source.clear();
    return out;
  }

  /** Makes room for `rows` rows in all (skips the doublings when the size can be estimated). */
  reserve(rows: number): void {
    if (rows > this.capacity) this.grow(rows);
  }

  /** Empties the table onto new storage of its own. */
  private clear(): void {
    const z = new Float64Array(16);
    this.cStressMax = z;
    this.cStressMin = z.slice();
    this.cStrainMax = z.slice();
    this.cStrainMin = z.slice();
    this.cStart = z.slice();
    this.cTurn = z.slice();
    this.cClose = z.slice();
    this.cCount = z.slice();
    this.n = 0;
    this.capacity = 16;
    this.share = null;
  }

  /** Leaves a shared storage: copies the rows when another table still uses it. */
  private own(): void {
    const share = this.share!;
    this.share = null;
    if (share.leave()) this.grow(Math.max(16, this.n));
  }

  /** Moves the rows in use to columns of capacity `cap` (and off any shared storage). */
  private grow(cap: number): void {
    if (this.share !== null) {
      // leaving the shared storage: this table copies now, whoever else holds it
      this.share.leave();
      this.share = null;
    }
    const n = this.n;
    this.cStressMax = widenColumn(this.cStressMax, n, cap);
    this.cStressMin = widenColumn(this.cStressMin, n, cap);
    this.cStrainMax = widenColumn(this.cStrainMax, n, cap);
    this.cStrainMin = widenColumn(this.cStrainMin, n, cap);
    this.cStart = widenColumn(this.cStart, n, cap);
    this.cTurn = widenColumn(this.cTurn, n, cap);
    this.cClose = widenColumn(this.cClose, n, cap);
    this.cCount = widenColumn(this.cCount, n, cap);
    this.capacity = cap;
  }
}
