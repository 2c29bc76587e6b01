import { NotchTracker, type LoopTable, type NotchTrackerOptions, type ReversalTable } from '@loopwise/notch';

/** One event of a schedule, as turning points, with its repeat count (internal). */
export interface ScheduleEvent {
  /** Turning-point values of one repeat of the event (gated), or its raw samples (no gate). */
  values: ArrayLike<number>;
  /** Sample index (within the event) of each turning point; null when `values` are the raw samples. */
  indices: Float64Array | null;
  /** Consecutive repeats of the event, >= 1. */
  repeats: number;
  /** Index of the event's first sample in the schedule's sample space (events laid end to end once). */
  sampleBase: number;
  /** Index of its first turning point in the tracker's index space (internal). */
  ordinalBase: number;
}

/** Rows [from, to) of the tracker's loop table, each standing for `weight` loops. */
export interface LoopSegment {
  from: number;
  to: number;
  weight: number;
}

/**
 * Closed loops of a tracked history and the passes made of them (internal): what the damage
 * stage needs, whether it came from a batch schedule or a streaming session.
 */
export interface TrackedLoops {
  /** Every loop the tracker closed, in either pass. */
  loops: LoopTable;
  /** True when some local strain amplitude exceeded the strain limit; index of the first such point. */
  beyondStrainLimit: boolean;
  firstBeyondIndex: number;
  /** Loops of the first pass, from the unloaded state (or the initial value). */
  first: LoopSegment[];
  /** Loops of the stabilised pass (repeating schedules), else the same as `first`. */
  stabilised: LoopSegment[];
  /** Residue of the first pass (open loops at its end), for one-off histories. */
  firstResidue: ReversalTable;
  /** True when the stabilised pass copied the first pass from the largest |value| on. */
  reusedFirstPass: boolean;
}

/** Points pushed before the tables are sized from the loop rate seen so far. */
const SIZING_POINTS = 65536;

/** What {@link trackSchedule} returns (internal). */
export interface ScheduleTrack extends TrackedLoops {
  /** Turning points the tracker was fed (repeats not materialised are not counted). */
  pushedPoints: number;
}

/**
 * Runs the notch tracker over a schedule of events with repeat counts, as if the schedule were
 * one long history, without materialising repeats.
 *
 * Method. Each repeat of an event is pushed with the event's own indices. After each repeat the
 * tracker's memory is compared with the memory after the previous repeat: once they are equal,
 * every further repeat starts from the same memory and closes the same loops, so the loops of
 * that repeat get the remaining repeat count as their weight and the rest are skipped. (Two or
 * three repeats are usually enough: the first repeat's largest excursion closes all smaller
 * memory.) For a repeating schedule, a second pass starts from the memory the first left; it is
 * pushed only up to the schedule's first sample of largest |value|, where every loop has closed
 * back to the first-loading curve, and if the memory then equals the first pass's memory at the
 * same point, the first pass's loops from there on are reused (Clormann and Seeger's memory
 * rules make the rest identical). Otherwise the second pass is tracked in full.
 *
 * Cost: about two repeats per event for the first pass, plus the schedule up to its largest
 * |value| for the second, whatever the repeat counts.
 */
export function trackSchedule(events: ScheduleEvent[], options: NotchTrackerOptions, repeating: boolean): ScheduleTrack {
  const t = new NotchTracker({ ...options, recordReversals: false });
  // points the passes will push (repeats stop after about two copies), to size the tables once
  let expected = 0;
  for (const e of events) expected += e.values.length * Math.min(e.repeats, 3);
  if (repeating) expected *= 2;
  let pushed = 0;
  let reserved = false;
  const push = (e: ScheduleEvent, from: number, to: number) => {
    if (!reserved && to - from > SIZING_POINTS - pushed) {
      // the first points set the loop rate; then the tables are sized for the whole schedule, so
      // tables of millions of rows are not copied at every doubling
      const head = from + (SIZING_POINTS - pushed);
      t.pushRange(e.values, from, head);
      pushed += head - from;
      t.reserveFor(expected);
      reserved = true;
      from = head;
    }
    t.pushRange(e.values, from, to);
    pushed += to - from;
  };

  /**
   * One pass over the schedule: each event's repeats in a row, the loops of each repeat as a
   * segment; once the memory after a repeat equals the memory after the one before, the
   * remaining repeats close the same loops and are counted by weight. `firstRepeat` pushes the
   * first repeat of an event (starting at loop row `before`) and returns false to end the pass.
   */
  const pass = (segments: LoopSegment[], firstRepeat: (e: ScheduleEvent, k: number, before: number) => boolean): void => {
    for (let k = 0; k < events.length; k++) {
      const e = events[k];
      let previous: ReturnType<NotchTracker['snapshot']> | null = null;
      for (let r = 1; r <= e.repeats; r++) {
        const before = t.loops.length;
        t.restartIndex(e.ordinalBase);
        if (r > 1) push(e, 0, e.values.length);
        else if (!firstRepeat(e, k, before)) return;
        const segment: LoopSegment = { from: before, to: t.loops.length, weight: 1 };
        segments.push(segment);
        if (r === e.repeats) break;
        if (previous !== null && t.matches(previous)) {
          segment.weight += e.repeats - r; // every further repeat closes the same loops
          break;
        }
        previous = t.snapshot();
      }
    }
  };

  // first pass: each event's first repeat pushed whole; the row of its first segment noted
  const first: LoopSegment[] = [];
  const firstSegment: number[] = [];
  pass(first, (e, k) => {
    firstSegment[k] = first.length;
    push(e, 0, e.values.length);
    return true;
  });
  // The schedule's first point of largest |value| (the tracker notes it at its reversals;
  // repeats bring no new values) and the memory right after it, known without a copy.
  const peak = t.largestPoint();
  let peakEvent = -1;
  if (peak !== null) {
    for (let k = 0; k < events.length && peakEvent < 0; k++) {
      const e = events[k];
      if (peak.index >= e.ordinalBase && peak.index < e.ordinalBase + e.values.length) peakEvent = k;
    }
  }
  const firstResidue = t.residue();
  if (!repeating) return finish(t, first, first, firstResidue, false, pushed);

  // stabilised pass: up to the largest |value|, then the first pass's loops if the memories agree
  const stabilised: LoopSegment[] = [];
  let reused = false;
  pass(stabilised, (e, k, before) => {
    if (k !== peakEvent || peak === null) {
      push(e, 0, e.values.length);
      return true;
    }
    const peakPoint = peak.index - e.ordinalBase;
    push(e, 0, peakPoint + 1);
    if (!t.matches(peak.after)) {
      push(e, peakPoint + 1, e.values.length);
      return true;
    }
    // The stabilised pass in the order its loops close when it starts just after the largest
    // |value| (as ASTM E1049-85 5.4.5 starts a repeating history at its largest peak): the first
    // pass's loops from there to the end, then those of the second pass up to the peak. For a
    // single history the rows are then one run of the tracker's table.
    const peakSegment = firstSegment[k];
    const upToPeak = stabilised.splice(0, stabilised.length);
    stabilised.push({ from: peak.loopRow, to: first[peakSegment].to, weight: 1 });
    for (let j = peakSegment + 1; j < first.length; j++) stabilised.push({ ...first[j] });
    stabilised.push(...upToPeak, { from: before, to: t.loops.length, weight: 1 });
    reused = true;
    return false;
  });
  return finish(t, first, stabilised, firstResidue, reused, pushed);
}

function finish(
  t: NotchTracker,
  first: LoopSegment[],
  stabilised: LoopSegment[],
  firstResidue: ReversalTable,
  reusedFirstPass: boolean,
  pushedPoints: number,
): ScheduleTrack {
  // hand the tables over (no copy of millions of rows)
  const r = t.takeResult();
  return {
    loops: r.loops,
    beyondStrainLimit: r.beyondStrainLimit,
    firstBeyondIndex: r.firstBeyondIndex,
    first,
    stabilised,
    firstResidue,
    reusedFirstPass,
    pushedPoints,
  };
}
