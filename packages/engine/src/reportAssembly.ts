import { neumaierSum } from '@loopwise/base';
import { damageByEvent, damageInto, damageTimeline, lifeFromDamage, mostDamagingLoops } from '@loopwise/miner';
import { ASSUMPTIONS, CAUTION } from './assumptions';
import { evaluateLoops } from './evaluateLoops';
import type { ResolvedJob } from './LifeJob';
import type { EventDamage, LifeLoopColumns, LifeReport, WorstLoop } from './LifeReport';
import { loopColumnsOf, withResidueHalves } from './reportColumns';
import { servicePerRepeat, type DutyEvent } from './schedule';
import type { TrackedHistory } from './trackHistory';
import { cutoffReport, gateBoundAt, warningsOf } from './warnings';

const PARAMETER_UNITS: Record<string, string> = {
  none: 'strain amplitude',
  morrow: 'strain amplitude',
  modifiedMorrow: 'strain amplitude',
  smithWatsonTopper: 'stress × strain amplitude (σmax·εa)',
  walker: 'stress (σmax^(1−γ)·(E·εa)^γ)',
};

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
    assumptions: [...ASSUMPTIONS],
    caution: CAUTION,
    damage: { meanStress: job.meanStress, parameterUnit: PARAMETER_UNITS[job.meanStress], ...damage },
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
  const lives = evaluateLoops(all, job.material, job.meanStress, job.walkerGamma);
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
  return assemble(job, events, tracked, loops, damage, firstDamage);
}

function assemble(job: ResolvedJob, events: readonly ReportEvent[], tracked: TrackedHistory, loops: LifeLoopColumns, damage: number, firstDamage: number): LifeReport {
  const { eventStarts, gate, removed, totalSamples, largestKept } = tracked;
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
    strainMax: loops.strainMax[row],
    strainMin: loops.strainMin[row],
    cyclesToFailure: loops.cyclesToFailure[row],
    startIndex: loops.startIndex[row],
    turnIndex: loops.turnIndex[row],
    startEvent: loops.startEvent[row] >= 0 ? events[loops.startEvent[row]].name : null,
    turnEvent: loops.turnEvent[row] >= 0 ? events[loops.turnEvent[row]].name : null,
  }));
  let firstReversal = 0;
  for (let i = 0; i < loops.count.length; i++) if (loops.reversalsToFailure[i] <= 1) firstReversal++;
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
  return {
    ...reportHead(job, events, gate, { perRepeat: damage, firstPass: firstDamage, reusedFirstPass: tracked.reusedFirstPass }),
    loops,
    worstLoops,
    timeline: { binSize, samples: totalSamples, damage: timeline },
    events: eventDamage,
    gate: { range: gate, removedReversals: removed },
    warnings,
  };
}

function clampIndex(a: Float64Array): Float64Array {
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i] < 0 ? 0 : a[i];
  return out;
}

function echoInputs(job: ResolvedJob, events: readonly ReportEvent[], gate: number): Record<string, unknown> {
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
    events: events.map((e) => ({ name: e.name, samples: e.samples, repeats: e.repeats, duration: e.duration ?? null })),
  };
}
