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
  /** Sample index of the sample at which the path reached the memory point again. */
  closeIndex: Float64Array;
  /** Cycle count of the loop: 1 for a closed loop. */
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

  /** Number of loops. */
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

  /** Appends rows `from` … `to − 1` of another table. */
  appendRange(other: LoopTable, from: number, to: number): void {
    if (to <= from) return;
    const n = this.n;
    if (this.capacity < n + (to - from)) this.grow(Math.max(2 * this.capacity, n + (to - from)));
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

  /** Views of the columns, trimmed to `length` (no copy; valid until the next `add`). */
  columns(): LoopColumns {
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
   * Rows `from` … `to − 1` of `other` as a table that shares its storage (internal: the repeating
   * shortcut hands out both passes without copying). Reading costs nothing; the first row added
   * or appended moves the rows to storage of their own first, so neither table ever sees rows
   * the other adds later.
   */
  static view(other: LoopTable, from: number, to: number): LoopTable {
    const t = new LoopTable(16);
    t.cStressMax = other.cStressMax.subarray(from, to);
    t.cStressMin = other.cStressMin.subarray(from, to);
    t.cStrainMax = other.cStrainMax.subarray(from, to);
    t.cStrainMin = other.cStrainMin.subarray(from, to);
    t.cStart = other.cStart.subarray(from, to);
    t.cTurn = other.cTurn.subarray(from, to);
    t.cClose = other.cClose.subarray(from, to);
    t.cCount = other.cCount.subarray(from, to);
    t.n = to - from;
    t.capacity = to - from;
    return t;
  }

  /** Makes room for `rows` rows in all (internal: lets a caller that can estimate its size skip the doublings). */
  reserve(rows: number): void {
    if (rows > this.capacity) this.grow(rows);
  }

  /** Moves the rows in use to columns of capacity `cap`. */
  private grow(cap: number): void {
    const n = this.n;
    const widen = (a: Float64Array) => {
      const b = new Float64Array(cap);
      b.set(a.subarray(0, n));
      return b;
    };
    this.cStressMax = widen(this.cStressMax);
    this.cStressMin = widen(this.cStressMin);
    this.cStrainMax = widen(this.cStrainMax);
    this.cStrainMin = widen(this.cStrainMin);
    this.cStart = widen(this.cStart);
    this.cTurn = widen(this.cTurn);
    this.cClose = widen(this.cClose);
    this.cCount = widen(this.cCount);
    this.capacity = cap;
  }
}
