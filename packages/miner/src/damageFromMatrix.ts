import { NeumaierAdder } from '@loopwise/base';
import { checkCount, checkEdges, checkLife, recordDamage } from './checks';
import { cutoffLimit, type CutoffPolicy } from './CutoffPolicy';
import { MinerError } from './MinerError';

/**
 * A stored range-mean matrix, structurally: rows are range bins, columns mean bins, `counts`
 * row-major (rows × columns) in cycles. `RangeMeanMatrix` of `@loopwise/rainflow` has this shape
 * (its `outside` tally is read when present), and so does a matrix read from a file.
 */
export interface RangeMeanCounts {
  /** Range bin edges, strictly increasing, finite, the first ≥ 0. */
  rowEdges: ArrayLike<number>;
  /** Mean bin edges, strictly increasing, finite. */
  columnEdges: ArrayLike<number>;
  /** Row-major counts in cycles (full cycles + half cycles / 2), finite, ≥ 0. */
  counts: ArrayLike<number>;
  /** Cycles that fell outside the bins, when the matrix kept a tally. */
  outside?: { count: number };
}

/** Column kernel form of the life mapping: fills `out[k]` with Nf for (ranges[k], means[k]). */
export interface MatrixLifeKernel {
  cyclesToFailureInto(ranges: Float64Array, means: Float64Array, out: Float64Array): Float64Array;
}

/** Cycles to failure Nf (not reversals) of a loop of `range` and `mean`, or a column kernel. */
export type MatrixLife = ((range: number, mean: number) => number) | MatrixLifeKernel;

/** Options of {@link damageFromMatrix}. */
export interface MatrixDamageOptions {
  /** Cut-off policy, see {@link CutoffPolicy}. Default `'none'`. */
  cutoff?: CutoffPolicy;
}

/** Result of {@link damageFromMatrix}; every per-bin array is row-major like `counts`. */
export interface MatrixDamage {
  /** Total damage D of the matrix, Σ counts / Nf. */
  readonly damage: number;
  /** Damage per bin. */
  readonly binDamage: Float64Array;
  /** Nf at each bin centre, as the life mapping returned it. */
  readonly cyclesToFailure: Float64Array;
  /** Range at the centre of each row bin (length rows). */
  readonly rangeCentres: Float64Array;
  /** Mean at the centre of each column bin (length columns). */
  readonly meanCentres: Float64Array;
  /** Cycles outside the bins (from the matrix's `outside` tally, 0 without one): not in `damage`. */
  readonly outsideCount: number;
}

/**
 * Palmgren-Miner damage from a stored range-mean matrix: every bin's cycles are taken as loops
 * at the bin centre (range (r_j + r_{j+1})/2, mean (m_k + m_{k+1})/2), the caller's `life`
 * maps that centre to cycles to failure Nf, and
 *
 *     D = Σ_{j,k} n_jk / Nf(Δ_j, m_k)          (0 for Nf above the cut-off)
 *
 * `life` is either a function (range, mean) → Nf called once per bin, or an object with a
 * column kernel `cyclesToFailureInto(ranges, means, out)` called once with all bins.
 *
 * What is lost against the loop route: the position of each loop within its bin (a loop at
 * the top of a range bin does more damage than its centre, so coarse bins bias the result
 * either way), the sequence and order of the loops, the sample indices (no timeline, no damage
 * by event, no worst loops), and the local stress-strain path: a range and mean do not give the
 * notch's σmax, εa or loop closure under the material's memory, so the mapping must assume a
 * response (e.g. elastic, or a stabilised loop centred on the mean). Loops outside the bins are
 * reported in `outsideCount` and not counted.
 *
 * References: A. Palmgren, Z. VDI 68 (1924) 339-341; M. A. Miner, J. Appl. Mech. 12 (1945)
 * A159-A164; range-mean storage of rainflow counts, ASTM E1049-85 (reapproved 2017), 5.4.
 *
 * @throws {MinerError} `invalid-bins` for bad edges, a negative first range edge or counts that
 *   do not fit rows × columns; `invalid-count` for a bad count; `invalid-life` for a mapped Nf
 *   that is NaN or ≤ 0 (naming the row-major bin index); `invalid-argument` for a bad `life`.
 * @example
 * const matrix = { rowEdges: [0, 100, 200], columnEdges: [-50, 50], counts: [1000, 10] };
 * damageFromMatrix(matrix, (range) => 1e12 / range ** 3).damage;
 * // returns 0.00015875 (1000 / (1e12 / 50^3) + 10 / (1e12 / 150^3))
 */
export function damageFromMatrix(matrix: RangeMeanCounts, life: MatrixLife, options: MatrixDamageOptions = {}): MatrixDamage {
  if (matrix === null || typeof matrix !== 'object') {
    throw new MinerError('invalid-argument', 'matrix', matrix, 'must be { rowEdges, columnEdges, counts }');
  }
  const r = checkEdges(matrix.rowEdges, 'rowEdges');
  const m = checkEdges(matrix.columnEdges, 'columnEdges');
  if (r[0] < 0) throw new MinerError('invalid-bins', 'rowEdges', r[0], 'range edges must be >= 0', 0);
  const rows = r.length - 1;
  const columns = m.length - 1;
  const counts = matrix.counts;
  if (counts === null || typeof counts !== 'object' || counts.length !== rows * columns) {
    throw new MinerError('invalid-bins', 'counts.length', counts?.length, `must be rows × columns = ${rows} × ${columns} = ${rows * columns}`);
  }
  const limit = cutoffLimit(options.cutoff);
  const rangeCentres = new Float64Array(rows);
  const meanCentres = new Float64Array(columns);
  for (let j = 0; j < rows; j++) rangeCentres[j] = r[j] * 0.5 + r[j + 1] * 0.5;
  for (let k = 0; k < columns; k++) meanCentres[k] = m[k] * 0.5 + m[k + 1] * 0.5;
  const size = rows * columns;
  const nf = new Float64Array(size);
  if (typeof life === 'function') {
    for (let j = 0, b = 0; j < rows; j++) for (let k = 0; k < columns; k++, b++) nf[b] = life(rangeCentres[j], meanCentres[k]);
  } else if (life !== null && typeof life === 'object' && typeof life.cyclesToFailureInto === 'function') {
    const ranges = new Float64Array(size);
    const means = new Float64Array(size);
    for (let j = 0, b = 0; j < rows; j++) {
      for (let k = 0; k < columns; k++, b++) {
        ranges[b] = rangeCentres[j];
        means[b] = meanCentres[k];
      }
    }
    life.cyclesToFailureInto(ranges, means, nf);
  } else {
    throw new MinerError('invalid-argument', 'life', life, 'must be a function (range, mean) => cycles or { cyclesToFailureInto }');
  }
  const binDamage = new Float64Array(size);
  const total = new NeumaierAdder();
  for (let b = 0; b < size; b++) {
    const c = counts[b];
    checkCount(c, 'counts', b);
    checkLife(nf[b], 'cyclesToFailure', b);
    const d = recordDamage(c, nf[b], limit, b);
    binDamage[b] = d;
    total.add(d);
  }
  let outsideCount = 0;
  if (matrix.outside !== undefined && matrix.outside !== null) {
    outsideCount = matrix.outside.count;
    checkCount(outsideCount, 'outside.count');
  }
  return { damage: total.valueOf(), binDamage, cyclesToFailure: nf, rangeCentres, meanCentres, outsideCount };
}
