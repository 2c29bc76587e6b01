import { checkHistory, integerOption, onlyKnownFields } from './checkOptions';
import { segmentsOutside, type SegmentedHistory } from './Segment';
import { SignalError } from './SignalError';
import { isSampleRate, type TimeBase } from './TimeBase';

/** A range of samples to exclude: sample indices, both ends included. */
export interface SampleRange {
  readonly first: number;
  readonly last: number;
}

/** A range of time to exclude: every sample with startTime ≤ t ≤ endTime (seconds). */
export interface TimeRange {
  readonly startTime: number;
  readonly endTime: number;
}

/** Options of {@link excludeRanges}. */
export interface ExcludeRangesOptions {
  /** Needed for {@link TimeRange}s: a sample rate or a time column (increasing). */
  timeBase?: TimeBase;
  /** Segments shorter than this are dropped too (and recorded as removed). Default 1 (keep all). */
  minimumSegment?: number;
}

/**
 * Removes ranges of samples (or of time) from a history and returns what is left as segments,
 * each with the sample index of its first sample. Ranges must be in increasing order and must
 * not overlap; each end must lie in the history (or, for time ranges, be finite with start ≤ end).
 * Segments are returned separately, not joined: joining puts the last sample before a range
 * next to the first one after it, and rainflow counting then sees a range between them that
 * was never measured. Joining, or assessing the segments as events of a duty cycle, is the
 * caller's choice.
 *
 * Effect on a fatigue result: excluded samples do no damage, and the loops they started or
 * closed change. Removing data is an engineering decision: record why, and compare the lives.
 *
 * @example
 * const { segments, correction } = excludeRanges([1, 2, 3, 4, 5, 6], [{ first: 2, last: 3 }]);
 * segments.map((s) => s.first);
 * // returns [0, 4]
 * correction.summary;
 * // returns '1 place(s) excluded (2 samples), first at sample 2; 2 segment(s) kept'
 */
export function excludeRanges(history: ArrayLike<number>, ranges: readonly (SampleRange | TimeRange)[], options: ExcludeRangesOptions = {}): SegmentedHistory {
  onlyKnownFields(options, ['timeBase', 'minimumSegment'], 'options');
  const x = checkHistory(history);
  const minimumSegment = integerOption(options.minimumSegment, 'minimumSegment', 1, 1);
  if (!Array.isArray(ranges)) throw new SignalError('invalid-argument', 'ranges', ranges, 'must be an array of { first, last } or { startTime, endTime }');
  const n = x.length;
  const places: number[] = [];
  let previousLast = -1;
  ranges.forEach((r, k) => {
    let first: number;
    let last: number;
    if (r !== null && typeof r === 'object' && 'first' in r) {
      onlyKnownFields(r, ['first', 'last'], `ranges[${k}]`);
      first = r.first;
      last = r.last;
      if (!Number.isInteger(first) || first < 0 || first >= n) throw new SignalError('invalid-range', `ranges[${k}].first`, first, `must be a sample index in [0, ${n - 1}]`);
      if (!Number.isInteger(last) || last < first || last >= n) throw new SignalError('invalid-range', `ranges[${k}].last`, last, `must be a sample index in [first = ${first}, ${n - 1}]`);
    } else if (r !== null && typeof r === 'object' && 'startTime' in r) {
      onlyKnownFields(r, ['startTime', 'endTime'], `ranges[${k}]`);
      if (options.timeBase === undefined) throw new SignalError('invalid-option', 'timeBase', undefined, `a time range (ranges[${k}]) needs a time base`);
      if (typeof r.startTime !== 'number' || !Number.isFinite(r.startTime)) throw new SignalError('invalid-range', `ranges[${k}].startTime`, r.startTime, 'must be a finite number of seconds');
      if (typeof r.endTime !== 'number' || !Number.isFinite(r.endTime) || r.endTime < r.startTime)
        throw new SignalError('invalid-range', `ranges[${k}].endTime`, r.endTime, `must be a finite number >= startTime = ${r.startTime}`);
      [first, last] = samplesInTime(options.timeBase, n, r.startTime, r.endTime);
      if (last < first) return; // no sample in that time
    } else throw new SignalError('invalid-range', `ranges[${k}]`, r, 'must be { first, last } or { startTime, endTime }');
    if (first <= previousLast) throw new SignalError('invalid-range', `ranges[${k}]`, r, `ranges must be in increasing order without overlap (the one before ends at sample ${previousLast})`);
    previousLast = last;
    places.push(first, last - first + 1);
  });
  return segmentsOutside(x, places, 'ranges-excluded', { minimumSegment }, minimumSegment, 'excluded');
}

/** First and last sample index with start ≤ t ≤ end (last < first when none). */
function samplesInTime(timeBase: TimeBase, n: number, start: number, end: number): [number, number] {
  let first = 0;
  let last = n - 1;
  if (isSampleRate(timeBase)) {
    const rate = timeBase.sampleRate;
    const t0 = timeBase.startTime ?? 0;
    if (typeof rate !== 'number' || !(rate > 0) || rate === Infinity) throw new SignalError('invalid-option', 'timeBase.sampleRate', rate, 'must be a finite number > 0');
    const t = (i: number) => t0 + i / rate;
    first = Math.max(0, Math.ceil((start - t0) * rate) - 1);
    while (first < n && t(first) < start) first++;
    last = Math.min(n - 1, Math.floor((end - t0) * rate) + 1);
    while (last >= 0 && t(last) > end) last--;
    return [first, last];
  }
  if (timeBase.length !== n) throw new SignalError('invalid-argument', 'timeBase', timeBase.length, `the time column must have one value per sample (${n})`);
  while (first < n && !(timeBase[first] >= start)) first++;
  while (last >= 0 && !(timeBase[last] <= end)) last--;
  return [first, last];
}
