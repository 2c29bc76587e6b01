import { neumaierSum } from '@loopwise/base';
import { damageByEvent, damageInto, damageTimeline, lifeFromDamage, mostDamagingLoops } from '@loopwise/miner';
import { ASSUMPTIONS, CAUTION, STRESS_LIFE_ASSUMPTIONS } from './assumptions';
import { evaluateLoops } from './evaluateLoops';
import { strainLifeMaterial, type ResolvedJob } from './LifeJob';
import type { CorrectionName, EventDamage, LifeLoopColumns, LifeReport, LifeWarning, WorstLoop } from './LifeReport';
import { loopColumnsOf, withResidueHalves } from './reportColumns';
import { servicePerRepeat, type DutyEvent } from './schedule';
import type { TrackedHistory } from './trackHistory';
import { stressLoopColumns, stressTallies, stressWarnings, type CountedSchedule } from './stressLifeRoute';
import { cutoffReport, cutoffWarning, gateBoundAt, warningsOf } from './warnings';

const PARAMETER_UNITS: Record<string, string> = {
  none: 'strain amplitude',
  morrow: 'strain amplitude',
  modifiedMorrow: 'strain amplitude',
  smithWatsonTopper: 'stress × strain amplitude (σmax·εa)',
  walker: 'stress (σmax^(1−γ)·(E·εa)^γ)',
};

/** The mean-stress correction's name in the report: the damage parameter, or the stress route's amplitude correction. */
export function correctionName(job: ResolvedJob): CorrectionName {
  return job.stressLife === undefined ? job.meanStress : job.stressLife.meanStress.method;
}

function parameterUnit(job: ResolvedJob): string {
  if (job.stressLife === undefined) return PARAMETER_UNITS[job.meanStress];
  return `equivalent fully reversed stress ${job.stressLife.curve.measure} (${job.stressLife.meanStress.method}), entered on the S-N curve`;
}

/** The events as the report echoes and attributes them (batch events, or the one streamed history). */
export type ReportEvent = Pick<DutyEvent, 'name' | 'repeats' | 'duration'> & { samples: number };

/**
 * The head of a report, which does not depend on the loops (batch and streaming alike): format,
 * echoed inputs, assumptions, caution, damage and life.
 */
export function reportHead(
  job: ResolvedJob,
  events: readonly ReportEvent[],
  gate: number,
  damage: { perRepeat: number; firstPass: number; reusedFirstPass: boolean },
): Pick<LifeReport, 'format' | 'version' | 'inputs' | 'assumptions' | 'caution' | 'damage' | 'life'> {
  const perRepeat = servicePerRepeat(job, events);
  return {
    format: 'loopwise-life-report',
    version: 1,
    inputs: echoInputs(job, events, gate),
    assumptions: [...(job.route === 'stress-life' ? STRESS_LIFE_ASSUMPTIONS : ASSUMPTIONS)],
    caution: CAUTION,
    damage: { route: job.route, meanStress: correctionName(job), parameterUnit: parameterUnit(job), ...damage },
    life: lifeFromDamage(damage.perRepeat, {
      criticalDamage: job.criticalDamage,
      scatterFactor: job.scatterFactor,
      ...(perRepeat === undefined ? {} : { unit: { label: job.unit!.label, perRepeat } }),
    }),
  };
}

/** Report events of a checked schedule. */
export function reportEvents(events: readonly DutyEvent[]): ReportEvent[] {
  return events.map((e) => ({ name: e.name, repeats: e.repeats, duration: e.duration, samples: e.history.length }));
}

/**
 * The damage stage and the report from a tracked history, for the job's damage parameter.
 * Every loop of both passes is evaluated once. With `own` the report's local and life columns
 * are views of the tracked table (the tracked history is handed over to this one report);
 * without, they are copies (a tracked history evaluated under several corrections).
 */
export function reportFromTracked(tracked: TrackedHistory, events: readonly ReportEvent[], job: ResolvedJob, own = true): LifeReport {
  const all = tracked.loops.columns();
  const lives = evaluateLoops(all, strainLifeMaterial(job), job.meanStress, job.walkerGamma);
  let loops = loopColumnsOf(all, lives, tracked.stabilised, tracked.eventStarts, own);
  if (!job.repeating) loops = withResidueHalves(loops, tracked.firstResidue, job, tracked.eventStarts);
  const cutoff = job.cutoffCycles === undefined ? {} : { cutoff: { cycles: job.cutoffCycles } };
  damageInto(loops.count, loops.cyclesToFailure, loops.damage, cutoff);
  const damage = neumaierSum(loops.damage);
  let firstDamage = damage;
  if (job.repeating) {
    const { from, to } = tracked.first;
    const d = new Float64Array(to - from);
    damageInto(all.count.subarray(from, to), lives.cyclesToFailure.subarray(from, to), d, cutoff);
    firstDamage = neumaierSum(d);
  }
  let firstReversal = 0;
  for (let i = 0; i < loops.count.length; i++) if (loops.reversalsToFailure[i] <= 1) firstReversal++;
  const { gate, removed, largestKept } = tracked;
  const warnings = warningsOf(job, {
    damage,
    gate,
    removed,
    gateBound: removed > 0 ? gateBoundAt(job, largestKept, gate, removed) : 0,
    cutoff: job.cutoffCycles === undefined ? null : cutoffReport(loops, job.cutoffCycles),
    beyondStrainLimit: tracked.beyondStrainLimit,
    firstBeyondIndex: tracked.firstBeyondIndex,
    firstReversal,
  });
  return assembleReport(job, events, tracked, loops, damage, firstDamage, warnings);
}

/**
 * The report of the stress-life route from a counted schedule: every cycle evaluated on the
 * curve (closed cycles, then the residue's: closed as the schedule repeats, or half cycles of a
 * one-off schedule); the first pass is the closed cycles and the residue's half cycles. With
 * `own` the caller hands `counted.cycles` over to this one report (no copies; see
 * {@link stressLoopColumns}); a schedule counted once for several reports keeps the default.
 */
export function stressReportFromCounted(counted: CountedSchedule, events: readonly ReportEvent[], job: ResolvedJob, own = false): LifeReport {
  const starts = counted.eventStarts;
  const loops = stressLoopColumns(counted.cycles, job, starts, own);
  const damage = neumaierSum(loops.damage);
  let firstDamage = damage;
  if (job.repeating) {
    const halves = stressLoopColumns(counted.residueHalves, job, starts);
    firstDamage = neumaierSum(loops.damage.subarray(0, counted.closedRows)) + neumaierSum(halves.damage);
  }
  const warnings = stressWarnings(
    job,
    { damage, gate: counted.gate, removed: counted.removed, largest: counted.largest, ...stressTallies(loops) },
    job.cutoffCycles === undefined ? null : cutoffWarning(job.cutoffCycles, cutoffReport(loops, job.cutoffCycles)),
  );
  return assembleReport(job, events, { ...counted, reusedFirstPass: false }, loops, damage, firstDamage, warnings);
}

/** Facts of the tracking or counting stage that the report repeats. */
type StageFacts = Pick<TrackedHistory, 'eventStarts' | 'gate' | 'removed' | 'totalSamples' | 'reusedFirstPass'>;

/**
 * A report from evaluated loop columns (either route): attribution to the timeline, events and
 * the worst loops, with the route's warnings.
 */
export function assembleReport(
  job: ResolvedJob,
  events: readonly ReportEvent[],
  facts: StageFacts,
  loops: LifeLoopColumns,
  damage: number,
  firstDamage: number,
  warnings: LifeWarning[],
): LifeReport {
  const { eventStarts, gate, removed, totalSamples } = facts;
  const attribution = { damage: loops.damage, startIndex: clampIndex(loops.startIndex), turnIndex: clampIndex(loops.turnIndex) };
  const binSize = Math.max(1, Math.ceil(totalSamples / job.timelineBins));
  const timeline = damageTimeline(attribution, { binSize, sampleCount: totalSamples });
  const byEvent = damageByEvent(attribution, { starts: eventStarts });
  const eventDamage: EventDamage[] = events.map((e, k) => ({
    name: e.name,
    repeats: e.repeats,
    samples: e.samples,
    damage: byEvent[k],
    share: damage > 0 ? byEvent[k] / damage : 0,
  }));
  const worstRows = mostDamagingLoops({ damage: loops.damage }, Math.min(job.worstLoopCount, loops.count.length));
  const worstLoops: WorstLoop[] = Array.from(worstRows, (row) => ({
    row,
    damage: loops.damage[row],
    share: damage > 0 ? loops.damage[row] / damage : 0,
    count: loops.count[row],
    stressMax: loops.stressMax[row],
    stressMin: loops.stressMin[row],
    strainMax: loops.strainMax.length > 0 ? loops.strainMax[row] : null,
    strainMin: loops.strainMin.length > 0 ? loops.strainMin[row] : null,
    cyclesToFailure: loops.cyclesToFailure[row],
    startIndex: loops.startIndex[row],
    turnIndex: loops.turnIndex[row],
    startEvent: loops.startEvent[row] >= 0 ? events[loops.startEvent[row]].name : null,
    turnEvent: loops.turnEvent[row] >= 0 ? events[loops.turnEvent[row]].name : null,
  }));
  return {
    ...reportHead(job, events, gate, { perRepeat: damage, firstPass: firstDamage, reusedFirstPass: facts.reusedFirstPass }),
    loops,
    worstLoops,
    timeline: { binSize, samples: totalSamples, damage: timeline },
    events: eventDamage,
    gate: { range: gate, removedReversals: removed },
    warnings,
  };
}

/** `a` with negative indices (the initial state's) as 0: `a` itself when it has none. */
function clampIndex(a: Float64Array): Float64Array {
  let k = 0;
  while (k < a.length && !(a[k] < 0)) k++;
  if (k === a.length) return a;
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i] < 0 ? 0 : a[i];
  return out;
}

function echoInputs(job: ResolvedJob, events: readonly ReportEvent[], gate: number): Record<string, unknown> {
  const m = job.material;
  return {
    route: job.route,
    stressLife: job.stressLife === undefined ? null : { ...job.stressLife, curve: { ...job.stressLife.curve } },
    material: m === undefined ? null : { name: m.name, E: m.E, sigmaF: m.sigmaF, b: m.b, epsilonF: m.epsilonF, c: m.c, K: m.K, n: m.n, Su: m.Su, source: m.source },
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
    events: events.map((e) => ({ name: e.name, samples: e.samples, repeats: e.repeats, duration: e.duration ?? null })),
  };
}
