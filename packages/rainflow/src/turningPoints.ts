import { checkHistory, checkOptionFields } from './checkHistory';
import { gateRange, type GateOptions } from './gateRange';
import { ReversalFilter, type ReversalFilterOptions } from './ReversalFilter';

/** Turning points of a history. */
export interface TurningPoints {
  /** Values of the turning points. */
  values: Float64Array;
  /** Sample index of each turning point. */
  indices: Float64Array;
  /** Reversals removed by the gate (0 without one). */
  removed: number;
  /** Gate range in effect. */
  gate: number;
}

/** Options of {@link turningPoints}: the gate, and whether to keep the extremes it would drop before the first reversal. */
export interface TurningPointOptions extends GateOptions {
  /** See {@link ReversalFilterOptions.keepLeadingExtremes}. Default false. */
  keepLeadingExtremes?: boolean;
}

const BLOCK = 65536;

/**
 * Extracts the turning points (peaks and valleys) of a history, with their sample indices.
 *
 * Plateaus collapse to their first sample; the first sample is kept, and so is the last extreme
 * (the last sample, or the first sample of a final plateau). With a gate, a reversal is kept only
 * once the signal has moved back from the running extreme by at least the gate range.
 * NaN or ±Infinity throws `NonFiniteSampleError` naming the sample index.
 *
 * References: ASTM E1049-85 (reapproved 2017), 3.1.13-3.1.16 (peak, valley, reversal).
 *
 * @example
 * turningPoints([0, 2, 2, 1, 3, 3]).values;  // returns Float64Array [0, 2, 1, 3]
 * turningPoints([0, 2, 2, 1, 3, 3]).indices; // returns Float64Array [0, 1, 3, 4]
 * turningPoints([0, 2, 1.5, 3], { gate: 1 }).values; // returns Float64Array [0, 3]
 */
export function turningPoints(history: ArrayLike<number>, options: TurningPointOptions = {}): TurningPoints {
  checkOptionFields(options, ['gate', 'gateFraction', 'fullScale', 'keepLeadingExtremes'], 'turningPoints options');
  checkHistory(history);
  const gate = gateRange(options, history);
  const filter = new ReversalFilter({ gate, keepLeadingExtremes: options.keepLeadingExtremes === true });
  let values = new Float64Array(Math.min(history.length + 1, BLOCK));
  let indices = new Float64Array(values.length);
  let n = 0;
  const ensure = (size: number) => {
    if (size <= values.length) return;
    const cap = Math.max(values.length * 2, size);
    const v = new Float64Array(cap);
    const i = new Float64Array(cap);
    v.set(values.subarray(0, n));
    i.set(indices.subarray(0, n));
    values = v;
    indices = i;
  };
  for (let s = 0; s < history.length; s += BLOCK) {
    const e = Math.min(history.length, s + BLOCK);
    ensure(n + (e - s) + 1);
    n += filter.pushRange(history, s, e, values, indices, n);
  }
  ensure(n + 2);
  n += filter.pendingInto(values, indices, n);
  return { values: values.slice(0, n), indices: indices.slice(0, n), removed: filter.removedCount, gate };
}
