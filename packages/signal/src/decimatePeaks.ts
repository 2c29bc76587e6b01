import { checkHistory, onlyKnownFields, positiveOption } from './checkOptions';
import { correctionRecord, type CorrectionRecord } from './CorrectionRecord';

/** Options of {@link decimatePeaks}. */
export interface DecimatePeaksOptions {
  /** Gate (hysteresis range) in the history's unit: reversals smaller than this go. Default 0 (keep every turning point). */
  gate?: number;
}

/** The result of {@link decimatePeaks}. */
export interface Decimation {
  /** The samples kept. */
  readonly values: Float64Array;
  /** Their sample indices in the input (increasing). */
  readonly indices: Float64Array;
  readonly correction: CorrectionRecord;
}

/**
 * Peak-preserving decimation: keeps the first sample, every reversal that the gate keeps, and
 * the last sample; drops everything between. A reversal is kept once the signal has moved back
 * from the running extreme by at least the gate (by any amount for gate 0); plateaus collapse
 * to their first sample; before the first reversal, whichever of the running maximum and
 * minimum the signal first moves back from by the gate is kept. This is the gate rule of the
 * design (DESIGN.md "Gate") and of rainflow's `ReversalFilter` without leading extremes, so
 * rainflow counting of the kept samples with the same gate gives the same cycles (ranges,
 * means, and, through `indices`, the same sample indices) as counting the whole history — a
 * property test checks it against `@loopwise/rainflow`.
 *
 * Effect on a fatigue result: none above the gate (the cycles are the same); the time course
 * between reversals is lost (filters, plots and time-based checks need the full history), and
 * cycles below the gate are gone, as with the gate itself.
 *
 * @example
 * const d = decimatePeaks([0, 1, 2, 3, 2, 1, 1.5, 0, 4], { gate: 1 });
 * d.values;
 * // returns Float64Array [0, 3, 0, 4]
 * d.indices;
 * // returns Float64Array [0, 3, 7, 8]
 */
export function decimatePeaks(history: ArrayLike<number>, options: DecimatePeaksOptions = {}): Decimation {
  onlyKnownFields(options, ['gate'], 'options');
  const gate = positiveOption(options.gate, 'gate', 0, true);
  const x = checkHistory(history);
  const n = x.length;
  const values = new Float64Array(n);
  const indices = new Float64Array(n);
  let w = 0;
  if (n > 0) {
    // ext − v >= Number.MIN_VALUE holds exactly when v < ext, so one comparison serves both cases
    const g = gate > 0 ? gate : Number.MIN_VALUE;
    values[0] = x[0];
    indices[0] = 0;
    w = 1;
    let hi = x[0];
    let lo = x[0];
    let hiIndex = 0;
    let loIndex = 0;
    let dir = 0;
    let ext = x[0];
    let extIndex = 0;
    for (let i = 1; i < n; i++) {
      const v = x[i];
      if (dir > 0) {
        if (v > ext) {
          ext = v;
          extIndex = i;
        } else if (ext - v >= g) {
          values[w] = ext;
          indices[w++] = extIndex;
          dir = -1;
          ext = v;
          extIndex = i;
        }
      } else if (dir < 0) {
        if (v < ext) {
          ext = v;
          extIndex = i;
        } else if (v - ext >= g) {
          values[w] = ext;
          indices[w++] = extIndex;
          dir = 1;
          ext = v;
          extIndex = i;
        }
      } else if (v > hi) {
        if (v - lo >= g) {
          if (loIndex !== 0) {
            values[w] = lo;
            indices[w++] = loIndex;
          }
          dir = 1;
          ext = v;
          extIndex = i;
        }
        hi = v;
        hiIndex = i;
      } else if (v < lo) {
        if (hi - v >= g) {
          if (hiIndex !== 0) {
            values[w] = hi;
            indices[w++] = hiIndex;
          }
          dir = -1;
          ext = v;
          extIndex = i;
        }
        lo = v;
        loIndex = i;
      }
    }
    if (dir !== 0 && extIndex > indices[w - 1]) {
      values[w] = ext;
      indices[w++] = extIndex;
    }
    if (n > 1 && indices[w - 1] !== n - 1) {
      values[w] = x[n - 1];
      indices[w++] = n - 1;
    }
  }
  const dropped = n - w;
  const correction = correctionRecord(
    'decimated',
    [0, n],
    n === 0 ? 0 : 1,
    dropped,
    { gate, method: 'turning points above the gate' },
    `decimated to the turning points above the gate ${gate}: ${w} of ${n} samples kept`,
  );
  return { values: values.slice(0, w), indices: indices.slice(0, w), correction };
}
