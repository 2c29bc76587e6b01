import { LoopwiseError } from '@loopwise/base';
import { CutoffTally, type CutoffReport } from '@loopwise/miner';
import { branchResponse } from '@loopwise/notch';
import { evaluateLoops } from './evaluateLoops';
import { strainLifeMaterial, type ResolvedJob } from './LifeJob';
import type { LifeLoopColumns, LifeWarning } from './LifeReport';
import { trackerOptionsOf } from './trackHistory';

/** What the warnings are made from (batch and streaming alike). */
export interface WarningFacts {
  damage: number;
  gate: number;
  removed: number;
  /** Upper bound of the damage the gate removed. */
  gateBound: number;
  cutoff: CutoffReport | null;
  beyondStrainLimit: boolean;
  firstBeyondIndex: number;
  firstReversal: number;
}

/** The warnings of a report, each with a stable code, a sentence and the numbers behind it. */
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
    const w = cutoffWarning(job.cutoffCycles, f.cutoff);
    if (w !== null) out.push(w);
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
  for (const w of job.material?.warnings ?? []) {
    out.push({ code: 'incompatible-material', message: w.message, details: { field: w.field } });
  }
  return out;
}

/**
 * An upper bound of the damage the gate removed: every removed reversal pair is at most a loop
 * of the gate's range. The gate keeps every move of at least its range, so a removed point lies
 * within the gate of a kept point (or of the initial value): its magnitude is at most `largest`
 * (the largest kept |value|, offset applied, or |initial|) plus the gate, and its local stress
 * at most the first-loading stress there (the cyclic-curve envelope bounds every local stress of
 * the path). The worst place for a removed loop is hanging from that envelope point on a Masing
 * branch (highest σmax and mean stress). The bound is that loop's damage times (removed + 1) / 2:
 * half the removed reversals, plus one more cycle for the ends of the history (a removed last
 * reversal, or the seam of a repeating block).
 */
export function gateBoundAt(job: ResolvedJob, largest: number, gate: number, removed: number): number {
  if (removed === 0) return 0;
  const options = trackerOptionsOf(job);
  const top = largest + gate;
  let peak: { stress: number; strain: number };
  let low: { stress: number; strain: number };
  try {
    peak = branchResponse(options, null, top);
    // only the history difference from the origin enters a branch
    low = branchResponse(options, { value: top, stress: peak.stress, strain: peak.strain }, top - gate);
  } catch (err) {
    // the envelope point's local strain overflows a double (loads near the largest double): no
    // finite bound exists, and the error would name the bound's own inputs, not the history's
    if (err instanceof LoopwiseError && (err.code === 'invalid-option' || err.code === 'invalid-argument')) return Infinity;
    throw err;
  }
  const loop = {
    stressMax: Float64Array.of(peak.stress),
    stressMin: Float64Array.of(low.stress),
    strainMax: Float64Array.of(peak.strain),
    strainMin: Float64Array.of(low.strain),
  };
  const lives = evaluateLoops(loop, strainLifeMaterial(job), job.meanStress, job.walkerGamma);
  const nf = lives.cyclesToFailure[0];
  const limit = job.cutoffCycles ?? Infinity;
  const perLoop = nf > limit || nf === Infinity ? 0 : 1 / nf;
  return ((removed + 1) / 2) * perLoop;
}


/** The cut-off warning, when the cut-off removed loops or loops near it carry more than a tenth of the damage (both routes). */
export function cutoffWarning(cutoffCycles: number, r: CutoffReport): LifeWarning | null {
  if (!(r.removedCount > 0 || r.nearCutoffShare > 0.1)) return null;
  return {
    code: 'cutoff-share',
    message: `the cut-off at ${cutoffCycles} cycles removed ${r.removedCount} loops (${r.removedDamage.toPrecision(3)} damage without the cut-off); loops within a factor ${r.nearFactor} of it carry ${(100 * r.nearCutoffShare).toPrecision(3)} % of the damage, so the result depends on the cut-off`,
    details: { cutoffCycles, removedLoops: r.removedCount, removedDamage: r.removedDamage, nearCutoffShare: r.nearCutoffShare },
  };
}

/** What the cut-off removed from the report's loops, and the share of damage near it (miner's tally). */
export function cutoffReport(l: LifeLoopColumns, cutoffCycles: number): CutoffReport {
  return new CutoffTally({ cycles: cutoffCycles }).addColumns(l).value();
}
