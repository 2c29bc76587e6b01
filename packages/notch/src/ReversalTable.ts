import { grownCapacity, RowShare, widenColumn } from '@loopwise/base';

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
 * doubled when full, so millions of reversals cost four doubles each and no objects. Honest
 * like {@link LoopTable}: the columns it hands out belong to it alone.
 */
export class ReversalTable {
  private cIndex: Float64Array;
  private cValue: Float64Array;
  private cStress: Float64Array;
  private cStrain: Float64Array;
  private n = 0;
  private capacity = 0;
  private share: RowShare | null = null;

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
    if (this.share !== null || this.capacity < n + (to - from)) this.grow(grownCapacity(this.capacity, n + (to - from)));
    this.cIndex.set(other.cIndex.subarray(from, to), n);
    this.cValue.set(other.cValue.subarray(from, to), n);
    this.cStress.set(other.cStress.subarray(from, to), n);
    this.cStrain.set(other.cStrain.subarray(from, to), n);
    this.n = n + (to - from);
  }

  /**
   * Views of the columns, trimmed to `length` (no copy; valid until the next `add`). They belong
   * to this table alone: a table that shared its storage moves its rows first.
   */
  columns(): ReversalColumns {
    if (this.share !== null) this.own();
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
   * Splits a table into tables of the given row ranges `[from, to)` (they may overlap), without
   * a copy up front; each moves its rows to storage of its own before it hands out columns or
   * adds a row while another of them still uses the storage. The source is empty afterwards.
   * See {@link LoopTable.split}.
   */
  static split(source: ReversalTable, ranges: readonly (readonly [number, number])[]): ReversalTable[] {
    const share = ranges.length > 1 ? new RowShare(ranges.length) : null;
    const out = ranges.map(([from, to]) => {
      const t = new ReversalTable(16);
      t.cIndex = source.cIndex.subarray(from, to);
      t.cValue = source.cValue.subarray(from, to);
      t.cStress = source.cStress.subarray(from, to);
      t.cStrain = source.cStrain.subarray(from, to);
      t.n = to - from;
      t.capacity = to - from;
      t.share = share;
      return t;
    });
    source.cIndex = new Float64Array(16);
    source.cValue = new Float64Array(16);
    source.cStress = new Float64Array(16);
    source.cStrain = new Float64Array(16);
    source.n = 0;
    source.capacity = 16;
    source.share = null;
    return out;
  }

  /** Makes room for `rows` rows in all (skips the doublings when the size can be estimated). */
  reserve(rows: number): void {
    if (rows > this.capacity) this.grow(rows);
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
      this.share.leave();
      this.share = null;
    }
    const n = this.n;
    this.cIndex = widenColumn(this.cIndex, n, cap);
    this.cValue = widenColumn(this.cValue, n, cap);
    this.cStress = widenColumn(this.cStress, n, cap);
    this.cStrain = widenColumn(this.cStrain, n, cap);
    this.capacity = cap;
  }
}
