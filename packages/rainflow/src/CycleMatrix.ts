import { binIndex, decodeArray, describeValue, decodeNumber, encodeArray, encodeNumber, type EncodedNumber } from '@loopwise/base';
import { binEdges, type BinSpec } from './binEdges';
import type { CycleSink } from './CycleSink';
import { BinError, InvalidOptionError } from './errors';

/** What a matrix does with a cycle outside its bins: tally it (default) or throw. */
export type OutsidePolicy = 'tally' | 'error';

/** Kinds of cycle matrix. */
export type CycleMatrixKind = 'range-mean' | 'from-to';

/** Cycles that fell outside the bins: their total count and the extremes of their coordinates. */
export interface OutsideTally {
  count: number;
  rowMin: number;
  rowMax: number;
  columnMin: number;
  columnMax: number;
}

/**
 * Serialised matrix, format `loopwise-cycle-matrix` version 1. `counts` is row-major
 * (rows × columns); rows are the first coordinate (range, or from), columns the second (mean,
 * or to). Numbers use the exact encoding of the rainflow state (-0 and non-finite as strings).
 */
export interface CycleMatrixJSON {
  format: 'loopwise-cycle-matrix';
  version: 1;
  kind: CycleMatrixKind;
  rowEdges: EncodedNumber[];
  columnEdges: EncodedNumber[];
  counts: EncodedNumber[];
  outside: { count: EncodedNumber; rowMin: EncodedNumber; rowMax: EncodedNumber; columnMin: EncodedNumber; columnMax: EncodedNumber };
}

/**
 * Thrown by a matrix with `outside: 'error'` when a cycle falls outside its bins: a
 * {@link BinError} with code `'outside-bins'`, `field` the coordinate outside (`'range'`,
 * `'mean'`, `'from'` or `'to'`; the row's when both are), `value` its value, and `index` the
 * sample index of the cycle's first reversal. `row` and `column` are both coordinates.
 */
export class OutsideBinsError extends BinError {
  declare readonly index: number;
  /** The cycle's row coordinate (range, or from). */
  readonly row: number;
  /** The cycle's column coordinate (mean, or to). */
  readonly column: number;
  /** Sample index of the cycle's first reversal; the same as `index`. */
  readonly startIndex: number;

  constructor(field: string, value: number, row: number, column: number, startIndex: number) {
    super(field, value, `${describeValue(value)} of the cycle starting at sample ${startIndex} is outside the bins (row ${describeValue(row)}, column ${describeValue(column)})`, startIndex, 'outside-bins');
    this.name = 'OutsideBinsError';
    this.row = row;
    this.column = column;
    this.startIndex = startIndex;
  }
}

/**
 * Shared machinery of the range-mean and from-to matrices: a dense Float64Array of counts over
 * two binned coordinates, an explicit tally of cycles outside the bins, exact serialisation,
 * addition of matrices with identical bins and scaling by a repeat count.
 *
 * Honest views: the edges are the matrix's own (validated once) and are handed out as copies, so
 * writing them cannot change how the matrix bins; `counts` is this matrix's own storage, shared
 * with nothing (writing it changes this matrix only).
 */
export abstract class CycleMatrix implements CycleSink {
  abstract readonly kind: CycleMatrixKind;
  /** Row-major counts, rows × columns: this matrix's own storage (no other matrix shares it). */
  readonly counts: Float64Array;
  readonly outsidePolicy: OutsidePolicy;
  private readonly re: Float64Array;
  private readonly ce: Float64Array;
  private readonly nc: number;
  private readonly names: readonly [string, string];
  protected tally: OutsideTally = { count: 0, rowMin: Infinity, rowMax: -Infinity, columnMin: Infinity, columnMax: -Infinity };

  protected constructor(rows: BinSpec | Float64Array, columns: BinSpec | Float64Array, outside: OutsidePolicy, names: [string, string]) {
    // edges given as an array are validated and copied like any other: the matrix owns its bins
    this.re = binEdges(rows instanceof Float64Array ? { edges: rows } : rows, names[0]);
    this.ce = binEdges(columns instanceof Float64Array ? { edges: columns } : columns, names[1]);
    if (outside !== 'tally' && outside !== 'error') throw new InvalidOptionError('outside', outside, "must be 'tally' or 'error'");
    this.outsidePolicy = outside;
    this.names = names;
    this.nc = this.ce.length - 1;
    this.counts = new Float64Array((this.re.length - 1) * this.nc);
  }

  /** Edges of the row bins (range, or from): a copy, so read it once. */
  get rowEdges(): Float64Array {
    return this.re.slice();
  }

  /** Edges of the column bins (mean, or to): a copy, so read it once. */
  get columnEdges(): Float64Array {
    return this.ce.slice();
  }

  /** Number of row bins. */
  get rows(): number {
    return this.re.length - 1;
  }

  /** Number of column bins. */
  get columns(): number {
    return this.nc;
  }

  /** Cycles outside the bins (a copy). */
  get outside(): OutsideTally {
    return { ...this.tally };
  }

  /** Count in bin (row, column). */
  at(row: number, column: number): number {
    return this.counts[row * this.nc + column];
  }

  /** Sum of the counts inside the bins. */
  insideCount(): number {
    let s = 0;
    for (let i = 0; i < this.counts.length; i++) s += this.counts[i];
    return s;
  }

  /** Inside plus outside: every count the matrix received. */
  totalCount(): number {
    return this.insideCount() + this.tally.count;
  }

  /** The binned row coordinate of a cycle (range, or from). */
  protected abstract rowValue(from: number, to: number): number;
  /** The binned column coordinate of a cycle (mean, or to). */
  protected abstract columnValue(from: number, to: number): number;

  addCycle(from: number, to: number, count: number, startIndex: number, _turnIndex = startIndex, _closeIndex = _turnIndex): void {
    const r = this.rowValue(from, to);
    const c = this.columnValue(from, to);
    const i = binIndex(this.re, r);
    const j = binIndex(this.ce, c);
    if (i < 0 || j < 0) {
      if (this.outsidePolicy === 'error') {
        throw i < 0 ? new OutsideBinsError(this.names[0], r, r, c, startIndex) : new OutsideBinsError(this.names[1], c, r, c, startIndex);
      }
      const t = this.tally;
      t.count += count;
      if (r < t.rowMin) t.rowMin = r;
      if (r > t.rowMax) t.rowMax = r;
      if (c < t.columnMin) t.columnMin = c;
      if (c > t.columnMax) t.columnMax = c;
      return;
    }
    this.counts[i * this.nc + j] += count;
  }

  /** Adds another matrix of the same kind and identical bins (two recordings into one). */
  add(other: CycleMatrix): this {
    if (other.kind !== this.kind) throw new BinError('kind', other.kind, `cannot add a ${other.kind} matrix to a ${this.kind} matrix`);
    sameEdges(this.re, other.re, 'rowEdges');
    sameEdges(this.ce, other.ce, 'columnEdges');
    for (let i = 0; i < this.counts.length; i++) this.counts[i] += other.counts[i];
    const t = this.tally;
    const o = other.tally;
    t.count += o.count;
    t.rowMin = Math.min(t.rowMin, o.rowMin);
    t.rowMax = Math.max(t.rowMax, o.rowMax);
    t.columnMin = Math.min(t.columnMin, o.columnMin);
    t.columnMax = Math.max(t.columnMax, o.columnMax);
    return this;
  }

  /** Multiplies every count (inside and outside) by `factor`, e.g. a number of repeats. */
  scale(factor: number): this {
    if (!(factor >= 0) || factor === Infinity) throw new InvalidOptionError('factor', factor, 'must be a finite number >= 0');
    for (let i = 0; i < this.counts.length; i++) this.counts[i] *= factor;
    this.tally.count *= factor;
    return this;
  }

  toJSON(): CycleMatrixJSON {
    const t = this.tally;
    return {
      format: 'loopwise-cycle-matrix',
      version: 1,
      kind: this.kind,
      rowEdges: encodeArray(this.re),
      columnEdges: encodeArray(this.ce),
      counts: encodeArray(this.counts),
      outside: {
        count: encodeNumber(t.count),
        rowMin: encodeNumber(t.rowMin),
        rowMax: encodeNumber(t.rowMax),
        columnMin: encodeNumber(t.columnMin),
        columnMax: encodeNumber(t.columnMax),
      },
    };
  }

  /** Restores counts and tally from JSON into this (freshly built, same bins) matrix. */
  protected load(json: CycleMatrixJSON): this {
    const counts = decodeArray(json.counts, 'counts');
    if (counts.length !== this.counts.length) {
      throw new BinError('counts', counts.length, `expected ${this.counts.length} counts for ${this.rows} × ${this.columns} bins, got ${counts.length}`);
    }
    this.counts.set(counts);
    const o = json.outside;
    this.tally = {
      count: decodeNumber(o.count, 'outside.count'),
      rowMin: decodeNumber(o.rowMin, 'outside.rowMin'),
      rowMax: decodeNumber(o.rowMax, 'outside.rowMax'),
      columnMin: decodeNumber(o.columnMin, 'outside.columnMin'),
      columnMax: decodeNumber(o.columnMax, 'outside.columnMax'),
    };
    return this;
  }
}

/** Checks the envelope of a matrix JSON and returns its decoded edges. */
export function readMatrixJSON(json: CycleMatrixJSON, kind: CycleMatrixKind): [Float64Array, Float64Array] {
  if (json === null || typeof json !== 'object' || json.format !== 'loopwise-cycle-matrix') {
    throw new BinError('format', json?.format, 'not a loopwise-cycle-matrix object');
  }
  if (json.version !== 1) throw new BinError('version', json.version, `unsupported matrix version ${String(json.version)}`);
  if (json.kind !== kind) throw new BinError('kind', json.kind, `expected a ${kind} matrix, got ${String(json.kind)}`);
  const rows = binEdges({ edges: decodeArray(json.rowEdges, 'rowEdges') }, 'rowEdges');
  const columns = binEdges({ edges: decodeArray(json.columnEdges, 'columnEdges') }, 'columnEdges');
  return [rows, columns];
}

function sameEdges(a: Float64Array, b: Float64Array, field: string): void {
  if (a.length !== b.length || a.some((v, i) => !Object.is(v, b[i]))) {
    throw new BinError(field, b, 'matrices with different bins cannot be added: rebin one first');
  }
}
