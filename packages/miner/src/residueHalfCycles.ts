import { checkLength } from './checks';
import { MinerError } from './MinerError';

/**
 * The residue of a one-off history: the reversal points still open at its end, in order (as a
 * rainflow counter's or a notch tracker's residue gives them), each with its sample index and
 * the local stress and strain there.
 */
export interface ResiduePoints {
  /**
   * Sample index of each point: integers ≥ −1 that never decrease (−1 stands for the initial
   * value before the first sample, as notch's tracker writes it).
   */
  readonly index: ArrayLike<number>;
  /** Stress at each point (finite), in the caller's unit. */
  readonly stress: ArrayLike<number>;
  /** Strain at each point (finite, dimensionless). */
  readonly strain: ArrayLike<number>;
}

/** Half cycles as loop columns (the shape of notch's loop table), one row per half cycle. */
export interface HalfCycleColumns {
  /** The larger stress of the two points. */
  readonly stressMax: Float64Array;
  /** The smaller stress of the two points. */
  readonly stressMin: Float64Array;
  /** The larger strain of the two points. */
  readonly strainMax: Float64Array;
  /** The smaller strain of the two points. */
  readonly strainMin: Float64Array;
  /** Sample index of the first point. */
  readonly startIndex: Float64Array;
  /** Sample index of the second point, where the half cycle turns. */
  readonly turnIndex: Float64Array;
  /** Where the half cycle ends: its turn (a half cycle closes nothing). */
  readonly closeIndex: Float64Array;
  /** 0.5 for every row. */
  readonly count: Float64Array;
}

/**
 * The residue of a one-off history counted as half cycles: each pair of consecutive residue
 * points is one half cycle (count 0.5) from the first point to the second, as ASTM E1049-85
 * (reapproved 2017), 5.4.4, counts what is left once no more full cycles close (its last step:
 * each range not yet counted is one half cycle; the step's wording from memory). m points give
 * m − 1 half cycles (none for fewer than two points), in order; the extremes of a row are the
 * larger and the smaller stress and strain of its two points, so a half cycle is a loop for the
 * damage parameters of `@loopwise/mean-stress`. Returns new columns.
 *
 * For a history that repeats, the residue closes into full cycles instead (ASTM E1049-85 5.4.5;
 * rainflow's `repeat` policy, notch's repeating pass): do not count it as half cycles.
 *
 * Reference: ASTM E1049-85 (reapproved 2017), Standard Practices for Cycle Counting in Fatigue
 * Analysis, 5.4.4.
 *
 * @throws {MinerError} `invalid-argument` for columns of different lengths; `invalid-index` for
 *   an index that is not an integer ≥ −1 or is below the one before it; `invalid-residue` for a
 *   stress or strain that is NaN or ±Infinity (naming the point).
 * @example
 * residueHalfCycles({ index: [0, 3, 8], stress: [0, 300, -200], strain: [0, 0.002, -0.001] }).stressMin;
 * // returns Float64Array [0, -200]
 */
export function residueHalfCycles(residue: ResiduePoints): HalfCycleColumns {
  if (residue === null || typeof residue !== 'object') {
    throw new MinerError('invalid-argument', 'residue', residue, 'must be { index, stress, strain }');
  }
  const { index, stress, strain } = residue;
  const n = index?.length;
  if (typeof n !== 'number') throw new MinerError('invalid-argument', 'index', index, 'must be an array-like column of numbers');
  checkLength(stress, n, 'stress');
  checkLength(strain, n, 'strain');
  for (let i = 0; i < n; i++) {
    const k = index[i];
    if (!(Number.isInteger(k) && k >= -1)) throw new MinerError('invalid-index', 'index', k, 'must be an integer >= -1 (a sample index, -1 for the initial value)', i);
    if (i > 0 && k < index[i - 1]) throw new MinerError('invalid-index', 'index', k, `must not decrease (the point before is at ${index[i - 1]})`, i);
    if (!Number.isFinite(stress[i])) throw new MinerError('invalid-residue', 'stress', stress[i], 'must be a finite number', i);
    if (!Number.isFinite(strain[i])) throw new MinerError('invalid-residue', 'strain', strain[i], 'must be a finite number', i);
  }
  const m = n > 1 ? n - 1 : 0;
  const out = {
    stressMax: new Float64Array(m),
    stressMin: new Float64Array(m),
    strainMax: new Float64Array(m),
    strainMin: new Float64Array(m),
    startIndex: new Float64Array(m),
    turnIndex: new Float64Array(m),
    closeIndex: new Float64Array(m),
    count: new Float64Array(m).fill(0.5),
  };
  for (let i = 0; i < m; i++) {
    const s0 = stress[i];
    const s1 = stress[i + 1];
    const e0 = strain[i];
    const e1 = strain[i + 1];
    out.stressMax[i] = Math.max(s0, s1);
    out.stressMin[i] = Math.min(s0, s1);
    out.strainMax[i] = Math.max(e0, e1);
    out.strainMin[i] = Math.min(e0, e1);
    out.startIndex[i] = index[i];
    out.turnIndex[i] = index[i + 1];
    out.closeIndex[i] = index[i + 1];
  }
  return out;
}
