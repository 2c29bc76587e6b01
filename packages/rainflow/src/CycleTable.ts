import type { CycleSink } from './CycleSink';
import { CounterStateError, RangeOverflowError } from './errors';
import { decodeArray, encodeArray, type EncodedNumber } from './numberCodec';

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
  /** Sample index of `from`. */
  startIndex: Float64Array;
  /** Sample index of `to`. */
  endIndex: Float64Array;
  /** Sample index of the turning point that closed the cycle (`endIndex` for a half cycle). */
  closeIndex: Float64Array;
}

/** Serialised {@link CycleTable}. */
export interface CycleTableState {
  from: EncodedNumber[];
  to: EncodedNumber[];
  count: EncodedNumber[];
  startIndex: number[];
  endIndex: number[];
  closeIndex: number[];
}

const NAMES = ['range', 'mean', 'from', 'to', 'count', 'startIndex', 'endIndex', 'closeIndex'] as const;

/**
 * Growable struct-of-arrays table of cycles: one Float64Array per column, doubled when full, so
 * millions of cycles cost eight doubles each and no objects. Implements {@link CycleSink}.
 * Sample indices are stored as doubles (exact up to 2^53).
 */
export class CycleTable implements CycleSink {
  private cols: Float64Array[];
  private n = 0;

  constructor(initialCapacity = 1024) {
    const cap = Math.max(16, initialCapacity | 0);
    this.cols = NAMES.map(() => new Float64Array(cap));
  }

  /** Number of rows (full and half cycles). */
  get length(): number {
    return this.n;
  }

  /** Sum of the count column: full cycles + half cycles / 2. */
  totalCount(): number {
    const c = this.cols[4];
    let s = 0;
    for (let i = 0; i < this.n; i++) s += c[i];
    return s;
  }

  addCycle(from: number, to: number, count: number, startIndex: number, endIndex: number, closeIndex: number): void {
    const range = to > from ? to - from : from - to;
    if (range === Infinity) throw new RangeOverflowError(startIndex, endIndex);
    if (this.n === this.cols[0].length) this.grow();
    const i = this.n++;
    const c = this.cols;
    c[0][i] = range;
    const sum = from + to;
    c[1][i] = sum - sum === 0 ? sum * 0.5 : from * 0.5 + to * 0.5; // no overflow, no subnormal loss
    c[2][i] = from;
    c[3][i] = to;
    c[4][i] = count;
    c[5][i] = startIndex;
    c[6][i] = endIndex;
    c[7][i] = closeIndex;
  }

  /** Appends every row of another table, in its order. */
  appendTable(other: CycleTable): void {
    for (let i = 0; i < other.n; i++) this.copyRow(other, i);
  }

  /** Copies row `i` of `other` to the end of this table. */
  copyRow(other: CycleTable, i: number): void {
    if (this.n === this.cols[0].length) this.grow();
    const j = this.n++;
    for (let k = 0; k < NAMES.length; k++) this.cols[k][j] = other.cols[k][i];
  }

  /** Removes every row. */
  clear(): void {
    this.n = 0;
  }

  /** Views of the columns, trimmed to the row count (no copy; valid until the next add). */
  columns(): CycleColumns {
    const v = (k: number) => this.cols[k].subarray(0, this.n);
    return {
      range: v(0),
      mean: v(1),
      from: v(2),
      to: v(3),
      count: v(4),
      startIndex: v(5),
      endIndex: v(6),
      closeIndex: v(7),
    };
  }

  /** Row `i` as an object (for tests and small reports; not for hot loops). */
  row(i: number): { [K in (typeof NAMES)[number]]: number } {
    if (!(i >= 0 && i < this.n)) throw new RangeError(`row ${i} is outside 0..${this.n - 1}`);
    const c = this.cols;
    return {
      range: c[0][i],
      mean: c[1][i],
      from: c[2][i],
      to: c[3][i],
      count: c[4][i],
      startIndex: c[5][i],
      endIndex: c[6][i],
      closeIndex: c[7][i],
    };
  }

  /** Feeds every row, in order, to another sink. */
  replayInto(sink: CycleSink): void {
    const c = this.cols;
    for (let i = 0; i < this.n; i++) sink.addCycle(c[2][i], c[3][i], c[4][i], c[5][i], c[6][i], c[7][i]);
  }

  toJSON(): CycleTableState {
    const c = this.cols;
    const ints = (k: number) => Array.from(c[k].subarray(0, this.n));
    return {
      from: encodeArray(c[2], this.n),
      to: encodeArray(c[3], this.n),
      count: encodeArray(c[4], this.n),
      startIndex: ints(5),
      endIndex: ints(6),
      closeIndex: ints(7),
    };
  }

  static fromJSON(state: CycleTableState): CycleTable {
    if (state === null || typeof state !== 'object') throw new CounterStateError('cycle table state must be an object');
    const from = decodeArray(state.from, 'cycles.from');
    const to = decodeArray(state.to, 'cycles.to');
    const count = decodeArray(state.count, 'cycles.count');
    const s = decodeArray(state.startIndex, 'cycles.startIndex');
    const e = decodeArray(state.endIndex, 'cycles.endIndex');
    const k = decodeArray(state.closeIndex, 'cycles.closeIndex');
    const n = from.length;
    if ([to, count, s, e, k].some((a) => a.length !== n)) {
      throw new CounterStateError('cycle table state has columns of different lengths');
    }
    const t = new CycleTable(n);
    for (let i = 0; i < n; i++) t.addCycle(from[i], to[i], count[i], s[i], e[i], k[i]);
    return t;
  }

  private grow(): void {
    this.cols = this.cols.map((a) => {
      const b = new Float64Array(a.length * 2);
      b.set(a);
      return b;
    });
  }
}
