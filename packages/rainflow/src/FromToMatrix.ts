import type { BinSpec } from './binEdges';
import { CycleMatrix, readMatrixJSON, type CycleMatrixJSON, type OutsidePolicy } from './CycleMatrix';

/** Options of {@link FromToMatrix}. */
export interface FromToMatrixOptions {
  /** Bins of the value the cycle starts from (rows). */
  from: BinSpec;
  /** Bins of the value it goes to (columns). */
  to: BinSpec;
  /** Cycles outside the bins: `'tally'` (default; kept in `outside`) or `'error'`. */
  outside?: OutsidePolicy;
}

/**
 * From-to matrix: counts of cycles by the value they start from (rows) and the value they go to
 * (columns), so the direction of each cycle is kept. A {@link CycleSink}, like
 * {@link RangeMeanMatrix}; same bin and outside rules.
 *
 * Reference: ASTM E1049-85 (reapproved 2017), section 5.4 (rainflow cycles from one extreme to
 * another); from-to storage is the usual way to keep the cycles' direction in durability work.
 *
 * @example
 * const m = new FromToMatrix({ from: { count: 10, min: -5, max: 5 }, to: { count: 10, min: -5, max: 5 } });
 * rainflow([-2, 1, -3, 5, -1, 3, -4, 4, -2], { sink: m });
 * m.totalCount(); // returns 4
 */
export class FromToMatrix extends CycleMatrix {
  readonly kind = 'from-to' as const;

  constructor(options: FromToMatrixOptions) {
    super(options.from, options.to, options.outside ?? 'tally', ['from', 'to']);
  }

  protected rowValue(from: number): number {
    return from;
  }

  protected columnValue(_from: number, to: number): number {
    return to;
  }

  /** Rebuilds a matrix saved with `toJSON`. */
  static fromJSON(json: CycleMatrixJSON, outside: OutsidePolicy = 'tally'): FromToMatrix {
    const [from, to] = readMatrixJSON(json, 'from-to');
    return new FromToMatrix({ from: { edges: from }, to: { edges: to }, outside }).load(json);
  }

  /** An empty matrix with the same bins and policy. */
  emptyCopy(): FromToMatrix {
    return new FromToMatrix({ from: { edges: this.rowEdges }, to: { edges: this.columnEdges }, outside: this.outsidePolicy });
  }
}
