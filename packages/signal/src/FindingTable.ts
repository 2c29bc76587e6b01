import { grownCapacity, widenColumn } from '@loopwise/base';
import { timesOfSamples, type TimeBase } from './TimeBase';

/**
 * Codes of the findings of the signal checks:
 * - `spike`: a sample that jumps out and comes back (see {@link SignalScanner});
 * - `stuck-run`: at least `stuckRunSamples` identical consecutive samples (a frozen channel);
 * - `zero-run`: the same at exactly 0 (a dropout of the logger or the amplifier);
 * - `time-gap`: a step of the time column larger than `gapFactor` nominal steps ({@link detectTimeGaps});
 * - `clipped-maximum`, `clipped-minimum`: a run of samples exactly at the channel's largest
 *   (smallest) value, when enough samples sit there that full scale was probably reached;
 * - `offset`: |mean| above `offsetShare` × the range (an offset not zeroed);
 * - `drift`: the least-squares linear trend over the record above `driftShare` × the range.
 */
export type FindingCode = 'spike' | 'stuck-run' | 'zero-run' | 'time-gap' | 'clipped-maximum' | 'clipped-minimum' | 'offset' | 'drift';

/** Every {@link FindingCode}, in the order of their numeric ids in {@link FindingColumns.code}. */
export const FINDING_CODES: readonly FindingCode[] = Object.freeze(['spike', 'stuck-run', 'zero-run', 'time-gap', 'clipped-maximum', 'clipped-minimum', 'offset', 'drift'] as const);

/** One finding: what (`code`), where (first sample `index`, `length` samples) and, with a time base, the `time` of its first sample. */
export interface Finding {
  readonly code: FindingCode;
  readonly index: number;
  readonly length: number;
  /** Seconds, when the table has a time base; otherwise undefined. */
  readonly time: number | undefined;
  /** A number that says how large the finding is: the jump of a spike, the value of a stuck run or a clip, the mean of an offset, the trend of a drift, the step of a gap. */
  readonly size: number;
}

/** Columns of a {@link FindingTable} (copies: writing to them changes nothing else). */
export interface FindingColumns {
  /** Position in {@link FINDING_CODES}. */
  code: Uint8Array;
  index: Float64Array;
  length: Float64Array;
  size: Float64Array;
  /** Seconds of the first sample; only with a time base. */
  time?: Float64Array;
}

/**
 * The findings of the signal checks as struct-of-arrays columns, in order of sample index (ties
 * in the order of {@link FINDING_CODES}). A table can hold millions of rows without an object per
 * row; `row(i)` builds one on request.
 *
 * @example
 * const t = new FindingTable();
 * t.add('spike', 12, 1, 40);
 * t.row(0);
 * // returns { code: 'spike', index: 12, length: 1, time: undefined, size: 40 }
 */
export class FindingTable {
  private codeCol = new Uint8Array(16);
  private indexCol: Float64Array = new Float64Array(16);
  private lengthCol: Float64Array = new Float64Array(16);
  private sizeCol: Float64Array = new Float64Array(16);
  private timeCol: Float64Array | undefined;
  private rows = 0;
  private sorted = true;

  /** Number of findings. */
  get length(): number {
    return this.rows;
  }

  /** Adds a finding (see {@link Finding}). */
  add(code: FindingCode, index: number, length: number, size: number): void {
    if (this.rows === this.codeCol.length) this.grow(this.rows + 1);
    const k = this.rows++;
    const id = FINDING_CODES.indexOf(code);
    if (k > 0 && (this.indexCol[k - 1] > index || (this.indexCol[k - 1] === index && this.codeCol[k - 1] > id))) this.sorted = false;
    this.codeCol[k] = id;
    this.indexCol[k] = index;
    this.lengthCol[k] = length;
    this.sizeCol[k] = size;
    this.timeCol = undefined;
  }

  /** The `i`-th finding. */
  row(i: number): Finding {
    this.sort();
    return {
      code: FINDING_CODES[this.codeCol[i]],
      index: this.indexCol[i],
      length: this.lengthCol[i],
      time: this.timeCol === undefined ? undefined : this.timeCol[i],
      size: this.sizeCol[i],
    };
  }

  /** Every finding as an object (for reports; use {@link columns} for large tables). */
  toArray(): Finding[] {
    const out: Finding[] = [];
    for (let i = 0; i < this.rows; i++) out.push(this.row(i));
    return out;
  }

  /** Copies of the columns. */
  columns(): FindingColumns {
    this.sort();
    const n = this.rows;
    const out: FindingColumns = {
      code: this.codeCol.slice(0, n),
      index: this.indexCol.slice(0, n),
      length: this.lengthCol.slice(0, n),
      size: this.sizeCol.slice(0, n),
    };
    if (this.timeCol !== undefined) out.time = this.timeCol.slice(0, n);
    return out;
  }

  /** A new table with the findings of the given codes only (with their times, if any). */
  select(...codes: FindingCode[]): FindingTable {
    this.sort();
    const out = new FindingTable();
    for (let i = 0; i < this.rows; i++) {
      const code = FINDING_CODES[this.codeCol[i]];
      if (codes.includes(code)) out.add(code, this.indexCol[i], this.lengthCol[i], this.sizeCol[i]);
    }
    if (this.timeCol !== undefined) {
      const t = new Float64Array(out.rows);
      for (let i = 0, k = 0; i < this.rows; i++) if (codes.includes(FINDING_CODES[this.codeCol[i]])) t[k++] = this.timeCol[i];
      out.timeCol = t;
    }
    return out;
  }

  /** Number of findings of a code. */
  count(code: FindingCode): number {
    const id = FINDING_CODES.indexOf(code);
    let c = 0;
    for (let i = 0; i < this.rows; i++) if (this.codeCol[i] === id) c++;
    return c;
  }

  /** Sets the time of every finding from a time base (seconds); returns the table. */
  withTimes(timeBase: TimeBase): this {
    this.sort();
    this.timeCol = timesOfSamples(this.indexCol.subarray(0, this.rows), timeBase);
    return this;
  }

  private grow(needed: number): void {
    const cap = grownCapacity(this.codeCol.length, needed);
    const code = new Uint8Array(cap);
    code.set(this.codeCol.subarray(0, this.rows));
    this.codeCol = code;
    this.indexCol = widenColumn(this.indexCol, this.rows, cap);
    this.lengthCol = widenColumn(this.lengthCol, this.rows, cap);
    this.sizeCol = widenColumn(this.sizeCol, this.rows, cap);
  }

  // Findings of different checks arrive out of order (a run is added when it ends); they are
  // put in order of (index, code) once, when they are first read.
  private sort(): void {
    if (this.sorted) return;
    const n = this.rows;
    const order = Array.from({ length: n }, (_, i) => i);
    order.sort((a, b) => this.indexCol[a] - this.indexCol[b] || this.codeCol[a] - this.codeCol[b] || a - b);
    const code = new Uint8Array(this.codeCol.length);
    const index = new Float64Array(this.codeCol.length);
    const length = new Float64Array(this.codeCol.length);
    const size = new Float64Array(this.codeCol.length);
    const time = this.timeCol === undefined ? undefined : new Float64Array(n);
    order.forEach((from, to) => {
      code[to] = this.codeCol[from];
      index[to] = this.indexCol[from];
      length[to] = this.lengthCol[from];
      size[to] = this.sizeCol[from];
      if (time !== undefined) time[to] = this.timeCol![from];
    });
    this.codeCol = code;
    this.indexCol = index;
    this.lengthCol = length;
    this.sizeCol = size;
    this.timeCol = time;
    this.sorted = true;
  }
}
