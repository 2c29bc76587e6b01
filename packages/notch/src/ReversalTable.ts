/** The columns of a {@link ReversalTable}, each trimmed to its length. */
export interface ReversalColumns {
  /** Source sample index of the reversal (-1 for the initial value). */
  index: Float64Array;
  /** The history value there (nominal, pseudo-elastic or strain, as given, offset applied). */
  value: Float64Array;
  /** Local stress σ at the notch root. */
  stress: Float64Array;
  /** Local strain ε at the notch root. */
  strain: Float64Array;
}

/** One row of a {@link ReversalTable} (for small results and tests). */
export interface ReversalRow {
  index: number;
  value: number;
  stress: number;
  strain: number;
}

/**
 * Growable struct-of-arrays table of local reversal points: one Float64Array per column,
 * doubled when full, so millions of reversals cost four doubles each and no objects.
 */
export class ReversalTable {
  private cIndex: Float64Array;
  private cValue: Float64Array;
  private cStress: Float64Array;
  private cStrain: Float64Array;
  private n = 0;
  private capacity = 0;

  constructor(initialCapacity = 256) {
    const cap = Math.max(16, initialCapacity | 0);
    this.capacity = cap;
    this.cIndex = new Float64Array(cap);
    this.cValue = new Float64Array(cap);
    this.cStress = new Float64Array(cap);
    this.cStrain = new Float64Array(cap);
  }

  /** Number of rows. */
  get length(): number {
    return this.n;
  }

  /** Appends a row. */
  add(index: number, value: number, stress: number, strain: number): void {
    if (this.n === this.capacity) this.grow(Math.max(16, 2 * this.capacity));
    const i = this.n++;
    this.cIndex[i] = index;
    this.cValue[i] = value;
    this.cStress[i] = stress;
    this.cStrain[i] = strain;
  }

  /** Appends rows `from` … `to − 1` of another table. */
  appendRange(other: ReversalTable, from: number, to: number): void {
    if (to <= from) return;
    const n = this.n;
    if (this.capacity < n + (to - from)) this.grow(Math.max(2 * this.capacity, n + (to - from)));
    this.cIndex.set(other.cIndex.subarray(from, to), n);
    this.cValue.set(other.cValue.subarray(from, to), n);
    this.cStress.set(other.cStress.subarray(from, to), n);
    this.cStrain.set(other.cStrain.subarray(from, to), n);
    this.n = n + (to - from);
  }

  /** Views of the columns, trimmed to `length` (no copy; valid until the next `add`). */
  columns(): ReversalColumns {
    const n = this.n;
    return {
      index: this.cIndex.subarray(0, n),
      value: this.cValue.subarray(0, n),
      stress: this.cStress.subarray(0, n),
      strain: this.cStrain.subarray(0, n),
    };
  }

  /** Row `i` as an object. */
  row(i: number): ReversalRow {
    return { index: this.cIndex[i], value: this.cValue[i], stress: this.cStress[i], strain: this.cStrain[i] };
  }

  /** Every row as objects (for small results, printing and tests). */
  toRows(): ReversalRow[] {
    const out: ReversalRow[] = [];
    for (let i = 0; i < this.n; i++) out.push(this.row(i));
    return out;
  }

  /**
   * Rows `from` … `to − 1` of `other` as a table that shares its storage (internal: the repeating
   * shortcut hands out both passes without copying). Reading costs nothing; the first row added
   * or appended moves the rows to storage of their own first, so neither table ever sees rows
   * the other adds later.
   */
  static view(other: ReversalTable, from: number, to: number): ReversalTable {
    const t = new ReversalTable(16);
    t.cIndex = other.cIndex.subarray(from, to);
    t.cValue = other.cValue.subarray(from, to);
    t.cStress = other.cStress.subarray(from, to);
    t.cStrain = other.cStrain.subarray(from, to);
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
    this.cIndex = widen(this.cIndex);
    this.cValue = widen(this.cValue);
    this.cStress = widen(this.cStress);
    this.cStrain = widen(this.cStrain);
    this.capacity = cap;
  }
}
