import type { BinSpec } from './binEdges';
import { CycleMatrix, readMatrixJSON, type CycleMatrixJSON, type OutsidePolicy } from './CycleMatrix';

/** Options of {@link RangeMeanMatrix}. */
export interface RangeMeanMatrixOptions {
  /** Bins of the cycle range |to − from| (rows). */
  range: BinSpec;
  /** Bins of the cycle mean (to + from) / 2 (columns). */
  mean: BinSpec;
  /** Cycles outside the bins: `'tally'` (default; kept in `outside`) or `'error'`. */
  outside?: OutsidePolicy;
}

/**
 * Range-mean matrix: counts of cycles by range (rows) and mean (columns). A {@link CycleSink}:
 * pass it as a counter's `sink` to count a stream straight into bins. Bin i holds
 * edges[i] <= v < edges[i + 1], the last bin also its upper edge; cycles outside are tallied.
 *
 * Reference: ASTM E1049-85 (reapproved 2017), section 5.4 and its tables of cycles by range;
 * the range-mean matrix is the usual storage of rainflow results in durability work.
 *
 * @example
 * const m = new RangeMeanMatrix({ range: { count: 10, min: 0, max: 10 }, mean: { count: 4, min: -4, max: 4 } });
 * rainflow([-2, 1, -3, 5, -1, 3, -4, 4, -2], { sink: m });
 * m.totalCount(); // returns 4
 */
export class RangeMeanMatrix extends CycleMatrix {
  readonly kind = 'range-mean' as const;

  constructor(options: RangeMeanMatrixOptions) {
    super(options.range, options.mean, options.outside ?? 'tally', ['range', 'mean']);
  }

  protected rowValue(from: number, to: number): number {
    return to > from ? to - from : from - to;
  }

  protected columnValue(from: number, to: number): number {
    const sum = from + to;
    return sum - sum === 0 ? sum * 0.5 : from * 0.5 + to * 0.5;
  }

  /** Rebuilds a matrix saved with `toJSON`. */
  static fromJSON(json: CycleMatrixJSON, outside: OutsidePolicy = 'tally'): RangeMeanMatrix {
    const [range, mean] = readMatrixJSON(json, 'range-mean');
    return new RangeMeanMatrix({ range: { edges: range }, mean: { edges: mean }, outside }).load(json);
  }

  /** An empty matrix with the same bins and policy. */
  emptyCopy(): RangeMeanMatrix {
    return new RangeMeanMatrix({ range: { edges: this.rowEdges }, mean: { edges: this.columnEdges }, outside: this.outsidePolicy });
  }
}
