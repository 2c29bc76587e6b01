import { damageInto, residueHalfCycles } from '@loopwise/miner';
import type { LoopColumns, ReversalTable } from '@loopwise/notch';
import { evaluateLoops, type LoopLives } from './evaluateLoops';
import { strainLifeMaterial, type ResolvedJob } from './LifeJob';
import type { LifeLoopColumns } from './LifeReport';
import { eventOfSample } from './schedule';
import type { RowRange } from './trackHistory';

/** Report columns of n rows: the given columns, and new zeroed columns for the rest. */
export function emptyColumns(n: number, given: Partial<LifeLoopColumns> = {}): LifeLoopColumns {
  const f = (k: keyof LifeLoopColumns) => given[k] ?? new Float64Array(n);
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

/**
 * The report's loop columns for rows `range` of the tracked loops and their lives. With `own`
 * the local and life columns are views of `all` and `lives` (no copy: the caller hands both
 * over to this one report); otherwise copies. Index and event columns are always new.
 */
export function loopColumnsOf(all: LoopColumns, lives: LoopLives, range: RowRange, starts: readonly number[], own: boolean): LifeLoopColumns {
  const { from, to } = range;
  const n = to - from;
  const part = (a: Float64Array) => (own ? a.subarray(from, to) : a.slice(from, to));
  const c = emptyColumns(n, {
    stressMax: part(all.stressMax),
    stressMin: part(all.stressMin),
    strainMax: part(all.strainMax),
    strainMin: part(all.strainMin),
    parameter: part(lives.parameter),
    reversalsToFailure: part(lives.reversalsToFailure),
    cyclesToFailure: part(lives.cyclesToFailure),
    count: part(all.count),
    startIndex: all.startIndex.slice(from, to),
    turnIndex: all.turnIndex.slice(from, to),
    closeIndex: all.closeIndex.slice(from, to),
  });
  eventsInto(c.startIndex, c.startEvent, starts);
  eventsInto(c.turnIndex, c.turnEvent, starts);
  return c;
}

/** The event of every sample index (-1 for the initial state). */
export function eventsInto(index: Float64Array, out: Float64Array, starts: readonly number[]): void {
  if (starts.length === 1) {
    for (let i = 0; i < index.length; i++) out[i] = index[i] < 0 ? -1 : 0;
    return;
  }
  for (let i = 0; i < index.length; i++) out[i] = eventOfSample(starts, index[i]);
}

/**
 * Evaluated report columns of loops with their sample indices (drained tracker rows or residue
 * half cycles): events from `starts`, the damage parameter's value and life, and the damage of
 * each row with the job's cut-off (miner's damageInto). New columns.
 */
export function evaluatedColumns(cols: LoopColumns, job: ResolvedJob, starts: readonly number[]): LifeLoopColumns {
  const n = cols.count.length;
  const c = emptyColumns(n, {
    stressMax: cols.stressMax.slice(),
    stressMin: cols.stressMin.slice(),
    strainMax: cols.strainMax.slice(),
    strainMin: cols.strainMin.slice(),
    count: cols.count.slice(),
    startIndex: cols.startIndex.slice(),
    turnIndex: cols.turnIndex.slice(),
    closeIndex: cols.closeIndex.slice(),
  });
  if (n === 0) return c;
  eventsInto(c.startIndex, c.startEvent, starts);
  eventsInto(c.turnIndex, c.turnEvent, starts);
  const lives = evaluateLoops(c, strainLifeMaterial(job), job.meanStress, job.walkerGamma);
  c.parameter.set(lives.parameter);
  c.reversalsToFailure.set(lives.reversalsToFailure);
  c.cyclesToFailure.set(lives.cyclesToFailure);
  damageInto(c.count, c.cyclesToFailure, c.damage, job.cutoffCycles === undefined ? {} : { cutoff: { cycles: job.cutoffCycles } });
  return c;
}

/** The residue of a one-off history as evaluated half cycles (miner's residueHalfCycles, ASTM E1049-85 5.4.4). */
export function residueHalfColumns(residue: ReversalTable, job: ResolvedJob, starts: readonly number[]): LifeLoopColumns {
  return evaluatedColumns(residueHalfCycles(residue.columns()), job, starts);
}

/**
 * The residue of a one-off history as half cycles between consecutive open reversal points
 * (miner's residueHalfCycles, ASTM E1049-85 5.4.4), evaluated, appended to `c` (new columns).
 */
export function withResidueHalves(c: LifeLoopColumns, residue: ReversalTable, job: ResolvedJob, starts: readonly number[]): LifeLoopColumns {
  const h = residueHalfColumns(residue, job, starts);
  const m = h.count.length;
  if (m === 0) return c;
  const out = emptyColumns(0);
  for (const k of Object.keys(c) as (keyof LifeLoopColumns)[]) {
    const joined = new Float64Array(c[k].length + m);
    joined.set(c[k]);
    joined.set(h[k], c[k].length);
    out[k] = joined;
  }
  return out;
}
