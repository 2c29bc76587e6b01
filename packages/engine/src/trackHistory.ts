import { NotchSampleError, RepeatingNotchTracker, type LoopTable, type NotchTrackerOptions, type ReversalTable } from '@loopwise/notch';
import { NonFiniteSampleError, turningPoints } from '@loopwise/rainflow';
import { strainLifeMaterial, type ResolvedJob } from './LifeJob';
import { eventStartsOf, sampleError, scheduleGate, type DutyEvent } from './schedule';

/** Rows `[from, to)` of a tracked history's loop table. */
export interface RowRange {
  from: number;
  to: number;
}

/**
 * What the tracking stage leaves for the damage stage, from a batch schedule or a streaming
 * session alike: one loop table with the rows of both passes, and which rows make each pass.
 */
export interface TrackedHistory {
  /** Every loop the tracker closed, both passes; `count` carries repeats counted at once. */
  loops: LoopTable;
  /** The first pass's rows (from the unloaded state or the initial value). */
  first: RowRange;
  /** The stabilised pass's rows (repeating histories), else the first pass's. */
  stabilised: RowRange;
  /** Open loops at the end of the first pass (half cycles of a one-off history). */
  firstResidue: ReversalTable;
  reusedFirstPass: boolean;
  beyondStrainLimit: boolean;
  /** Sample index of the first point beyond the strain limit, or -1. */
  firstBeyondIndex: number;
  /** Index of each event's first sample in the schedule's sample space. */
  eventStarts: number[];
  totalSamples: number;
  /** The gate in effect, and the reversals it removed per repeat of the schedule. */
  gate: number;
  removed: number;
  /** Largest |value| (offset applied) of the kept points and the initial value (the gate bound's envelope point); 0 without removals. */
  largestKept: number;
}

/** Tracker options of a job. */
export function trackerOptionsOf(job: ResolvedJob): NotchTrackerOptions {
  const o: NotchTrackerOptions = {
    material: strainLifeMaterial(job),
    input: job.input,
    rule: job.rule,
    loadToStress: job.loadToStress,
    initial: job.initial,
    offset: job.offset,
    tolerance: job.tolerance,
    recordReversals: false,
  };
  if (job.Kt !== undefined) o.Kt = job.Kt;
  if (job.Kf !== undefined) o.Kf = job.Kf;
  return o;
}

/** The tracking stage's result from a finished repeating tracker (shared by batch and stream). */
export function trackedFrom(
  tracker: RepeatingNotchTracker,
  repeating: boolean,
  facts: Pick<TrackedHistory, 'eventStarts' | 'totalSamples' | 'gate' | 'removed' | 'largestKept'>,
): TrackedHistory {
  const r = tracker.finish();
  const first = { from: r.first.loopFrom - r.loopRowOffset, to: r.first.loopTo - r.loopRowOffset };
  const s = repeating && r.stabilised !== null ? { from: r.stabilised.loopFrom - r.loopRowOffset, to: r.stabilised.loopTo - r.loopRowOffset } : first;
  return {
    loops: r.loops,
    first,
    stabilised: s,
    firstResidue: r.first.residue,
    reusedFirstPass: r.reusedFirstPass,
    beyondStrainLimit: r.beyondStrainLimit,
    firstBeyondIndex: r.firstBeyondIndex,
    ...facts,
  };
}

/**
 * The tracking stage of a checked schedule: each event's turning points (with the gate, keeping
 * the extremes before its first reversal so its first excursion stays exact whatever came
 * before) with their schedule sample indices, into the repeating notch tracker, repeats counted
 * by the tracker; for a repeating schedule, the second pass too. One route for every gate (0
 * included), so events, indices and close indices do not depend on whether a gate is set.
 */
export function trackDutyCycle(events: DutyEvent[], job: ResolvedJob): TrackedHistory {
  const gate = scheduleGate(job, events);
  const starts = eventStartsOf(events);
  const points: { values: Float64Array; indices: Float64Array }[] = [];
  let removed = 0;
  let expected = 0;
  events.forEach((e, k) => {
    let tp;
    try {
      tp = turningPoints(e.history, { gate, keepLeadingExtremes: true });
    } catch (err) {
      if (err instanceof NonFiniteSampleError) throw sampleError(events, k, err.index as number, err.value as number);
      throw err;
    }
    removed += tp.removed * e.repeats;
    const indices = tp.indices;
    const base = starts[k];
    if (base !== 0) for (let i = 0; i < indices.length; i++) indices[i] += base;
    points.push({ values: tp.values, indices });
    expected += tp.values.length * Math.ceil(Math.min(e.repeats, 3));
  });
  const tracker = new RepeatingNotchTracker({ ...trackerOptionsOf(job), expectedPoints: expected });
  try {
    points.forEach((p, k) => tracker.push(p.values, p.indices, 0, p.values.length, events[k].repeats));
    if (job.repeating) {
      tracker.endFirstPass();
      points.forEach((p, k) => tracker.pushAgain(p.values, p.indices, 0, p.values.length, events[k].repeats));
    }
  } catch (err) {
    // turning points are finite; kept for safety: name the event and its own sample index
    if (err instanceof NotchSampleError) {
      const k = Math.max(0, starts.findIndex((_, j) => j === starts.length - 1 || starts[j + 1] > err.index));
      throw sampleError(events, k, err.index - starts[k], err.value, job.offset);
    }
    throw err;
  }
  let largestKept = 0;
  if (removed > 0) {
    largestKept = Math.abs(job.initial);
    for (const p of points) {
      for (let i = 0; i < p.values.length; i++) {
        const a = Math.abs(p.values[i] + job.offset);
        if (a > largestKept) largestKept = a;
      }
    }
  }
  return trackedFrom(tracker, job.repeating, { eventStarts: starts, totalSamples: starts[starts.length - 1] + events[events.length - 1].history.length, gate, removed, largestKept });
}
