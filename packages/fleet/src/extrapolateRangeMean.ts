import { encodeArray, encodeNumber } from '@loopwise/base';
import { RangeMeanMatrix } from '@loopwise/rainflow';

/** Options of {@link extrapolateRangeMeanTail}. */
export interface TailExtrapolationOptions {
  /** Share of the counted cycles taken as the tail (the largest ranges, whole rows); default 0.1. */
  tailShare?: number;
  /** Fewest cycles in the tail for a fit; default 20 (fewer: linear scaling only, with a note). */
  minTailCycles?: number;
  /** Most range rows the matrix may gain above its bins; default 3 × its rows. */
  maxExtraRows?: number;
}

/** What {@link extrapolateRangeMeanTail} returns. */
export interface TailExtrapolation {
  /** The extrapolated matrix: the measured bins, with range rows added above while the tail needs them. */
  matrix: RangeMeanMatrix;
  /** The count factor: target service ÷ measured service. */
  factor: number;
  /** Whether the tail was fitted (false: linear scaling only, `note` says why). */
  fitted: boolean;
  /** Threshold range u (the lower edge of the tail's lowest row). */
  threshold: number;
  /** Mean excess β of the ranges above u: the exponential tail's scale. */
  meanExcess: number;
  /** Cycles counted above u (measured). */
  tailCycles: number;
  /** Largest range expected once in the target service: u + β·ln(factor·tailCycles). */
  largestRange: number;
  /** Upper edge of the highest measured row holding cycles. */
  measuredLargestRange: number;
  note: string | null;
}

/**
 * Extrapolates a range-mean matrix to `factor` times the measured service by fitting the tail of
 * its range distribution and extending it (peaks over threshold with an exponential excess law).
 *
 * Method: the rows below the threshold u are scaled by `factor` (linear). The ranges above u —
 * the top `tailShare` of the counted cycles, whole rows — are taken as an exponential excess
 * distribution, the generalised Pareto law of peaks over a threshold with shape 0, whose maximum
 * likelihood scale is the mean excess β = Σ n_j (r_j − u) / N_u (r_j the row's middle). At the
 * target, N_T(> r) = factor · N_u · exp(−(r − u)/β) cycles exceed r; each tail row [a, b) gets
 * N_T(> a) − N_T(> b) cycles, the row holding r* = u + β·ln(factor·N_u) (where one cycle is
 * expected to exceed) gets all of N_T(> a), and rows above r* none; rows are added above the
 * measured bins (the last row's width) up to r*. So the total count is factor times the measured
 * one, and ranges larger than any measured appear when the target service calls for them. Each
 * tail row's cycles are spread over the mean bins as the measured tail's cycles are.
 *
 * Assumptions: the service is stationary (the target is more of the same usage mix), cycles above
 * u are independent, the excess of ranges over u is exponential (shape 0), and the mean does not
 * depend on the range in the tail. Cycles outside the measured bins are scaled linearly.
 *
 * References: P. Johannesson, Extrapolation of load histories and spectra, Fatigue & Fracture of
 * Engineering Materials & Structures 29(3) (2006) 209–217, doi:10.1111/j.1460-2695.2006.00984.x
 * (extrapolating rainflow spectra by peaks over threshold; citation details value from memory);
 * J. Pickands III, Statistical inference using extreme order statistics, The Annals of
 * Statistics 3(1) (1975) 119–131 (the generalised Pareto law of excesses).
 *
 * Special cases: no cycles, a tail of fewer than `minTailCycles` cycles or a zero mean excess
 * give linear scaling with a note; factor·N_u <= 1 needs no cycle above the measured ones
 * (the tail rows are still smoothed by the fit).
 */
export function extrapolateRangeMeanTail(measured: RangeMeanMatrix, factor: number, options: TailExtrapolationOptions = {}): TailExtrapolation {
  if (!(factor > 0 && factor < Infinity)) throw new RangeError(`extrapolation factor must be finite and > 0, got ${factor}`);
  const tailShare = options.tailShare ?? 0.1;
  if (!(tailShare > 0 && tailShare <= 1)) throw new RangeError(`tailShare must be in (0, 1], got ${tailShare}`);
  const minTail = options.minTailCycles ?? 20;
  const R = measured.rows;
  const C = measured.columns;
  const maxExtra = options.maxExtraRows ?? 3 * R;
  const re = measured.rowEdges;
  const ce = measured.columnEdges;
  const counts = measured.counts;
  const rowSum = new Float64Array(R);
  let total = 0;
  for (let j = 0; j < R; j++) {
    let s = 0;
    for (let c = 0; c < C; c++) s += counts[j * C + c];
    rowSum[j] = s;
    total += s;
  }
  let top = -1;
  for (let j = R - 1; j >= 0; j--) if (rowSum[j] > 0) {
    top = j;
    break;
  }
  const measuredLargestRange = top < 0 ? 0 : re[top + 1];
  const linear = (note: string): TailExtrapolation => ({
    matrix: build(re, ce, Float64Array.from(counts, (x) => x * factor), measured, factor),
    factor,
    fitted: false,
    threshold: NaN,
    meanExcess: NaN,
    tailCycles: 0,
    largestRange: measuredLargestRange,
    measuredLargestRange,
    note,
  });
  if (total === 0) return linear('no cycles inside the bins: scaled linearly');
  // threshold: the highest row from which the rows above hold at least tailShare of the cycles
  let J = R - 1;
  let tail = rowSum[R - 1];
  while (J > 0 && tail < tailShare * total) tail += rowSum[--J];
  if (tail < minTail) return linear(`only ${tail} cycles above the threshold (fewer than ${minTail}): scaled linearly`);
  const u = re[J];
  let excess = 0;
  for (let j = J; j < R; j++) excess += rowSum[j] * ((re[j] + re[j + 1]) / 2 - u);
  const beta = excess / tail;
  if (!(beta > 0)) return linear('the tail has no spread above its threshold: scaled linearly');
  const target = factor * tail;
  const rStar = target > 1 ? u + beta * Math.log(target) : u;
  // rows above the measured bins, of the last row's width, up to r*
  const edges = Array.from(re);
  const width = re[R] - re[R - 1];
  let note: string | null = null;
  while (edges[edges.length - 1] < rStar) {
    if (edges.length - 1 - R >= maxExtra) {
      note = `the tail reaches ${rStar}, beyond the ${maxExtra} rows allowed above the bins: its cycles above ${edges[edges.length - 1]} are kept in the top row`;
      break;
    }
    edges.push(re[R] + (edges.length - R) * width);
  }
  const rows = edges.length - 1;
  const out = new Float64Array(rows * C);
  for (let j = 0; j < J; j++) for (let c = 0; c < C; c++) out[j * C + c] = counts[j * C + c] * factor;
  // the measured tail's spread over the mean bins
  const share = new Float64Array(C);
  for (let j = J; j < R; j++) for (let c = 0; c < C; c++) share[c] += counts[j * C + c];
  for (let c = 0; c < C; c++) share[c] /= tail;
  const exceeding = (r: number) => target * Math.exp(-(r - u) / beta);
  for (let j = J; j < rows; j++) {
    const a = edges[j];
    const last = j === rows - 1 || edges[j + 1] >= rStar;
    const n = last ? exceeding(a) : exceeding(a) - exceeding(edges[j + 1]);
    for (let c = 0; c < C; c++) out[j * C + c] = n * share[c];
    if (last) break;
  }
  return {
    matrix: build(Float64Array.from(edges), ce, out, measured, factor),
    factor,
    fitted: true,
    threshold: u,
    meanExcess: beta,
    tailCycles: tail,
    largestRange: rStar,
    measuredLargestRange,
    note,
  };
}

function build(rowEdges: Float64Array, columnEdges: Float64Array, counts: Float64Array, measured: RangeMeanMatrix, factor: number): RangeMeanMatrix {
  const o = measured.outside;
  return RangeMeanMatrix.fromJSON({
    format: 'loopwise-cycle-matrix',
    version: 1,
    kind: 'range-mean',
    rowEdges: encodeArray(rowEdges),
    columnEdges: encodeArray(columnEdges),
    counts: encodeArray(counts),
    outside: { count: encodeNumber(o.count * factor), rowMin: encodeNumber(o.rowMin), rowMax: encodeNumber(o.rowMax), columnMin: encodeNumber(o.columnMin), columnMax: encodeNumber(o.columnMax) },
  });
}
