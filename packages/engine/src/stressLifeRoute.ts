import { damageInto, residueHalfCycles } from '@loopwise/miner';
import { CycleTable, NonFiniteSampleError, RainflowCounter, type CycleColumns, type CycleSink } from '@loopwise/rainflow';
import { cycleLivesInto, cyclesToFailureInto, equivalentAmplitudeInto, StressLifeError } from '@loopwise/stress-life';
import { EngineError } from './EngineError';
import type { ResolvedJob, ResolvedStressLife } from './LifeJob';
import type { LifeLoopColumns, LifeWarning } from './LifeReport';
import { emptyColumns, eventsInto } from './reportColumns';
import { eventStartsOf, sampleError, scheduleGate, type DutyEvent } from './schedule';

/**
 * Lives shorter than this many cycles are outside the S-N curves of the weld standards and of
 * most material curves, which begin at 10^4 cycles (common practice, no source: the range drawn
 * in the standards' figures, value from memory); below it lies low-cycle fatigue, the strain-life
 * route's domain.
 */
export const CURVE_LOW_CYCLE_LIMIT = 1e4;

/** What the counting stage of the stress-life route leaves for the damage stage. */
export interface CountedSchedule {
  /** Cycles of one repeat of the schedule (closed ones, then the residue's), schedule sample indices. */
  cycles: CycleColumns;
  /** Rows of `cycles` closed before the end (the rest close the residue of a repeating schedule). */
  closedRows: number;
  /** The half cycles of the residue at the end of the first pass (they give the first pass's damage), schedule sample indices. */
  residueHalves: HalfCycleRows;
  eventStarts: number[];
  totalSamples: number;
  gate: number;
  /** Reversals the gate removed per repeat of the schedule. */
  removed: number;
  /** Largest |value + offset| of the schedule (the gate bound's envelope); 0 when the gate removed nothing. */
  largest: number;
}

/**
 * Maps the counter's running sample ordinals (one per pushed sample, repeats pushed again) back
 * to schedule sample indices: each pushed block of an event is a segment.
 */
class OrdinalMap {
  private ordinals: number[] = [];
  private bases: number[] = [];

  /** A block of samples pushed from ordinal `ordinal` on, sample 0 of which is schedule index `base`. */
  add(ordinal: number, base: number): void {
    this.ordinals.push(ordinal);
    this.bases.push(base);
  }

  /** Segment of an ordinal. */
  segment(o: number): number {
    const a = this.ordinals;
    let lo = 0;
    let hi = a.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (a[mid] <= o) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  }

  map(o: number): number {
    const k = this.segment(o);
    return this.bases[k] + (o - this.ordinals[k]);
  }
}

/** A sink that maps the counter's ordinals to schedule indices and adds the cycles to `target`. */
class MappedSink implements CycleSink {
  constructor(
    private readonly ordinals: OrdinalMap,
    private readonly target: CycleTable,
  ) {}
  addCycle(from: number, to: number, count: number, startIndex: number, turnIndex: number, closeIndex: number): void {
    const m = this.ordinals;
    this.target.addCycle(from, to, count, m.map(startIndex), m.map(turnIndex), m.map(closeIndex));
  }
}

/** Residue points up to which the counter's state is compared after each repeat of an event. */
const STATE_CHECK_POINTS = 512;

/** The counter's state without its indices: equal states count the same cycles from here on. */
function stateKey(counter: RainflowCounter): string {
  const s = counter.toJSON();
  const f = s.filter;
  return JSON.stringify([s.stackValues, f.started, f.dir, f.ext, f.hi, f.lo]);
}

/**
 * The counting stage of the stress-life route for a checked schedule: four-point rainflow
 * (ASTM E1049-85, 5.4.4) over the events in order, each run `repeats` times, with the gate over
 * the whole sequence; the residue of a repeating schedule is closed as the schedule repeats
 * (5.4.5), that of a one-off schedule counts as half cycles. Repeats are not all pushed: once an
 * event's repeat leaves the counter in the state the previous one left it (the residue stack and
 * the pending extreme, by value), every later repeat counts exactly the same cycles, so that
 * repeat's cycles are counted once with their count times the repeats left. Sample indices are
 * the schedule's (each event's samples once), as on the strain-life route.
 */
export function countSchedule(events: DutyEvent[], job: ResolvedJob): CountedSchedule {
  const gate = scheduleGate(job, events);
  const starts = eventStartsOf(events);
  const ordinals = new OrdinalMap();
  // room for the cycles up front (a cycle per 12 samples; the reference history has one per 13),
  // so the table rarely grows: each growth copies every column. An event's repeats usually add
  // rows for two runs before its state repeats and the rest are scaled (below), so at most two count.
  let samples = 0;
  for (const e of events) samples += e.history.length * Math.min(e.repeats, 2);
  const all = new CycleTable(Math.max(1024, Math.min(1 << 24, Math.ceil(samples / 12))));
  const counter = new RainflowCounter({ gate, residue: job.repeating ? 'repeat' : 'half', sink: new MappedSink(ordinals, all) });
  let removed = 0;
  let largest = 0;
  events.forEach((e, k) => {
    let previous = '';
    let removedBefore = counter.removedCount;
    // the whole repeats are counted here; a fraction left adds its share of one repeat's cycles below
    const whole = Math.floor(e.repeats);
    for (let j = 0; j < whole; j++) {
      const at = counter.nextIndex;
      ordinals.add(at, starts[k]);
      const rowsBefore = all.length;
      try {
        counter.push(e.history);
      } catch (err) {
        if (err instanceof NonFiniteSampleError) throw sampleError(events, k, (err.index as number) - at, err.value as number);
        throw err;
      }
      // the state is compared while the residue is small; a block whose repeats keep adding
      // to the residue (exact ties at its extremes, kept for the seam: docs/rainflow.md) is
      // pushed repeat by repeat, its cost growing with the repeats
      const key = counter.stackLength <= STATE_CHECK_POINTS ? stateKey(counter) : '';
      const removedNow = counter.removedCount - removedBefore;
      removedBefore = counter.removedCount;
      if (j > 0 && key !== '' && key === previous) {
        // the state repeats: repeats j … whole − 1 count what this one counted
        all.scaleCounts(rowsBefore, whole - j);
        removed += removedNow * (whole - j);
        return;
      }
      removed += removedNow;
      previous = key;
    }
  });
  // Fractions of repeats: f = repeats − whole times the cycles one more repeat of the event adds
  // in the middle of its run, which are the cycles of the event alone as a repeating block (its
  // residue closed with itself, ASTM E1049-85 5.4.5: the extra copy's points collapse against
  // the copy before it); the property test checks the damage against whole + 1 repeats. Their
  // indices are the event's own.
  events.forEach((e, k) => {
    const fraction = e.repeats - Math.floor(e.repeats);
    if (fraction === 0) return;
    const alone = new RainflowCounter({ gate, residue: 'repeat' });
    alone.push(e.history);
    const c = (alone.finish().cycles as CycleTable).columns();
    for (let i = 0; i < c.count.length; i++) all.addCycle(c.from[i], c.to[i], c.count[i] * fraction, starts[k] + c.startIndex[i], starts[k] + c.turnIndex[i], starts[k] + c.closeIndex[i]);
    removed += alone.removedCount * fraction;
  });
  // the largest |value| only bounds what the gate removed: not needed (and not scanned) when it removed nothing
  if (removed > 0) {
    for (const e of events) {
      for (let i = 0; i < e.history.length; i++) {
        const a = Math.abs(e.history[i] + job.offset);
        if (a > largest) largest = a;
      }
    }
  }
  const closedRows = all.length;
  const result = counter.finish();
  const residueHalves = residueHalfRows(result.residue.values, result.residue.indices, (o) => ordinals.map(o));
  return {
    cycles: all.columns(),
    closedRows,
    residueHalves,
    eventStarts: starts,
    totalSamples: starts[starts.length - 1] + events[events.length - 1].history.length,
    gate,
    removed,
    largest,
  };
}

/** The stress that one unit of the history (offset applied) stands for on the curve: loadToStress · Kf · stress factor. */
export function stressScale(job: ResolvedJob): number {
  const s = job.stressLife as ResolvedStressLife;
  return job.loadToStress * s.kf * s.stressFactor;
}

/**
 * The damage stage of the stress-life route: report loop columns of counted cycles. Stresses
 * are those the curve is entered with, σ = (x + offset) · loadToStress · Kf · f; the damage
 * parameter is the equivalent fully reversed range (or amplitude, as the curve's measure) after
 * the mean-stress correction; lives in cycles (reversals twice that); damage count / Nf with the
 * job's cut-off. No local strain is computed on this route: the strain columns are empty.
 */
export function stressLoopColumns(
  cycles: Pick<CycleColumns, 'from' | 'to' | 'count' | 'startIndex' | 'turnIndex' | 'closeIndex'>,
  job: ResolvedJob,
  starts: readonly number[],
  own = false,
): LifeLoopColumns {
  const s = job.stressLife as ResolvedStressLife;
  const n = cycles.count.length;
  const scale = stressScale(job);
  // With `own` the caller hands the cycle columns over (nobody reads them afterwards): the count
  // and index columns become the report's as they are, and `from` / `to` are overwritten with
  // σmax / σmin; otherwise every column is the report's own copy.
  const copy = (a: Float64Array) => (own ? a : a.slice()); // slice: one block copy
  const c = emptyColumns(n, {
    strainMax: new Float64Array(0),
    strainMin: new Float64Array(0),
    count: copy(cycles.count),
    startIndex: copy(cycles.startIndex),
    turnIndex: copy(cycles.turnIndex),
    closeIndex: copy(cycles.closeIndex),
    ...(own ? { stressMax: cycles.from, stressMin: cycles.to } : {}),
  });
  if (n === 0) return c;
  // scratch in columns written last: the range in `parameter` (its amplitude is range / 2), the
  // mean in `reversalsToFailure` (2 Nf at the end), so no temporary columns are allocated
  const range = c.parameter;
  const mean = c.reversalsToFailure;
  const from = cycles.from;
  const to = cycles.to;
  const hi = c.stressMax;
  const lo = c.stressMin;
  const offset = job.offset;
  for (let i = 0; i < n; i++) {
    const a = (from[i] + offset) * scale;
    const b = (to[i] + offset) * scale; // both read before hi / lo (which may be from / to) are written
    const top = a > b ? a : b;
    const bottom = a > b ? b : a;
    hi[i] = top;
    lo[i] = bottom;
    range[i] = top - bottom;
    mean[i] = (top + bottom) / 2;
  }
  eventsInto(c.startIndex, c.startEvent, starts);
  eventsInto(c.turnIndex, c.turnEvent, starts);
  // σar once (the amplitude range / 2, corrected for the mean), then S = σar or 2σar in the
  // curve's measure is the damage parameter and Nf = N(S): the same numbers as cycleLivesInto
  // (range·0.5 and range / 2 are one double), without computing σar a second time
  const k = s.curve.measure === 'range' ? 2 : 1;
  try {
    for (let i = 0; i < n; i++) c.parameter[i] = range[i] / 2; // in place: range is parameter
    equivalentAmplitudeInto(s.meanStress, c.parameter, mean, c.parameter);
    if (k !== 1) for (let i = 0; i < n; i++) c.parameter[i] *= k;
    cyclesToFailureInto(s.curve, c.parameter, c.cyclesToFailure);
  } catch (err) {
    if (err instanceof StressLifeError && err.index !== undefined) {
      const i = err.index;
      throw new EngineError(
        'invalid-stress-cycle',
        'stressLife',
        err.value,
        `the cycle from sample ${c.startIndex[i]} to ${c.turnIndex[i]} (σmax ${c.stressMax[i]}, σmin ${c.stressMin[i]}) cannot be assessed: ${err.message}`,
        c.startIndex[i],
      );
    }
    throw err;
  }
  for (let i = 0; i < n; i++) c.reversalsToFailure[i] = 2 * c.cyclesToFailure[i];
  damageInto(c.count, c.cyclesToFailure, c.damage, job.cutoffCycles === undefined ? {} : { cutoff: { cycles: job.cutoffCycles } });
  return c;
}

/** A residue's half cycles as cycle rows, with its indices mapped by `index` (the counter's to the schedule's). */
export type HalfCycleRows = Pick<CycleColumns, 'from' | 'to' | 'count' | 'startIndex' | 'turnIndex' | 'closeIndex'>;

/**
 * The half cycles of a rainflow residue (values with the counter's increasing indices) by
 * miner's residueHalfCycles (ASTM E1049-85 5.4.4), their indices then mapped by `index`: on a
 * schedule they may fall back where the residue spans an event's repeats, since the schedule's
 * indices count each event once.
 */
export function residueHalfRows(values: Float64Array, indices: Float64Array, index: (o: number) => number = (o) => o): HalfCycleRows {
  const h = residueHalfCycles({ index: indices, stress: values, strain: new Float64Array(values.length) });
  const map = (a: Float64Array) => Float64Array.from(a, index);
  // the stress columns are the pair's larger and smaller value: from and to for the curve
  return { from: h.stressMax, to: h.stressMin, count: h.count, startIndex: map(h.startIndex), turnIndex: map(h.turnIndex), closeIndex: map(h.closeIndex) };
}

/** Facts behind the stress route's warnings (batch and stream alike). */
export interface StressWarningFacts {
  damage: number;
  gate: number;
  removed: number;
  largest: number;
  /** Cycles (sum of counts) with infinite life on the curve, and all counted cycles. */
  infiniteCycles: number;
  cycles: number;
  /** Cycles with a life below CURVE_LOW_CYCLE_LIMIT, and their damage. */
  lowCycles: number;
  lowCycleDamage: number;
}

/** Sums of a report's columns for {@link stressWarnings}. */
export function stressTallies(l: LifeLoopColumns): Pick<StressWarningFacts, 'infiniteCycles' | 'cycles' | 'lowCycles' | 'lowCycleDamage'> {
  let infiniteCycles = 0;
  let cycles = 0;
  let lowCycles = 0;
  let lowCycleDamage = 0;
  for (let i = 0; i < l.count.length; i++) {
    cycles += l.count[i];
    if (l.cyclesToFailure[i] === Infinity) infiniteCycles += l.count[i];
    else if (l.cyclesToFailure[i] < CURVE_LOW_CYCLE_LIMIT) {
      lowCycles += l.count[i];
      lowCycleDamage += l.damage[i];
    }
  }
  return { infiniteCycles, cycles, lowCycles, lowCycleDamage };
}

/**
 * An upper bound of the damage the gate removed on the stress route: a removed reversal pair is
 * at most a cycle of the gate's range, whose peak lies within the gate of the largest |value|
 * (so its mean at most largest + gate/2), and the corrections here grow with the mean (Goodman,
 * Gerber, Morrow, SWT, Walker; none and the IIW factor, taken at f(R) = 1, do not lower it); the
 * bound is that cycle's damage times (removed + 1) / 2, as on the strain-life route.
 */
function stressGateBound(job: ResolvedJob, f: StressWarningFacts): number {
  if (f.removed === 0) return 0;
  const s = job.stressLife as ResolvedStressLife;
  const scale = stressScale(job);
  const range = Float64Array.of(f.gate * scale);
  const mean = Float64Array.of((f.largest + f.gate / 2) * scale);
  const correction = s.meanStress.method === 'iiw' ? ({ method: 'none' } as const) : s.meanStress;
  let nf: number;
  try {
    nf = cycleLivesInto(s.curve, range, mean, new Float64Array(1), { meanStress: correction })[0];
  } catch {
    return Infinity; // a mean at or beyond the strength the correction divides by
  }
  const limit = job.cutoffCycles ?? Infinity;
  return nf > limit || nf === Infinity ? 0 : (f.removed + 1) / 2 / nf;
}

/** The warnings of a stress-route report. */
export function stressWarnings(job: ResolvedJob, f: StressWarningFacts, cutoff: LifeWarning | null): LifeWarning[] {
  const out: LifeWarning[] = [];
  const pct = (x: number) => (100 * x).toPrecision(3);
  if (f.removed > 0) {
    const bound = stressGateBound(job, f);
    out.push({
      code: 'gate-removed-damage',
      message: `the gate of ${f.gate} removed ${f.removed} reversals per repeat; they could have done at most ${bound.toPrecision(3)} damage per repeat (${f.damage > 0 ? pct(bound / f.damage) : '∞'} % of the counted damage)`,
      details: { gate: f.gate, removedReversals: f.removed, damageBound: bound },
    });
  }
  if (cutoff !== null) out.push(cutoff);
  if (f.infiniteCycles > 0) {
    out.push({
      code: 'below-curve-limit',
      message: `${f.infiniteCycles} of ${f.cycles} cycles per repeat (${pct(f.infiniteCycles / f.cycles)} %) lie below the curve's cut-off or fatigue limit and do no damage; under variable amplitude the standards lower the limit (Haibach's slope 2m − 1) or drop it (elementary Miner): check that the curve chosen is the one for variable amplitude`,
      details: { cycles: f.infiniteCycles, allCycles: f.cycles },
    });
  }
  if (f.lowCycles > 0) {
    out.push({
      code: 'beyond-curve-range',
      message: `${f.lowCycles} cycles per repeat live fewer than ${CURVE_LOW_CYCLE_LIMIT} cycles (${f.damage > 0 ? pct(f.lowCycleDamage / f.damage) : '0'} % of the damage): the S-N curve is extrapolated into low-cycle fatigue, where the local strain-life route applies and static strength should be checked`,
      details: { cycles: f.lowCycles, damage: f.lowCycleDamage, limitCycles: CURVE_LOW_CYCLE_LIMIT },
    });
  }
  return out;
}
