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

const NAMES = ['stressMax', 'stressMin', 'strainMax', 'strainMin', 'startIndex', 'turnIndex', 'closeIndex', 'count'] as const;

/**
 * Growable struct-of-arrays table of closed hysteresis loops: eight Float64Array columns,
 * doubled when full; no objects per loop. Indices are stored as doubles (exact up to 2^53).
 */
export class LoopTable {
  private cols: Float64Array[];
  private n = 0;

  constructor(initialCapacity = 256) {
    const cap = Math.max(16, initialCapacity | 0);
    this.cols = NAMES.map(() => new Float64Array(cap));
  }

  /** Number of loops. */
  get length(): number {
    return this.n;
  }

  /** Sum of the count column. */
  totalCount(): number {
    const c = this.cols[7];
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
    if (this.n === this.cols[0].length) this.grow();
    const i = this.n++;
    const c = this.cols;
    if (stressA >= stressB) {
      c[0][i] = stressA;
      c[1][i] = stressB;
    } else {
      c[0][i] = stressB;
      c[1][i] = stressA;
    }
    if (strainA >= strainB) {
      c[2][i] = strainA;
      c[3][i] = strainB;
    } else {
      c[2][i] = strainB;
      c[3][i] = strainA;
    }
    c[4][i] = startIndex;
    c[5][i] = turnIndex;
    c[6][i] = closeIndex;
    c[7][i] = count;
  }

  /** Appends rows `from` … `to − 1` of another table. */
  appendRange(other: LoopTable, from: number, to: number): void {
    if (to <= from) return;
    while (this.cols[0].length < this.n + (to - from)) this.grow();
    for (let k = 0; k < NAMES.length; k++) this.cols[k].set(other.cols[k].subarray(from, to), this.n);
    this.n += to - from;
  }

  /** Views of the columns, trimmed to `length` (no copy; valid until the next `add`). */
  columns(): LoopColumns {
    const out = {} as Record<(typeof NAMES)[number], Float64Array>;
    NAMES.forEach((name, k) => (out[name] = this.cols[k].subarray(0, this.n)));
    return out;
  }

  /** Row `i` as an object. */
  row(i: number): LoopRow {
    const out = {} as Record<(typeof NAMES)[number], number>;
    NAMES.forEach((name, k) => (out[name] = this.cols[k][i]));
    return out;
  }

  /** Every row as objects (for small results, printing and tests). */
  toRows(): LoopRow[] {
    const out: LoopRow[] = [];
    for (let i = 0; i < this.n; i++) out.push(this.row(i));
    return out;
  }

  private grow(): void {
    this.cols = this.cols.map((a) => {
      const b = new Float64Array(a.length * 2);
      b.set(a);
      return b;
    });
  }
}
