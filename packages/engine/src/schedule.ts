import { EngineError } from './EngineError';
import type { JobServiceUnit, ResolvedJob } from './LifeJob';

/** One event of a duty cycle: a history block and how many times it runs in a row. */
export interface DutyEvent {
  /** Name of the event, for the report (e.g. `'cobbles'`, `'braking'`). */
  name: string;
  /** One repeat of the event's history, in the job's input unit. */
  history: ArrayLike<number>;
  /**
   * Consecutive repeats of the event in one run of the schedule: a finite number >= 1. A
   * fraction (2.5) adds that share of one more repeat's loops, so the damage lies on the line
   * between the whole numbers around it (docs/engine.md, "Fractional repeats"). An event rarer
   * than once per schedule: lengthen the schedule (every repeats and the service times k).
   */
  repeats: number;
  /** Service one repeat of the event stands for, in `job.unit.label` (hours, km, …); >= 0. */
  duration?: number;
}

/**
 * Checks the events of a duty cycle: at least one, each with a name, a non-empty history,
 * repeats a finite number >= 1 and an optional finite duration >= 0. Errors name `events[k].field`.
 */
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
    if (!(typeof e.repeats === 'number' && e.repeats >= 1 && e.repeats < 2 ** 53)) {
      throw new EngineError('invalid-event', `${at}.repeats`, e.repeats, `must be a finite number >= 1, a fraction allowed (event '${e.name}'; an event rarer than once per schedule: multiply every event's repeats instead)`);
    }
    if (e.duration !== undefined && !(typeof e.duration === 'number' && e.duration >= 0 && e.duration < Infinity)) {
      throw new EngineError('invalid-event', `${at}.duration`, e.duration, `must be a finite number >= 0 (event '${e.name}')`);
    }
  });
  return events;
}

/** Index of each event's first sample in the schedule's sample space (events laid end to end once). */
export function eventStartsOf(events: readonly { history: ArrayLike<number> }[]): number[] {
  const starts: number[] = [];
  let at = 0;
  for (const e of events) {
    starts.push(at);
    at += e.history.length;
  }
  return starts;
}

/** The event a schedule sample index falls in (binary search over the starts); -1 for -1 (the initial state). */
export function eventOfSample(starts: readonly number[], index: number): number {
  if (index < 0) return -1;
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >>> 1;
    if (starts[mid] <= index) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** The non-finite sample error of an event, naming the event and its own sample index. */
export function sampleError(events: readonly DutyEvent[], k: number, index: number, value: number, offset = 0): EngineError {
  return new EngineError('non-finite-sample', `events[${k}].history`, value, `sample ${index} of event '${events[k].name}' ${sampleText(value, offset)}`, index);
}

/** What is wrong with a sample: it is not finite, or (a finite value) it overflows with the job's offset added. */
export function sampleText(value: number, offset: number): string {
  return Number.isFinite(value) ? `is ${value}, which with the offset ${offset} added is beyond the largest number` : `is ${value}`;
}

/** The absolute gate of a job over the whole schedule (a fraction of the largest range needs a scan, or a declared full scale). */
export function scheduleGate(job: ResolvedJob, events: DutyEvent[]): number {
  if (job.gate !== undefined) return job.gate;
  if (job.gateFraction === undefined) return 0;
  if (job.fullScale !== undefined) return job.gateFraction * job.fullScale;
  let lo = Infinity;
  let hi = -Infinity;
  events.forEach((e, k) => {
    for (let i = 0; i < e.history.length; i++) {
      const x = e.history[i];
      if (x - x !== 0) throw sampleError(events, k, i, x);
      if (x < lo) lo = x;
      if (x > hi) hi = x;
    }
  });
  return job.gateFraction * (hi - lo);
}

/**
 * Service per repeat of the schedule: the job's `unit.perRepeat`, or the sum of the events'
 * repeats × durations (a fraction of a repeat counts its share); undefined without a unit.
 * Both given, or neither with a unit, throws EngineError naming `unit.perRepeat`.
 */
export function servicePerRepeat(job: { unit?: JobServiceUnit | undefined }, events: readonly Pick<DutyEvent, 'repeats' | 'duration'>[]): number | undefined {
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
