import { damageByEvent, damageInto, damageTimeline, lifeFromDamage, mostDamagingLoops } from '@loopwise/miner';
import { branchResponse, NotchSampleError, type NotchTrackerOptions, type ReversalTable } from '@loopwise/notch';
import { NonFiniteSampleError, turningPoints } from '@loopwise/rainflow';
import { ASSUMPTIONS, CAUTION } from './assumptions';
import { EngineError } from './EngineError';
import { evaluateLoops, type LoopLives } from './evaluateLoops';
import { resolveLifeJob, type LifeJob, type ResolvedJob } from './LifeJob';
import type { EventDamage, LifeLoopColumns, LifeReport, LifeWarning, WorstLoop } from './LifeReport';
import { trackSchedule, type LoopSegment, type ScheduleEvent, type TrackedLoops } from './trackSchedule';

/** One event of a duty cycle: a history block and how many times it runs in a row. */
export interface DutyEvent {
  /** Name of the event, for the report (e.g. `'cobbles'`, `'braking'`). */
  name: string;
  /** One repeat of the event's history, in the job's input unit. */
  history: ArrayLike<number>;
  /** Consecutive repeats of the event in one run of the schedule; an integer >= 1. */
  repeats: number;
  /** Service one repeat of the event stands for, in `job.unit.label` (hours, km, …); >= 0. */
  duration?: number;
}

const PARAMETER_UNITS: Record<string, string> = {
  none: 'strain amplitude',
  morrow: 'strain amplitude',
  modifiedMorrow: 'strain amplitude',
  smithWatsonTopper: 'stress × strain amplitude (σmax·εa)',
  walker: 'stress (σmax^(1−γ)·(E·εa)^γ)',
};

/**
 * Assesses the fatigue life of a notched part under a duty cycle: an ordered list of events,
 * each run `repeats` times in a row, the whole schedule repeating. Loops that span events or
 * repeats are counted as if the schedule were one long history, without materialising the
 * repeats (cost grows with the events' lengths, not their repeat counts).
 *
 * Pipeline: turning points (with the gate) → memory-aware notch tracker (first pass and
 * stabilised pass) → damage parameter per closed loop → cycles to failure → Palmgren-Miner sum
 * with the cut-off → life in repeats of the schedule and in service units, with the attribution
 * of damage to events, to sample-index bins and to the worst loops, and the warnings.
 *
 * @example
 * const report = assessDutyCycle(
 *   [
 *     { name: 'rough track', history: rough, repeats: 20, duration: 0.05 },
 *     { name: 'yard', history: yard, repeats: 3, duration: 0.1 },
 *   ],
 *   { material, notch: { Kt: 2.1 }, unit: { label: 'h' } },
 * );
 * report.life.life; // hours to the predicted crack initiation (mean estimate)
 */
export function assessDutyCycle(events: DutyEvent[], job: LifeJob): LifeReport {
  const resolved = resolveLifeJob(job);
  return assessResolved(checkEvents(events), resolved);
}

/** Checks the events of a duty cycle (internal). */
export function checkEvents(events: DutyEvent[]): DutyEvent[] {
  if (!Array.isArray(events) || events.length === 0) {
    throw new EngineError('invalid-event', 'events', events, 'a duty cycle needs at least one event');
  }
  events.forEach((e, k) => {
    const at = `events[${k}]`;
    if (e === null || typeof e !== 'object') throw new EngineError('invalid-event', at, e, 'must be { name, history, repeats }');
    if (typeof e.name !== 'string' || e.name === '') throw new EngineError('invalid-event', `${at}.name`, e.name, 'must be a non-empty string');
    if (e.history === null || typeof e.history !== 'object' || typeof e.history.length !== 'number') {
      throw new EngineError('invalid-event', `${at}.history`, e.history, 'must be an array of numbers');
    }
    if (e.history.length === 0) throw new EngineError('invalid-event', `${at}.history`, '[]', `event '${e.name}' has no samples`);
    if (!Number.isInteger(e.repeats) || e.repeats < 1) {
      throw new EngineError('invalid-event', `${at}.repeats`, e.repeats, `must be an integer >= 1 (event '${e.name}')`);
    }
    if (e.duration !== undefined && !(typeof e.duration === 'number' && e.duration >= 0 && e.duration < Infinity)) {
      throw new EngineError('invalid-event', `${at}.duration`, e.duration, `must be a finite number >= 0 (event '${e.name}')`);
    }
  });
  return events;
}

/** The absolute gate of a job over the whole schedule. */
function gateOf(job: ResolvedJob, events: DutyEvent[]): number {
  if (job.gate !== undefined) return job.gate;
  if (job.gateFraction === undefined) return 0;
  if (job.fullScale !== undefined) return job.gateFraction * job.fullScale;
  let lo = Infinity;
  let hi = -Infinity;
  events.forEach((e, k) => {
    for (let i = 0; i < e.history.length; i++) {
      const x = e.history[i];
      if (x - x !== 0) throw new EngineError('invalid-history', `events[${k}].history`, x, `sample ${i} of event '${e.name}' is ${x}`, i);
      if (x < lo) lo = x;
      if (x > hi) hi = x;
    }
  });
  return job.gateFraction * (hi - lo);
}

/** Tracker options of a job (internal). */
export function trackerOptionsOf(job: ResolvedJob): NotchTrackerOptions {
  const o: NotchTrackerOptions = {
    material: job.material,
    input: job.input,
    rule: job.rule,
    loadToStress: job.loadToStress,
    initial: job.initial,
    offset: job.offset,
    tolerance: job.tolerance,
  };
  if (job.Kt !== undefined) o.Kt = job.Kt;
  if (job.Kf !== undefined) o.Kf = job.Kf;
  return o;
}

/**
 * Maps tracker indices `src[from..to)` to schedule sample indices in `out` from `at` on, and their
 * events in `events` (-1 and -1 for the initial state).
 */
export type IndexMap = (src: Float64Array, from: number, to: number, out: Float64Array, at: number, events: Float64Array) => void;

/** What the tracking stage leaves for the damage stage (internal). */
export interface TrackedSchedule {
  events: DutyEvent[];
  /** Index of each event's first sample in the schedule's sample space. */
  eventStarts: number[];
  gate: number;
  removed: number;
  totalSamples: number;
  /** Largest |value| (offset applied) of the points the tracker kept and the initial value; 0 when the gate removed nothing. */
  largestKept: number;
  track: TrackedLoops;
  toSample: IndexMap;
}

/** Turning points, gate and the notch tracker over a checked schedule (internal). */
export function trackResolved(events: DutyEvent[], job: ResolvedJob): TrackedSchedule {
  const gate = gateOf(job, events);
  const schedule: ScheduleEvent[] = [];
  let sampleBase = 0;
  let ordinalBase = 0;
  let removed = 0;
  events.forEach((e, k) => {
    if (gate === 0) {
      // without a gate the tracker reads the raw samples: it finds the reversals itself (plateaus
      // collapse to their first sample), which costs less than a separate turning-point pass
      schedule.push({ values: e.history, indices: null, repeats: e.repeats, sampleBase, ordinalBase: sampleBase });
      sampleBase += e.history.length;
      return;
    }
    let tp;
    try {
      // each event is gated on its own: keep the extremes before its first reversal, so its first
      // excursion stays exact whatever event (or initial value) came before
      tp = turningPoints(e.history, { gate, keepLeadingExtremes: true });
    } catch (err) {
      if (err instanceof NonFiniteSampleError) {
        throw new EngineError('invalid-history', `events[${k}].history`, err.value, `sample ${err.index} of event '${e.name}' is ${err.value}`, err.index);
      }
      throw err;
    }
    removed += tp.removed * e.repeats;
    schedule.push({ values: tp.values, indices: tp.indices, repeats: e.repeats, sampleBase, ordinalBase });
    sampleBase += e.history.length;
    ordinalBase += tp.values.length;
  });
  let track;
  try {
    track = trackSchedule(schedule, trackerOptionsOf(job), job.repeating);
  } catch (err) {
    if (err instanceof NotchSampleError) {
      // raw samples carry schedule indices: name the event and its own sample index
      let k = 0;
      while (k + 1 < schedule.length && schedule[k + 1].sampleBase <= err.index) k++;
      const i = err.index - schedule[k].sampleBase;
      throw new EngineError('invalid-history', `events[${k}].history`, err.value, `sample ${i} of event '${events[k].name}' is ${err.value}`, i);
    }
    throw err;
  }
  return {
    events,
    eventStarts: schedule.map((s) => s.sampleBase),
    gate,
    removed,
    totalSamples: sampleBase,
    largestKept: removed > 0 ? largestKept(job, schedule) : 0,
    track,
    toSample: ordinalMap(schedule),
  };
}

/** The assessment of checked events with a resolved job (internal; shared by every entry point). */
export function assessResolved(events: DutyEvent[], job: ResolvedJob): LifeReport {
  return reportFrom(trackResolved(events, job), job);
}

/** The damage stage and the report, for one damage parameter (internal). */
export function reportFrom(tracked: TrackedSchedule, job: ResolvedJob): LifeReport {
  const { events, eventStarts, gate, removed, totalSamples, largestKept, track, toSample } = tracked;
  // every loop the tracker closed, in either pass, is solved once
  const all = track.loops.columns();
  const lives = evaluateLoops(all, job.material, job.meanStress, job.walkerGamma);
  const stabilised = gather(all, lives, track.stabilised, toSample);
  if (!job.repeating) appendResidueHalves(stabilised, track.firstResidue, job, toSample);
  const cutoff = job.cutoffCycles === undefined ? {} : { cutoff: { cycles: job.cutoffCycles } };
  damageInto(stabilised.count, stabilised.cyclesToFailure, stabilised.damage, cutoff);
  const damage = compensatedSum(stabilised.damage);
  const firstDamage = job.repeating ? segmentDamage(all.count, lives.cyclesToFailure, track.first, job.cutoffCycles ?? Infinity) : damage;
  const attribution = {
    damage: stabilised.damage,
    startIndex: clampIndex(stabilised.startIndex),
    endIndex: clampIndex(stabilised.turnIndex),
  };

  const binSize = Math.max(1, Math.ceil(totalSamples / job.timelineBins));
  const timeline = damageTimeline(attribution, { binSize, sampleCount: totalSamples });
  const byEvent = damageByEvent(attribution, { starts: eventStarts });
  const eventDamage: EventDamage[] = events.map((e, k) => ({
    name: e.name,
    repeats: e.repeats,
    samples: e.history.length,
    damage: byEvent[k],
    share: damage > 0 ? byEvent[k] / damage : 0,
  }));
  const worstRows = mostDamagingLoops({ damage: stabilised.damage }, Math.min(job.worstLoopCount, stabilised.count.length));
  const worstLoops: WorstLoop[] = Array.from(worstRows, (row) => ({
    row,
    damage: stabilised.damage[row],
    share: damage > 0 ? stabilised.damage[row] / damage : 0,
    count: stabilised.count[row],
    stressMax: stabilised.stressMax[row],
    stressMin: stabilised.stressMin[row],
    strainMax: stabilised.strainMax[row],
    strainMin: stabilised.strainMin[row],
    cyclesToFailure: stabilised.cyclesToFailure[row],
    startIndex: stabilised.startIndex[row],
    turnIndex: stabilised.turnIndex[row],
    startEvent: stabilised.startEvent[row] >= 0 ? events[stabilised.startEvent[row]].name : null,
    turnEvent: stabilised.turnEvent[row] >= 0 ? events[stabilised.turnEvent[row]].name : null,
  }));

  let firstReversal = 0;
  for (let i = 0; i < stabilised.count.length; i++) if (stabilised.reversalsToFailure[i] <= 1) firstReversal++;
  const warnings = warningsOf(job, {
    damage,
    gate,
    removed,
    gateBound: removed > 0 ? gateBoundAt(job, largestKept, gate, removed) : 0,
    cutoff: job.cutoffCycles === undefined ? null : cutoffReport(stabilised, job.cutoffCycles, damage),
    beyondStrainLimit: track.beyondStrainLimit,
    firstBeyondIndex: track.firstBeyondIndex,
    firstReversal,
  });
  return {
    ...reportFrame(job, events, gate, { perRepeat: damage, firstPass: firstDamage, reusedFirstPass: track.reusedFirstPass }),
    loops: stabilised,
    worstLoops,
    timeline: { binSize, samples: totalSamples, damage: timeline },
    events: eventDamage,
    gate: { range: gate, removedReversals: removed },
    warnings,
  };
}

/**
 * The head of a report, which does not depend on the loops (internal; shared with the
 * streaming session): format, echoed inputs, assumptions, caution, damage and life.
 */
export function reportFrame(
  job: ResolvedJob,
  events: DutyEvent[],
  gate: number,
  damage: { perRepeat: number; firstPass: number; reusedFirstPass: boolean },
): Pick<LifeReport, 'format' | 'version' | 'inputs' | 'assumptions' | 'caution' | 'damage' | 'life'> {
  const perRepeat = serviceOf(job, events);
  return {
    format: 'loopwise-life-report',
    version: 1,
    inputs: echoInputs(job, events, gate),
    assumptions: [...ASSUMPTIONS],
    caution: CAUTION,
    damage: { correction: job.meanStress, parameterUnit: PARAMETER_UNITS[job.meanStress], ...damage },
    life: lifeFromDamage(damage.perRepeat, {
      criticalDamage: job.criticalDamage,
      scatterFactor: job.scatterFactor,
      ...(perRepeat === undefined ? {} : { unit: { label: job.unit!.label, perRepeat } }),
    }),
  };
}

/** Maps a tracker index (turning-point ordinal) to the schedule sample index and the event. */
function ordinalMap(schedule: ScheduleEvent[]): IndexMap {
  const bases = schedule.map((s) => s.ordinalBase);
  if (schedule.length === 1) {
    const idx = schedule[0].indices;
    return (src, from, to, out, at, ev) => {
      for (let i = from, j = at; i < to; i++, j++) {
        const o = src[i];
        out[j] = o < 0 ? -1 : idx === null ? o : idx[o];
        ev[j] = o < 0 ? -1 : 0;
      }
    };
  }
  return (src, from, to, out, at, ev) => {
    for (let i = from, j = at; i < to; i++, j++) {
      const o = src[i];
      if (o < 0) {
        out[j] = -1;
        ev[j] = -1;
        continue;
      }
      let lo = 0;
      let hi = bases.length - 1;
      while (lo < hi) {
        const mid = (lo + hi + 1) >>> 1;
        if (bases[mid] <= o) lo = mid;
        else hi = mid - 1;
      }
      const s = schedule[lo];
      out[j] = s.indices === null ? o : s.sampleBase + s.indices[o - s.ordinalBase];
      ev[j] = lo;
    }
  };
}

/** The rows of the given segments as report columns, counts weighted. */
function gather(
  all: ReturnType<TrackedLoops['loops']['columns']>,
  lives: LoopLives,
  segments: LoopSegment[],
  toSample: IndexMap,
): LifeLoopColumns {
  let n = 0;
  for (const s of segments) n += s.to - s.from;
  // One run of rows counted once (a single repeating history): the local and life columns are
  // views of the tracker's table and of the lives, not copies (tens of MB for 10^6 loops).
  let contiguous = segments.length > 0;
  for (let k = 0; k < segments.length; k++) {
    if (segments[k].weight !== 1 || (k > 0 && segments[k].from !== segments[k - 1].to)) contiguous = false;
  }
  if (contiguous) {
    const from = segments[0].from;
    const to = segments[segments.length - 1].to;
    const c = emptyColumns(n, {
      stressMax: all.stressMax.subarray(from, to),
      stressMin: all.stressMin.subarray(from, to),
      strainMax: all.strainMax.subarray(from, to),
      strainMin: all.strainMin.subarray(from, to),
      parameter: lives.parameter.subarray(from, to),
      reversalsToFailure: lives.reversalsToFailure.subarray(from, to),
      cyclesToFailure: lives.cyclesToFailure.subarray(from, to),
      count: all.count.subarray(from, to),
    });
    toSample(all.startIndex, from, to, c.startIndex, 0, c.startEvent);
    toSample(all.turnIndex, from, to, c.turnIndex, 0, c.turnEvent);
    toSample(all.closeIndex, from, to, c.closeIndex, 0, new Float64Array(n));
    return c;
  }
  const c = emptyColumns(n);
  let j = 0;
  const scratch = new Float64Array(n);
  for (const s of segments) {
    c.stressMax.set(all.stressMax.subarray(s.from, s.to), j);
    c.stressMin.set(all.stressMin.subarray(s.from, s.to), j);
    c.strainMax.set(all.strainMax.subarray(s.from, s.to), j);
    c.strainMin.set(all.strainMin.subarray(s.from, s.to), j);
    c.parameter.set(lives.parameter.subarray(s.from, s.to), j);
    c.reversalsToFailure.set(lives.reversalsToFailure.subarray(s.from, s.to), j);
    c.cyclesToFailure.set(lives.cyclesToFailure.subarray(s.from, s.to), j);
    toSample(all.startIndex, s.from, s.to, c.startIndex, j, c.startEvent);
    toSample(all.turnIndex, s.from, s.to, c.turnIndex, j, c.turnEvent);
    toSample(all.closeIndex, s.from, s.to, c.closeIndex, j, scratch);
    for (let i = s.from; i < s.to; i++, j++) c.count[j] = all.count[i] * s.weight;
  }
  return c;
}

/** Report columns of n rows: the given views, and new zeroed columns for the rest (internal). */
export function emptyColumns(n: number, views: Partial<LifeLoopColumns> = {}): LifeLoopColumns {
  const f = (k: keyof LifeLoopColumns) => views[k] ?? new Float64Array(n);
  return {
    stressMax: f('stressMax'),
    stressMin: f('stressMin'),
    strainMax: f('strainMax'),
    strainMin: f('strainMin'),
    parameter: f('parameter'),
    reversalsToFailure: f('reversalsToFailure'),
    cyclesToFailure: f('cyclesToFailure'),
    count: f('count'),
    damage: f('damage'),
    startIndex: f('startIndex'),
    turnIndex: f('turnIndex'),
    closeIndex: f('closeIndex'),
    startEvent: f('startEvent'),
    turnEvent: f('turnEvent'),
  };
}

/** Appends the residue of a one-off history as half cycles (ASTM E1049-85 5.4.4 step 6 at the notch). */
function appendResidueHalves(c: LifeLoopColumns, residue: ReversalTable, job: ResolvedJob, toSample: IndexMap): void {
  const r = residue.columns();
  const m = Math.max(0, r.index.length - 1);
  if (m === 0) return;
  const h = emptyColumns(m);
  for (let i = 0; i < m; i++) {
    h.stressMax[i] = Math.max(r.stress[i], r.stress[i + 1]);
    h.stressMin[i] = Math.min(r.stress[i], r.stress[i + 1]);
    h.strainMax[i] = Math.max(r.strain[i], r.strain[i + 1]);
    h.strainMin[i] = Math.min(r.strain[i], r.strain[i + 1]);
    h.count[i] = 0.5;
  }
  toSample(r.index, 0, m, h.startIndex, 0, h.startEvent);
  toSample(r.index, 1, m + 1, h.turnIndex, 0, h.turnEvent);
  h.closeIndex.set(h.turnIndex);
  const lives = evaluateLoops(h, job.material, job.meanStress, job.walkerGamma);
  h.parameter.set(lives.parameter);
  h.reversalsToFailure.set(lives.reversalsToFailure);
  h.cyclesToFailure.set(lives.cyclesToFailure);
  for (const k of Object.keys(c) as (keyof LifeLoopColumns)[]) {
    const joined = new Float64Array(c[k].length + m);
    joined.set(c[k]);
    joined.set(h[k], c[k].length);
    c[k] = joined;
  }
}

/** Σ x with Neumaier's compensation, so 10^6 small damages add up without loss. */
function compensatedSum(x: Float64Array): number {
  let s = 0;
  let c = 0;
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    const t = s + v;
    c += Math.abs(s) >= Math.abs(v) ? s - t + v : v - t + s;
    s = t;
  }
  return s + c;
}

/** Damage of tracker rows in weighted segments: Σ weight · count / Nf (0 beyond the cut-off). */
function segmentDamage(count: Float64Array, nf: Float64Array, segments: LoopSegment[], limit: number): number {
  const d = new Float64Array(segments.reduce((a, s) => a + (s.to - s.from), 0));
  let j = 0;
  for (const s of segments) for (let i = s.from; i < s.to; i++) d[j++] = nf[i] > limit ? 0 : (s.weight * count[i]) / nf[i];
  return compensatedSum(d);
}

/** What the cut-off removed, and the share of damage within a factor 2 below it. */
function cutoffReport(l: LifeLoopColumns, cutoffCycles: number, damage: number) {
  const nearFactor = 2;
  let removedCount = 0;
  let removedDamage = 0;
  let near = 0;
  for (let i = 0; i < l.count.length; i++) {
    const nf = l.cyclesToFailure[i];
    if (nf > cutoffCycles) {
      removedCount += l.count[i];
      if (nf < Infinity) removedDamage += l.count[i] / nf;
    } else if (nf * nearFactor > cutoffCycles) near += l.damage[i];
  }
  return { removedCount, removedDamage, nearFactor, nearCutoffShare: damage > 0 ? near / damage : 0 };
}

function clampIndex(a: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i] < 0 ? 0 : a[i];
  return out;
}


/** Service per repeat of the schedule: the job's `unit.perRepeat`, or the sum of the events' durations. */
export function serviceOf(job: ResolvedJob, events: DutyEvent[]): number | undefined {
  if (job.unit === undefined) return undefined;
  if (events.some((e) => e.duration !== undefined)) {
    if (job.unit.perRepeat !== undefined) {
      throw new EngineError('invalid-job', 'unit.perRepeat', job.unit.perRepeat, 'give unit.perRepeat or event durations, not both');
    }
    return events.reduce((s, e) => s + e.repeats * (e.duration ?? 0), 0) || undefined;
  }
  if (job.unit.perRepeat === undefined) {
    throw new EngineError('invalid-job', 'unit.perRepeat', undefined, `life in '${job.unit.label}' needs unit.perRepeat (or event durations)`);
  }
  return job.unit.perRepeat;
}

/** What the warnings are made from (internal; shared with the streaming session). */
export interface WarningFacts {
  damage: number;
  gate: number;
  removed: number;
  /** Upper bound of the damage the gate removed. */
  gateBound: number;
  cutoff: { removedCount: number; removedDamage: number; nearFactor: number; nearCutoffShare: number } | null;
  beyondStrainLimit: boolean;
  firstBeyondIndex: number;
  firstReversal: number;
}

/** The warnings of a report (internal). */
export function warningsOf(job: ResolvedJob, f: WarningFacts): LifeWarning[] {
  const out: LifeWarning[] = [];
  const { damage, gate, removed } = f;
  if (removed > 0) {
    const bound = f.gateBound;
    out.push({
      code: 'gate-removed-damage',
      message: `the gate of ${gate} removed ${removed} reversals per repeat; they could have done at most ${bound.toPrecision(3)} damage per repeat (${damage > 0 ? ((100 * bound) / damage).toPrecision(3) : '∞'} % of the counted damage)`,
      details: { gate, removedReversals: removed, damageBound: bound },
    });
  }
  if (job.cutoffCycles !== undefined && f.cutoff !== null) {
    const r = f.cutoff;
    if (r.removedCount > 0 || r.nearCutoffShare > 0.1) {
      out.push({
        code: 'cutoff-share',
        message: `the cut-off at ${job.cutoffCycles} cycles removed ${r.removedCount} loops (${r.removedDamage.toPrecision(3)} damage without the cut-off); loops within a factor ${r.nearFactor} of it carry ${(100 * r.nearCutoffShare).toPrecision(3)} % of the damage, so the result depends on the cut-off`,
        details: { cutoffCycles: job.cutoffCycles, removedLoops: r.removedCount, removedDamage: r.removedDamage, nearCutoffShare: r.nearCutoffShare },
      });
    }
  }
  if (f.beyondStrainLimit) {
    out.push({
      code: 'beyond-material-model',
      message: `local strain amplitude exceeds the strain-life curve at one reversal (from turning point ${f.firstBeyondIndex}); the material model is extrapolating and the load is near or beyond static failure`,
      details: { firstBeyondPoint: f.firstBeyondIndex },
    });
  }
  if (f.firstReversal > 0) {
    out.push({
      code: 'first-reversal-failure',
      message: `${f.firstReversal} loop(s) fail on the first reversal (beyond the strain-life curve or a mean stress at or above σf'); the life is not meaningful`,
      details: { loops: f.firstReversal },
    });
  }
  for (const w of job.material.warnings) {
    out.push({ code: 'incompatible-material', message: w.message, details: { field: w.field } });
  }
  return out;
}

/**
 * Largest |value| (offset applied) of the kept points and the initial value, for the gate bound.
 *
 * The gate bound ({@link gateBoundAt}), an upper bound of the damage the gate removed: every
 * removed reversal pair is at most a loop of the gate's range. The gate keeps every move of at least its range, so a removed point lies
 * within the gate of a kept point (or of the initial value): its magnitude is at most the
 * largest kept magnitude plus the gate, and its local stress at most the first-loading stress
 * there (the cyclic-curve envelope bounds every local stress of the path). The worst place for
 * a removed loop is hanging from that envelope point on a Masing branch (highest σmax and mean
 * stress). The bound is that loop's damage times (removed + 1) / 2: half the removed
 * reversals, plus one more cycle for the ends of the history (a removed last reversal, or the
 * seam of a repeating block).
 */
function largestKept(job: ResolvedJob, schedule: ScheduleEvent[]): number {
  let largest = Math.abs(job.initial);
  for (const e of schedule) {
    const v = e.values;
    for (let i = 0; i < v.length; i++) {
      const a = Math.abs(v[i] + job.offset);
      if (a > largest) largest = a;
    }
  }
  return largest;
}

/**
 * The gate bound (internal): a loop of the gate's range hanging from the first-loading point at
 * `largest` + gate, where `largest` is the largest |value| (offset applied) of the kept points
 * and the initial value.
 */
export function gateBoundAt(job: ResolvedJob, largest: number, gate: number, removed: number): number {
  if (removed === 0) return 0;
  const options = trackerOptionsOf(job);
  const top = largest + gate;
  const peak = branchResponse(options, null, top);
  // only the history difference from the origin enters a branch
  const low = branchResponse(options, { value: top, stress: peak.stress, strain: peak.strain }, top - gate);
  const loop = {
    stressMax: Float64Array.of(peak.stress),
    stressMin: Float64Array.of(low.stress),
    strainMax: Float64Array.of(peak.strain),
    strainMin: Float64Array.of(low.strain),
  };
  const lives = evaluateLoops(loop, job.material, job.meanStress, job.walkerGamma);
  const nf = lives.cyclesToFailure[0];
  const limit = job.cutoffCycles ?? Infinity;
  const perLoop = nf > limit || nf === Infinity ? 0 : 1 / nf;
  return ((removed + 1) / 2) * perLoop;
}

function echoInputs(job: ResolvedJob, events: DutyEvent[], gate: number): Record<string, unknown> {
  const m = job.material;
  return {
    material: { name: m.name, E: m.E, sigmaF: m.sigmaF, b: m.b, epsilonF: m.epsilonF, c: m.c, K: m.K, n: m.n, Su: m.Su, source: m.source },
    input: job.input,
    notch: job.input === 'nominal' ? { Kt: job.Kt, Kf: job.Kf, rule: job.rule } : { rule: job.input === 'local-strain' ? null : job.rule },
    loadToStress: job.loadToStress,
    meanStress: job.meanStress,
    walkerGamma: job.walkerGamma,
    gate,
    repeating: job.repeating,
    cutoffCycles: job.cutoffCycles ?? null,
    criticalDamage: job.criticalDamage,
    scatterFactor: job.scatterFactor,
    unit: job.unit ?? null,
    initial: job.initial,
    offset: job.offset,
    events: events.map((e) => ({ name: e.name, samples: e.history.length, repeats: e.repeats, duration: e.duration ?? null })),
  };
}
