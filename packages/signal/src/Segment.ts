import { correctionRecord, type CorrectionKind, type CorrectionRecord } from './CorrectionRecord';

/** A piece of a history kept by {@link excludeRanges} or {@link splitAtDropouts}. */
export interface Segment {
  /** Sample index, in the input, of the segment's first sample. */
  readonly first: number;
  /** The samples (a copy). */
  readonly values: Float64Array;
}

/** The result of a correction that cuts a history into segments. */
export interface SegmentedHistory {
  readonly segments: readonly Segment[];
  readonly correction: CorrectionRecord;
}

/**
 * The samples outside the removed places (sorted, non-overlapping [first, length] pairs) as
 * segments of at least `minimumLength` samples (shorter ones are dropped and counted as
 * removed), and the record of it. The one cutting recipe of excludeRanges and splitAtDropouts.
 */
export function segmentsOutside(x: ArrayLike<number>, places: number[], kind: CorrectionKind, parameters: Record<string, number | string>, minimumLength: number, what: string): SegmentedHistory {
  const n = x.length;
  const segments: Segment[] = [];
  const removed: number[] = [];
  let removedSamples = 0;
  let start = 0;
  const keep = (from: number, to: number) => {
    if (to <= from) return;
    if (to - from >= minimumLength) {
      const v = new Float64Array(to - from);
      for (let i = from; i < to; i++) v[i - from] = x[i];
      segments.push(Object.freeze({ first: from, values: v }));
    } else {
      removed.push(from, to - from);
      removedSamples += to - from;
    }
  };
  for (let k = 0; k < places.length; k += 2) {
    keep(start, places[k]);
    removed.push(places[k], places[k + 1]);
    removedSamples += places[k + 1];
    start = places[k] + places[k + 1];
  }
  keep(start, n);
  // adjacent removed places (a dropped short segment next to a range) read as one
  const merged: number[] = [];
  const order = [];
  for (let k = 0; k < removed.length; k += 2) order.push([removed[k], removed[k + 1]]);
  order.sort((p, q) => p[0] - q[0]);
  for (const [f, l] of order) {
    const m = merged.length;
    if (m > 0 && merged[m - 2] + merged[m - 1] === f) merged[m - 1] += l;
    else merged.push(f, l);
  }
  const count = merged.length / 2;
  const summary =
    count === 0
      ? `nothing ${what}; 1 segment`
      : `${count} place(s) ${what} (${removedSamples} samples), first at sample ${merged[0]}; ${segments.length} segment(s) kept`;
  return { segments, correction: correctionRecord(kind, merged, count, removedSamples, parameters, summary) };
}
