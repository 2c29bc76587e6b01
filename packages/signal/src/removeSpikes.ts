import { checkHistory } from './checkOptions';
import { correctionRecord, type CorrectionRecord } from './CorrectionRecord';
import type { FindingTable } from './FindingTable';
import { SignalError } from './SignalError';

/** The result of {@link removeSpikes}: the corrected copy and what was done. */
export interface SpikeRemoval {
  readonly values: Float64Array;
  readonly correction: CorrectionRecord;
}

/**
 * Replaces spike samples by linear interpolation between the nearest samples on either side
 * that are not spikes (a run of adjacent spike samples is bridged as one; a run at the start or
 * end of the record takes the value of its one neighbour). `spikes` is a {@link FindingTable}
 * (its `spike` rows are used) or sample indices in increasing order. The input is not changed;
 * {@link removeSpikesInto} writes into a caller-owned array (which may be the input).
 *
 * Effect on a fatigue result: a spike is a turning point that starts or ends a large range;
 * removing it removes that range, and the life usually grows. Whether a spike is an artefact
 * is an engineering decision; compare the lives with and without it.
 *
 * @example
 * removeSpikes([0, 1, 50, 3, 4], [2]).values;
 * // returns Float64Array [0, 1, 2, 3, 4]
 */
export function removeSpikes(history: ArrayLike<number>, spikes: FindingTable | ArrayLike<number>): SpikeRemoval {
  const x = checkHistory(history);
  const out = new Float64Array(x.length);
  const correction = removeSpikesInto(x, spikes, out);
  return { values: out, correction };
}

/**
 * {@link removeSpikes} into `out` (a Float64Array of the history's length; it may be the
 * history itself, for an in-place correction; then only the samples it reads are checked for
 * NaN and ±Infinity, otherwise every sample is, as it is copied). Returns the correction record.
 */
export function removeSpikesInto(history: ArrayLike<number>, spikes: FindingTable | ArrayLike<number>, out: Float64Array): CorrectionRecord {
  const x = history;
  const n = x.length;
  if (!(out instanceof Float64Array) || out.length !== n) throw new SignalError('invalid-argument', 'out', out, `must be a Float64Array of length ${n}`);
  const idx = spikeIndices(spikes, n);
  if (out !== x)
    for (let i = 0; i < n; i++) {
      const v = x[i];
      if (v - v !== 0) throw new SignalError('non-finite-sample', 'history', v, 'samples must be finite numbers', i);
      out[i] = v;
    }
  else for (let k = 0; k < idx.length; k++) for (const i of [idx[k] - 1, idx[k], idx[k] + 1]) if (i >= 0 && i < n && x[i] - x[i] !== 0) throw new SignalError('non-finite-sample', 'history', x[i], 'samples must be finite numbers', i);
  const places = spikeRuns(idx);
  for (let r = 0; r < places.length; r += 2) interpolateSpikeRun(x, places[r], places[r] + places[r + 1] - 1, out);
  return spikeRecord(idx, places);
}

/** The record of interpolating the spikes `idx` in the runs `places` (from {@link spikeRuns}). */
export function spikeRecord(idx: Float64Array, places: readonly number[]): CorrectionRecord {
  const count = places.length / 2;
  const summary = count === 0 ? 'no spikes interpolated' : `${count} spike(s) interpolated (${idx.length} samples), first at sample ${idx[0]}`;
  return correctionRecord('spikes-interpolated', places, count, idx.length, { method: 'linear interpolation' }, summary);
}

/** The sample indices of `spikes` (a FindingTable's `spike` rows, or indices), checked: integers in [0, n), increasing. */
export function spikeIndices(spikes: FindingTable | ArrayLike<number>, n: number): Float64Array {
  let idx: Float64Array;
  if (spikes !== null && typeof spikes === 'object' && 'select' in spikes && typeof spikes.select === 'function') idx = spikes.select('spike').columns().index;
  else if (spikes !== null && typeof spikes === 'object' && typeof (spikes as ArrayLike<number>).length === 'number') idx = Float64Array.from(spikes as ArrayLike<number>);
  else throw new SignalError('invalid-argument', 'spikes', spikes, 'must be a FindingTable or sample indices');
  for (let k = 0; k < idx.length; k++) {
    const i = idx[k];
    if (!Number.isInteger(i) || i < 0 || i >= n) throw new SignalError('invalid-range', `spikes[${k}]`, i, `must be a sample index in [0, ${n - 1}]`);
    if (k > 0 && i <= idx[k - 1]) throw new SignalError('invalid-range', `spikes[${k}]`, i, `indices must increase (the one before is ${idx[k - 1]})`);
  }
  return idx;
}

/** Runs of adjacent spike indices as flat [first, length] pairs (a run is bridged as one). */
export function spikeRuns(idx: Float64Array): number[] {
  const places: number[] = [];
  for (let k = 0; k < idx.length; ) {
    let e = k;
    while (e + 1 < idx.length && idx[e + 1] === idx[e] + 1) e++;
    places.push(idx[k], idx[e] - idx[k] + 1);
    k = e + 1;
  }
  return places;
}

/**
 * Writes out[first … last], the samples of one run of spikes, interpolated linearly between
 * x[first − 1] and x[last + 1] (the one neighbour at an end of the record; x[i] itself when
 * the run is the whole record). The one place of the interpolation rule: {@link removeSpikesInto}
 * and the spike-free low-pass of {@link conditionSignalInto} both use it.
 */
export function interpolateSpikeRun(x: ArrayLike<number>, first: number, last: number, out: Float64Array): void {
  const n = x.length;
  const left = first - 1;
  const right = last + 1;
  for (let i = first; i <= last; i++) {
    if (left < 0 && right >= n) out[i] = x[i];
    else if (left < 0) out[i] = x[right];
    else if (right >= n) out[i] = x[left];
    else {
      // (1 − t)·left + t·right cannot overflow for finite ends, unlike left + t·(right − left)
      const t = (i - left) / (right - left);
      out[i] = (1 - t) * x[left] + t * x[right];
    }
  }
}
